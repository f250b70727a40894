/**
 * A stilling-basin screening fed by a tailwater check: type both blocks into a new case's
 * editor and see, in the preview, the families table (fits / outside), the warning that
 * names the flows whose tailwater is short, and the basin outline with its shortfall flag.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createCaseFromForm, launchBrowser, screenshotPath, signedInPage } from '../helpers/browser';

let browser: Browser;
let page: Page;
const consoleErrors: string[] = [];

const BODY = [
  '## Basin below the Corrowick chute (invented demo data)',
  '',
  'The tailwater rating is the design estimate; the basin is screened over the flow range.',
  '',
  '```tailwater check',
  'b = 25 m',
  'Q = 40 to 280 m3/s step 40',
  'toe = head',
  'H = 12.0 m',
  'rating:',
  '  Q m3/s | TW m',
  '  0 | 1.0',
  '  300 | 6.0',
  '```',
  '',
  '```basin pick',
  'Q = check.Q',
  'b = check.b',
  'y1 = check.y1',
  'TW = check.TW',
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

describe('a basin block reading a tailwater check', () => {
  it('shows the families table, the short-tailwater warning and the basin outline in the preview', async () => {
    await createCaseFromForm(page, { title: 'Corrowick chute, stilling basin screening', structureType: 'spillway-basin', sectionShape: 'rectangular' });
    const editor = page.locator('[data-testid=case-editor] textarea.w-md-editor-text-input');
    await editor.fill(BODY);
    const preview = page.locator('[data-testid=case-preview]');
    const chart = preview.locator('figure[data-chart=basin]');
    await chart.locator('svg').waitFor({ timeout: 15_000 });

    const text = (await preview.textContent()) ?? '';
    expect(text).toContain('Basin families (5)');
    expect(text).toContain('USBR III');
    expect(await preview.locator('td.text-sound:has-text("fits")').count()).toBeGreaterThan(0);
    expect(await preview.locator('td.text-caution:has-text("outside")').count()).toBeGreaterThan(0);
    const warning = preview.locator('[data-code=tailwater-too-low]');
    expect(await warning.textContent()).toMatch(/Q = 80 m³\/s \(TW 2\.33 m, needs 3\.05 m, short by 0\.713 m\)/);
    expect(await chart.textContent()).toContain('Tailwater short by 0.713 m at Q = 80.0 m³/s: the jump sweeps out');
    expect(await chart.locator('figcaption').textContent()).toContain('Basin outline to scale for the design flow (Q = 280 m³/s)');
    expect(await preview.locator('.notice-fault, [data-status=error]').count()).toBe(0);

    await page.waitForSelector('[data-testid=save-status][data-state=saved]', { timeout: 15_000 });
    await chart.scrollIntoViewIfNeeded();
    await chart.screenshot({ path: screenshotPath('stilling-basin-chart') });
    const panel = preview.locator('section[data-block-index="1"]');
    await panel.screenshot({ path: screenshotPath('stilling-basin-preview') });
    expect(consoleErrors).toEqual([]);
  });
});
