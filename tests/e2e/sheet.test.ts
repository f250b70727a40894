import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl } from '../helpers/app';
import { launchBrowser, screenshotPath, signInAs } from '../helpers/browser';

let browser: Browser;
let page: Page;
const consoleErrors: string[] = [];

beforeAll(async () => {
  browser = await launchBrowser();
  const context = await browser.newContext({ viewport: { width: 1100, height: 1400 } });
  page = await context.newPage();
  page.on('console', (m) => {
    if (m.type() === 'error') consoleErrors.push(m.text());
  });
  await signInAs(page, 'tomas.ilvar@kestrelweir.example');
});

afterAll(async () => {
  await browser?.close();
});

describe('the calculation sheet', () => {
  it('opens from the reading page as a paper sheet with a title block, tables and charts, and no navigation', async () => {
    await page.click('[data-testid=recent-cases] a:has-text("Harrowgate Reservoir")');
    await page.waitForSelector('[data-testid=sheet-links]');
    await Promise.all([page.waitForURL(/\/sheet\?/), page.click('[data-testid=sheet-links] a:has-text("A4")')]);
    await page.waitForSelector('[data-testid=title-block]');
    await page.waitForSelector('[data-testid=calculation-sheet] svg[role=img]');
    expect(await page.textContent('[data-testid=title-block]')).toMatch(/Kestrel Weir[\s\S]*Checked by[\s\S]*Approved by/);
    expect(await page.locator('[data-testid=calculation-sheet] table').count()).toBeGreaterThan(2);
    expect(await page.locator('header.no-print, nav:not(.sheet-toolbar)').count()).toBe(0);
    expect(await page.textContent('[data-testid=methods-used]')).toMatch(/Hydraulic jump|hydraulic jump/i);
    await page.screenshot({ path: screenshotPath('calculation-sheet'), fullPage: true });
    // As printed: the toolbar goes, the sheet fills the page.
    await page.emulateMedia({ media: 'print' });
    expect(await page.locator('.sheet-toolbar').isVisible()).toBe(false);
    await page.screenshot({ path: screenshotPath('calculation-sheet-print'), fullPage: false });
    await page.emulateMedia({ media: 'screen' });
    expect(consoleErrors, consoleErrors.join("\n")).toEqual([]);
  });

  it('lays out on Letter too', async () => {
    await page.click('.sheet-toolbar a:has-text("Letter")');
    await page.waitForURL(/paper=letter/);
    expect(await page.getAttribute('html', 'data-paper')).toBe('letter');
    await page.screenshot({ path: screenshotPath('calculation-sheet-letter'), fullPage: false });
  });

  it('marks a draft as DRAFT, not approved, across the page', async () => {
    const body = 'A draft check.\n\n```jump basin\nb = 12 m\nQ = 85 m3/s\ny1 = 0.53 m\n```\n';
    const created = await page.evaluate(async (text) => {
      const r = await fetch('/api/v1/cases', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ title: 'Draft sheet check', structureType: 'other', sectionShape: 'rectangular', projectReference: 'KWC-0001', body: text }),
      });
      return { status: r.status, json: await r.json() };
    }, body);
    expect(created.status).toBe(201);
    await page.goto(`${appUrl()}/cases/${created.json.case.id}/sheet`);
    await page.waitForSelector('[data-testid=title-block]');
    expect((await page.textContent('[data-testid=sheet-status]'))?.trim()).toBe('DRAFT');
    expect(await page.textContent('[data-testid=approved-by]')).toBe('not approved');
    expect(await page.locator('.sheet-watermark').isVisible()).toBe(true);
    await page.emulateMedia({ media: 'print' });
    await page.screenshot({ path: screenshotPath('calculation-sheet-draft-print'), fullPage: false });
    await page.emulateMedia({ media: 'screen' });
  });
});
