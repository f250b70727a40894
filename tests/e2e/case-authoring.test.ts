import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl } from '../helpers/app';
import { createCaseFromForm, launchBrowser, screenshotPath, signInAs } from '../helpers/browser';

let browser: Browser;
let page: Page;
const consoleErrors: string[] = [];
let caseUrl = '';

beforeAll(async () => {
  browser = await launchBrowser();
  page = await (await browser.newContext({ viewport: { width: 1400, height: 900 } })).newPage();
  page.on('console', (m) => {
    if (m.type() === 'error') consoleErrors.push(`${page.url()}: ${m.text()}`);
  });
  page.on('pageerror', (e) => consoleErrors.push(`${page.url()}: ${e.message}`));
  await signInAs(page, 'priya.odunya@kestrelweir.example');
});

afterAll(async () => {
  await browser?.close();
});

const editorText = () => page.locator('[data-testid=case-editor] textarea.w-md-editor-text-input');

describe('writing a case', () => {
  it('creates a case from the skeleton and opens the editor', async () => {
    caseUrl = await createCaseFromForm(page, { title: 'Brackenford culvert outlet, 1 in 100 year flow', structureType: 'culvert-outlet', sectionShape: 'trapezoidal' });
    await page.waitForSelector('[data-testid=case-preview] table');
    expect(await page.textContent('[data-testid=case-preview]')).toContain('Sequent depth');
  });

  it('inserts a block from the menu and sees its results as it is typed', async () => {
    await editorText().click();
    await page.keyboard.press('Control+End');
    await page.selectOption('#insert-block', 'toe');
    await page.waitForFunction(() => document.querySelector('[data-testid=case-preview]')?.textContent?.includes('Toe depth'));
    // Change the head of the toe block and watch the preview follow.
    const before = await page.textContent('[data-testid=case-preview]');
    const text = await editorText().inputValue();
    await editorText().fill(text.replace('H = 9.5 m', 'H = 14 m'));
    await page.waitForFunction((old) => document.querySelector('[data-testid=case-preview]')?.textContent !== old, before);
    expect(await editorText().inputValue()).toContain('H = 14 m');
  });

  it('shows a line-numbered message for a bad line without breaking the preview', async () => {
    const text = await editorText().inputValue();
    await editorText().fill(text.replace('Q = 85 m3/s', 'Q = 85 furlongs'));
    await page.waitForFunction(() => /line \d+/i.test(document.querySelector('[data-testid=case-preview]')?.textContent ?? ''));
    await editorText().fill(text);
  });

  it('autosaves, and the text is there after a reload', async () => {
    await page.waitForSelector('[data-testid=save-status][data-state=saved]', { timeout: 15_000 });
    await page.screenshot({ path: screenshotPath('case-editor'), fullPage: false });
    await page.reload();
    await page.waitForSelector('[data-testid=case-preview] table');
    expect(await editorText().inputValue()).toContain('H = 14 m');
  });

  it('finds the case on the home page with its key figures', async () => {
    await page.goto(`${appUrl()}/`);
    const row = page.locator('[data-testid=my-drafts] tr', { hasText: 'Brackenford culvert outlet' });
    await expect(row.count()).resolves.toBe(1);
    expect(await row.textContent()).toMatch(/Culvert outlet/);
  });

  it('reads the case as a document with results tables and the caution', async () => {
    await page.goto(caseUrl);
    await page.waitForSelector('article table');
    expect(await page.textContent('body')).toContain('licensed engineer');
    expect(consoleErrors).toEqual([]);
  });
});
