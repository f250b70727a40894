import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl } from '../helpers/app';
import { launchBrowser, screenshotPath, signInAs } from '../helpers/browser';

// Vectors adapted from the OWASP XSS Filter Evasion Cheat Sheet; each would set
// window.__xss or open a dialog if anything ran. The unit tests hold the full list.
const XSS_BODY = [
  '## Inert, hopefully',
  '<script>window.__xss = 1</script>',
  '<img src=x onerror="window.__xss = 2">',
  '<svg onload="window.__xss = 3"></svg>',
  '[click](javascript:window.__xss=4)',
  '<a href="jav&#x09;ascript:window.__xss=5">tab</a>',
  '<iframe src="javascript:window.__xss=6"></iframe>',
  '<math><mtext><table><mglyph><style><img src=x onerror="window.__xss=7">',
  '![x" onerror="window.__xss=8](https://img.example/a.png)',
  '$\\href{javascript:window.__xss=9}{x}$',
  '',
  '```jump basin',
  'b = 12 m',
  'Q = 85 m3/s',
  'y1 = 0.62 m',
  '```',
].join('\n');

let browser: Browser;
let context: BrowserContext;
let page: Page;
const consoleErrors: string[] = [];
const dialogs: string[] = [];

beforeAll(async () => {
  browser = await launchBrowser();
  context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  page = await context.newPage();
  page.on('console', (m) => {
    if (m.type() === 'error') consoleErrors.push(`${page.url()}: ${m.text()}`);
  });
  page.on('pageerror', (e) => consoleErrors.push(`${page.url()}: ${e.message}`));
  page.on('dialog', async (d) => {
    dialogs.push(d.message());
    await d.dismiss();
  });
  await signInAs(page, 'tomas.ilvar@kestrelweir.example');
});

afterAll(async () => {
  await browser?.close();
});

describe('reading a case', () => {
  it('shows a demo case as a document with results, charts and no console errors', async () => {
    await page.click('[data-testid=recent-cases] a:has-text("Harrowgate Reservoir")');
    await page.waitForSelector('[data-testid=case-reading] svg[role=img]');
    expect(await page.locator('[data-testid=case-reading] table').count()).toBeGreaterThan(2);
    expect(await page.textContent('[data-testid=key-figures]')).toMatch(/\d/);
    await page.screenshot({ path: screenshotPath('case-reading'), fullPage: true });
    expect(consoleErrors).toEqual([]);
  });

  it('lets a reader try other inputs without saving', async () => {
    const island = page.locator('[data-testid=case-reading] .not-prose').first();
    await island.scrollIntoViewIfNeeded();
    await expect(island.textContent()).resolves.toBeTruthy();
  });

  it('keeps XSS vectors in a case body inert in the real browser', async () => {
    const created = await page.evaluate(async (body) => {
      const r = await fetch('/api/v1/cases', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ title: 'Inert markup check', structureType: 'other', sectionShape: 'rectangular', body }),
      });
      return { status: r.status, json: await r.json() };
    }, XSS_BODY);
    expect(created.status).toBe(201);
    await page.goto(`${appUrl()}/cases/${created.json.case.id}`);
    await page.waitForSelector('[data-testid=case-reading] table');
    await page.waitForTimeout(300);
    expect(await page.evaluate(() => (window as unknown as { __xss?: number }).__xss)).toBeUndefined();
    expect(dialogs).toEqual([]);
    // Astro's own island-loader scripts live in the article too; none may carry the author's text.
    expect(await page.locator('[data-testid=case-reading] iframe, [data-testid=case-reading] object, [data-testid=case-reading] embed').count()).toBe(0);
    const scripts = await page.locator('[data-testid=case-reading] script').allTextContents();
    expect(scripts.filter((s) => s.includes('__xss'))).toEqual([]);
    const handlers = await page.evaluate(() =>
      [...document.querySelectorAll('[data-testid=case-reading] *')].flatMap((el) => [...el.attributes].filter((a) => /^on/i.test(a.name)).map((a) => a.name)),
    );
    expect(handlers).toEqual([]);
    // Clicking the neutralised javascript: link does nothing either.
    const link = page.locator('[data-testid=case-reading] a', { hasText: 'click' });
    if (await link.count()) await link.first().click();
    expect(await page.evaluate(() => (window as unknown as { __xss?: number }).__xss)).toBeUndefined();
  });
});

describe('saving from two tabs', () => {
  it('shows both versions instead of overwriting when another tab saved first', async () => {
    const created = await page.evaluate(async () => {
      const r = await fetch('/api/v1/cases', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ title: 'Two tabs', structureType: 'other', sectionShape: 'rectangular', body: 'First text.' }),
      });
      return (await r.json()).case.id as string;
    });
    const first = page;
    const second = await context.newPage();
    await first.goto(`${appUrl()}/cases/${created}/edit`);
    await second.goto(`${appUrl()}/cases/${created}/edit`);
    const text = (p: Page) => p.locator('[data-testid=case-editor] textarea.w-md-editor-text-input');
    await text(first).fill('Saved from the first tab.');
    await first.waitForSelector('[data-testid=save-status][data-state=saved]:has-text("revision 2")', { timeout: 15_000 });
    await text(second).fill('Typed in the second tab.');
    await second.waitForSelector('[data-testid=conflict-panel]', { timeout: 15_000 });
    const panel = await second.textContent('[data-testid=conflict-panel]');
    expect(panel).toContain('Saved from the first tab.');
    expect(panel).toContain('Typed in the second tab.');
    await second.click('button:has-text("Keep mine")');
    await second.waitForSelector('[data-testid=save-status][data-state=saved]:has-text("revision 3")', { timeout: 15_000 });
    await second.screenshot({ path: screenshotPath('case-conflict-resolved') });
    await second.close();
  });
});
