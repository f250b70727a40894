/** Debian's headless Chromium through playwright-core (never a downloaded browser). */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../../src/db/seed';
import { appUrl } from './app';

/** Where screenshots and other browser artefacts are written. */
export const testOutputDir = path.resolve('test-results', 'e2e');

export async function launchBrowser(): Promise<Browser> {
  mkdirSync(testOutputDir, { recursive: true });
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

/** A path for a named screenshot under the test output folder. */
export const screenshotPath = (name: string) => path.join(testOutputDir, `${name}.png`);

/** Signs `page` in through the real sign-in form and waits for the casebook home. */
export async function signInAs(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(`${appUrl()}/signin`);
  await page.fill('#email', email);
  await page.fill('#password', password);
  await Promise.all([page.waitForURL(`${appUrl()}/`), page.keyboard.press('Enter')]);
}

/**
 * A new browser context (1400 × 1000) signed in as `email`, as a colleague at another desk;
 * uncaught page errors are appended to `errors`, and with `console` also the console's
 * errors (but those matching `console.ignore`). Closing the browser closes it.
 */
export async function signedInPage(browser: Browser, email: string, errors: string[], options: { console?: { ignore?: RegExp } } = {}): Promise<Page> {
  const page = await (await browser.newContext({ viewport: { width: 1400, height: 1000 } })).newPage();
  if (options.console) {
    const ignore = options.console.ignore;
    page.on('console', (m) => {
      if (m.type() === 'error' && !(ignore && ignore.test(m.text()))) errors.push(`${page.url()}: ${m.text()}`);
    });
  }
  page.on('pageerror', (e) => errors.push(`${page.url()}: ${e.message}`));
  await signInAs(page, email);
  return page;
}

/**
 * Creates a case from the home page's "New case" form as a user would, and waits for its
 * editor; returns the case page's URL (the editor's without `/edit`).
 */
export async function createCaseFromForm(page: Page, c: { title: string; structureType: string; sectionShape: string }): Promise<string> {
  await page.click('text=New case');
  await page.fill('#title', c.title);
  await page.selectOption('#structureType', c.structureType);
  await page.selectOption('#sectionShape', c.sectionShape);
  await Promise.all([page.waitForURL(/\/cases\/[^/]+\/edit$/), page.click('button:has-text("Create and open the editor")')]);
  return page.url().replace(/\/edit$/, '');
}
