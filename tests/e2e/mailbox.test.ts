import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../src/db/seed';
import { appUrl } from '../helpers/app';
import { launchBrowser, screenshotPath } from '../helpers/browser';
import { appMailboxUrl, waitForMail } from '../helpers/mailbox';

const EMAIL = 'ada.quillon@brightwater.example';
let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await launchBrowser();
  page = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
});

afterAll(async () => {
  await browser?.close();
});

describe('forgotten password and the development mailbox', () => {
  let resetLink = '';

  it('asks for a reset link from the sign-in page with the keyboard', async () => {
    await page.goto(`${appUrl()}/signin`);
    await Promise.all([page.waitForURL(`${appUrl()}/forgot-password`), page.click('text=Forgotten your password?')]);
    await page.fill('#email', EMAIL);
    await Promise.all([page.waitForLoadState('load'), page.keyboard.press('Enter')]);
    await page.waitForSelector('[data-testid=reset-requested]');
    await page.screenshot({ path: screenshotPath('forgot-password-sent'), fullPage: true });
    const [message] = await waitForMail(appMailboxUrl(), EMAIL);
    resetLink = /(http:\/\/\S+\/reset-password\?token=[A-Za-z0-9_-]+)/.exec(message!.text)![1]!;
  });

  it('shows the message in the mailbox, with its HTML in a sandboxed frame', async () => {
    await page.goto(`${appUrl()}/dev/mailbox`);
    await page.fill('#email', EMAIL);
    await page.fill('#password', DEMO_PASSWORD);
    await Promise.all([page.waitForURL(`${appUrl()}/dev/mailbox`), page.keyboard.press('Enter')]);
    await page.waitForSelector('[data-testid=mailbox-list]');
    await Promise.all([page.waitForLoadState('load'), page.locator('[data-testid=mailbox-list] a', { hasText: 'Reset your Sequent password' }).first().click()]);
    await page.waitForSelector('[data-testid=mailbox-text]');
    expect(await page.textContent('[data-testid=mailbox-text]')).toContain('/reset-password?token=');
    const frame = page.frameLocator('iframe[sandbox]');
    await frame.locator('text=Choose a new password').first().waitFor();
    expect(await page.getAttribute('iframe', 'sandbox')).toBe('');
    await page.screenshot({ path: screenshotPath('dev-mailbox'), fullPage: true });
  });

  it('opens the reset page from the link (not submitted: the demo password stays)', async () => {
    await page.goto(resetLink);
    await page.waitForSelector('#password');
    await page.fill('#password', 'a-new-password-2031');
    await page.fill('#confirm', 'not-the-same-2031');
    await Promise.all([page.waitForLoadState('load'), page.keyboard.press('Enter')]);
    await page.waitForSelector('#confirm-error');
    expect(await page.textContent('#confirm-error')).toContain('The two passwords differ.');
    await page.screenshot({ path: screenshotPath('reset-password'), fullPage: true });
  });
});
