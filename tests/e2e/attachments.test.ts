/** Attaching files in the editor and seeing them on the reading page. */
import sharp from 'sharp';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl } from '../helpers/app';
import { createCaseFromForm, launchBrowser, screenshotPath, signedInPage } from '../helpers/browser';

let browser: Browser;
let page: Page;
const consoleErrors: string[] = [];
let caseUrl = '';

beforeAll(async () => {
  browser = await launchBrowser();
  // A refused upload answers 415: the browser logs the failed request, which is expected here.
  page = await signedInPage(browser, 'ada.quillon@brightwater.example', consoleErrors, { console: { ignore: /status of 415/ } });
});

afterAll(async () => {
  await browser?.close();
});

describe('attachments', () => {
  it('uploads a photo with the picker and a CSV by drag and drop, refuses a disguised file, captions', async () => {
    caseUrl = await createCaseFromForm(page, { title: 'Ashcombe weir apron, site photos and levels', structureType: 'spillway-basin', sectionShape: 'rectangular' });
    await page.waitForSelector('[data-testid=attachments-empty]');
    await page.locator('[data-testid=attachments-panel]').screenshot({ path: screenshotPath('attachments-empty') });

    const photo = await sharp({ create: { width: 1600, height: 1200, channels: 3, background: { r: 96, g: 128, b: 150 } } })
      .composite([{ input: Buffer.from('<svg width="1600" height="1200"><rect x="0" y="700" width="1600" height="500" fill="#4a6b3a"/><rect x="500" y="520" width="600" height="200" fill="#c9c2b0"/></svg>'), top: 0, left: 0 }])
      .jpeg()
      .toBuffer();
    await page.setInputFiles('#attachments-input', [
      { name: 'apron-looking-downstream.jpg', mimeType: 'image/jpeg', buffer: photo },
      { name: 'setup.png', mimeType: 'image/png', buffer: Buffer.concat([Buffer.from('MZ'), Buffer.alloc(300)]) },
    ]);
    await page.waitForSelector('[data-testid=attachment-row]');
    await page.waitForSelector('[data-testid=upload-row] [role=alert]');
    expect(await page.textContent('[data-testid=upload-row] [role=alert]')).toMatch(/setup\.png is not a PNG image/);

    // Drop a CSV on the drop zone, as a file dragged from the desktop would arrive.
    await page.evaluate(() => {
      const data = new DataTransfer();
      data.items.add(new File(['chainage_m,bed_level_m\n0,101.20\n25,100.85\n50,100.40\n'], 'apron-levels.csv', { type: 'text/csv' }));
      document.querySelector('[data-testid=attachments-drop]')!.dispatchEvent(new DragEvent('drop', { dataTransfer: data, bubbles: true, cancelable: true }));
    });
    await page.waitForFunction(() => document.querySelectorAll('[data-testid=attachment-row]').length === 2);
    const caption = page.locator('[data-testid=attachment-row]').first().locator('input');
    await caption.fill('Apron looking downstream, low flow');
    await caption.press('Enter');
    await page.waitForFunction(() => document.querySelector('[data-testid=attachments-status]')?.textContent?.includes('Caption'));
    await page.locator('[data-testid=attachments-panel]').screenshot({ path: screenshotPath('attachments-editor') });
  });

  it('shows the photo in the gallery and the CSV in the list on the reading page', async () => {
    await page.goto(caseUrl);
    await page.waitForSelector('[data-testid=attachment-gallery] img');
    await page.waitForFunction(() => (document.querySelector('[data-testid=attachment-gallery] img') as HTMLImageElement | null)?.complete);
    const gallery = page.locator('[data-testid=attachment-gallery]');
    expect(await gallery.textContent()).toContain('Apron looking downstream, low flow');
    expect(await gallery.textContent()).toContain('apron-levels.csv');
    const natural = await page.evaluate(() => (document.querySelector('[data-testid=attachment-gallery] img') as HTMLImageElement).naturalWidth);
    expect(natural).toBe(320);
    const href = await gallery.locator('a:has-text("apron-levels.csv")').getAttribute('href');
    const response = await page.request.get(`${appUrl()}${href}`);
    expect(response.status()).toBe(200);
    expect(await response.text()).toContain('25,100.85');
    await gallery.screenshot({ path: screenshotPath('attachments-reading') });
    expect(consoleErrors).toEqual([]);
  });
});
