import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../src/db/seed';
import { appUrl } from '../helpers/app';
import { launchBrowser, screenshotPath } from '../helpers/browser';

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
  await page.goto(`${appUrl()}/signin`);
  await page.fill('#email', 'tomas.ilvar@kestrelweir.example');
  await page.fill('#password', DEMO_PASSWORD);
  await Promise.all([page.waitForURL(`${appUrl()}/`), page.keyboard.press('Enter')]);
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
});
