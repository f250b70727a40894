import { existsSync, statSync } from 'node:fs';
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
  const context = await browser.newContext({ viewport: { width: 1280, height: 860 } });
  page = await context.newPage();
  page.on('console', (message) => {
    if (message.type() === 'error') consoleErrors.push(message.text());
  });
  page.on('pageerror', (error) => consoleErrors.push(error.message));
});

afterAll(async () => {
  await browser?.close();
});

describe('signing in through the real page', () => {
  it('shows the sign-in page to a signed-out visitor', async () => {
    await page.goto(`${appUrl()}/`);
    expect(new URL(page.url()).pathname).toBe('/signin');
    await expect(page.title()).resolves.toBe('Sign in · Sequent');
    await page.screenshot({ path: screenshotPath('signin'), fullPage: true });
  });

  it('explains a wrong password and keeps the e-mail typed', async () => {
    await page.fill('#email', 'tomas.ilvar@kestrelweir.example');
    await page.fill('#password', 'wrong-password');
    await page.keyboard.press('Enter');
    await page.waitForSelector('[role=alert]');
    expect(await page.textContent('[role=alert]')).toContain('do not match an account');
    expect(await page.inputValue('#email')).toBe('tomas.ilvar@kestrelweir.example');
    // The refused sign-in is answered 401 on purpose; Chromium logs that status, nothing else.
    expect(consoleErrors).toEqual([expect.stringContaining('status of 401')]);
    consoleErrors.length = 0;
  });

  it('signs an engineer in and shows the casebook home with their name and firm', async () => {
    await page.fill('#password', DEMO_PASSWORD);
    await Promise.all([page.waitForURL(`${appUrl()}/`), page.click('button[type=submit]')]);
    await page.waitForSelector('[data-testid=recent-cases]');
    const who = await page.textContent('[data-testid=signed-in-as]');
    expect(who).toContain('Tomas Ilvar');
    expect(who).toContain('Kestrel Weir Consulting · Engineer');
    expect(await page.textContent('h1')).toContain('Good to see you, Tomas.');
    // The reading face is the bundled Merriweather, not a fallback.
    expect(await page.evaluate(async () => (await document.fonts.ready, document.fonts.check('16px Merriweather')))).toBe(true);
    await page.screenshot({ path: screenshotPath('casebook-home'), fullPage: true });
    expect(existsSync(screenshotPath('casebook-home'))).toBe(true);
    expect(statSync(screenshotPath('casebook-home')).size).toBeGreaterThan(10_000);
  });

  it('shows the firm’s members read-only to an engineer', async () => {
    await page.click('text=Firm & people');
    await page.waitForSelector('[data-testid=members-table]');
    expect(await page.locator('[data-testid=members-table] tbody tr').count()).toBe(5);
    expect(await page.locator('select[name=role]').count()).toBe(0);
    await page.screenshot({ path: screenshotPath('members-engineer'), fullPage: true });
  });

  it('signs out back to the sign-in page', async () => {
    await Promise.all([page.waitForURL(/\/signin$/), page.click('text=Sign out')]);
    await page.goto(`${appUrl()}/firm/members`);
    expect(new URL(page.url()).pathname).toBe('/signin');
  });

  it('logged no console errors on any page', () => {
    expect(consoleErrors, consoleErrors.join('\n')).toEqual([]);
  });
});
