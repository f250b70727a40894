/**
 * A tailwater check driven by an uploaded rating: attach a site photo and a rating CSV to a
 * draft, name the CSV in a tailwater block, see the chart with the rating's points in the
 * preview and on the reading page, and open the print view.
 */
import sharp from 'sharp';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createCaseFromForm, launchBrowser, screenshotPath, signedInPage } from '../helpers/browser';

let browser: Browser;
let page: Page;
const consoleErrors: string[] = [];
let caseUrl = '';

const RATING = '# Tallow Beck below the Penhallow weir (invented demo data)\nQ (m3/s),stage (m AOD)\n5,40.95\n15,41.55\n30,42.10\n45,42.55\n60,42.95\n';
const BODY = [
  '## Tailwater over the flow range',
  '',
  'The rating is the attached gauge survey, as stage; the apron is at 40.00 m AOD.',
  '',
  '```tailwater penhallow',
  'b = 6 m',
  'Q = 10 to 60 m3/s step 10',
  'toe = depth',
  'y1 = 0.40 m',
  'rating = file "penhallow-rating.csv"',
  'apron = 40.00 m',
  '```',
  '',
].join('\n');

beforeAll(async () => {
  browser = await launchBrowser();
  page = await signedInPage(browser, 'ada.quillon@brightwater.example', consoleErrors, { console: {} });
});

afterAll(async () => {
  await browser?.close();
});

describe('a tailwater block reading an attached rating CSV', () => {
  it('uploads a photo and the rating, names the CSV in the block and shows the chart with its points', async () => {
    caseUrl = await createCaseFromForm(page, { title: 'Penhallow weir basin, tailwater from the gauge rating', structureType: 'spillway-basin', sectionShape: 'rectangular' });
    await page.waitForSelector('[data-testid=attachments-empty]');

    const photo = await sharp({ create: { width: 1200, height: 800, channels: 3, background: { r: 110, g: 130, b: 150 } } })
      .composite([{ input: Buffer.from('<svg width="1200" height="800"><rect x="0" y="520" width="1200" height="280" fill="#55704a"/><rect x="300" y="420" width="600" height="120" fill="#c8c0ac"/></svg>'), top: 0, left: 0 }])
      .jpeg()
      .toBuffer();
    await page.setInputFiles('#attachments-input', [
      { name: 'penhallow-weir-from-left-bank.jpg', mimeType: 'image/jpeg', buffer: photo },
      { name: 'penhallow-rating.csv', mimeType: 'text/csv', buffer: Buffer.from(RATING) },
    ]);
    await page.waitForFunction(() => document.querySelectorAll('[data-testid=attachment-row]').length === 2);

    const editor = page.locator('[data-testid=case-editor] textarea.w-md-editor-text-input');
    await editor.fill(BODY);
    // The preview reads the CSV the Files panel just stored: results, and the rating's points on the chart.
    const preview = page.locator('[data-testid=case-preview]');
    await preview.locator('svg text:has-text("rating points (penhallow-rating.csv)")').first().waitFor({ timeout: 15_000 });
    expect(await preview.textContent()).toContain('file penhallow-rating.csv, 5 rows');
    expect(await preview.locator('.notice-fault, [data-status=error]').count()).toBe(0);
    await page.waitForSelector('[data-testid=save-status][data-state=saved]', { timeout: 15_000 });
    await preview.screenshot({ path: screenshotPath('rating-file-preview') });
  });

  it('reads the same on the case page, and the print view has the chart and the attached files', async () => {
    await page.goto(caseUrl);
    await page.locator('main svg text:has-text("rating points (penhallow-rating.csv)")').first().waitFor();
    await page.goto(`${caseUrl}/sheet`);
    await page.locator('svg text:has-text("rating points (penhallow-rating.csv)")').first().waitFor();
    const sheet = (await page.textContent('body')) ?? '';
    expect(sheet).toContain('penhallow-rating.csv');
    expect(sheet).toContain('penhallow-weir-from-left-bank.jpg');
    expect(sheet).toContain('DRAFT');
    await page.screenshot({ path: screenshotPath('rating-file-sheet'), fullPage: true });
    expect(consoleErrors).toEqual([]);
  });
});
