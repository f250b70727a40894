import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../src/db/seed';
import { appUrl } from '../helpers/app';
import { launchBrowser, screenshotPath } from '../helpers/browser';

let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await launchBrowser();
  page = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
  await page.goto(`${appUrl()}/firm/members`);
  // Signed out: the sign-in page remembers where we were going.
  await page.fill('#email', 'rowan.fairlie@brightwater.example');
  await page.fill('#password', DEMO_PASSWORD);
  await Promise.all([page.waitForURL(`${appUrl()}/firm/members`), page.keyboard.press('Enter')]);
});

afterAll(async () => {
  await browser?.close();
});

describe('Firm & people as a firm admin', () => {
  it('lists only the admin’s own firm', async () => {
    const rows = await page.locator('[data-testid=members-table] tbody tr').allTextContents();
    expect(rows).toHaveLength(2);
    expect(rows.join(' ')).not.toContain('kestrelweir');
  });

  it('adds a colleague with the keyboard and shows them in the table', async () => {
    await page.fill('#add-name', 'Imre Vasko');
    await page.fill('#add-email', 'imre.vasko@brightwater.example');
    await page.selectOption('#add-role', 'reviewer');
    await page.fill('#add-password', 'temporary-pass-9');
    await Promise.all([page.waitForLoadState('load'), page.keyboard.press('Enter')]);
    expect(await page.textContent('[role=status]')).toContain('Imre Vasko was added');
    expect(await page.locator('[data-testid=members-table] tbody tr').count()).toBe(3);
  });

  it('refuses to demote the last admin with a clear message', async () => {
    const row = page.locator('tr', { hasText: 'Rowan Fairlie' });
    await row.locator('select').selectOption('engineer');
    await Promise.all([page.waitForLoadState('load'), row.locator('button').click()]);
    expect(await page.textContent('[role=status]')).toContain('A firm needs at least one admin');
    await page.screenshot({ path: screenshotPath('members-admin'), fullPage: true });
  });
});
