/**
 * Inviting a colleague in the browser and joining from the link. Uses a firm of its own
 * (not a demo firm), so the other e2e files' member counts stay as seeded.
 */
import { randomUUID } from 'node:crypto';
import { desc, eq } from 'drizzle-orm';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '../../src/db/client';
import { mailOutbox } from '../../src/db/schema';
import { appUrl } from '../helpers/app';
import { launchBrowser, screenshotPath } from '../helpers/browser';
import { makeFirm, TEST_PASSWORD, type TestFirm } from '../helpers/firms';

let browser: Browser;
let admin: Page;
let firm: TestFirm;
const invitee = `halvard.steen.${randomUUID().slice(0, 6)}@firm.example`;

beforeAll(async () => {
  firm = await makeFirm({ admin: 'admin' });
  browser = await launchBrowser();
  admin = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
  await admin.goto(`${appUrl()}/firm/members`);
  await admin.fill('#email', firm.people.admin!.email);
  await admin.fill('#password', TEST_PASSWORD);
  await Promise.all([admin.waitForURL(`${appUrl()}/firm/members`), admin.keyboard.press('Enter')]);
});

afterAll(async () => {
  await browser?.close();
});

describe('inviting a colleague by e-mail', () => {
  it('shows a field error for a bad address, then sends the invitation and lists it as pending', async () => {
    await admin.waitForSelector('[data-testid=invite-form]');
    expect(await admin.textContent('[data-testid=no-invitations]')).toContain('No invitations');
    await admin.fill('#invite-email', 'halvard-at-nowhere');
    await Promise.all([admin.waitForLoadState('load'), admin.click('text=Send invitation')]);
    expect(await admin.textContent('#invite-email-error')).toContain('Enter a valid e-mail address');

    await admin.fill('#invite-email', invitee);
    await admin.selectOption('#invite-role', 'reviewer');
    await admin.focus('#invite-email');
    await Promise.all([admin.waitForLoadState('load'), admin.keyboard.press('Enter')]);
    expect(await admin.textContent('[role=status]')).toContain(`Invitation sent to ${invitee}`);
    const rows = await admin.locator('[data-testid=invitations-table] tbody tr').allTextContents();
    expect(rows).toHaveLength(1);
    expect(rows[0]).toContain(invitee);
    expect(rows[0]).toContain('Reviewer');
    await admin.locator('[data-testid=invite-form]').scrollIntoViewIfNeeded();
    await admin.screenshot({ path: screenshotPath('invitations-members-page'), fullPage: true });
  });

  it('lets the colleague open the link in a fresh browser, choose a password and land signed in', async () => {
    const [mail] = await db().select().from(mailOutbox).where(eq(mailOutbox.toAddress, invitee)).orderBy(desc(mailOutbox.id)).limit(1);
    const link = /https?:\/\/\S+\/join\?token=[A-Za-z0-9_-]{43}/.exec(mail!.textBody)?.[0];
    expect(link).toBeTruthy();

    const context = await browser.newContext({ viewport: { width: 1100, height: 860 } });
    const page = await context.newPage();
    await page.goto(link!);
    await page.waitForSelector('[data-testid=join-form]');
    expect(await page.textContent('h1')).toContain(firm.firm.name);
    expect(await page.inputValue('#email')).toBe(invitee);

    await page.fill('#name', 'Halvard Steen');
    await page.fill('#password', 'tailwater-rating-8');
    await page.fill('#passwordRepeat', 'tailwater-rating-9');
    await Promise.all([page.waitForLoadState('load'), page.click('button[type=submit]')]);
    expect(await page.textContent('#passwordRepeat-error')).toContain('The two passwords differ');
    await page.screenshot({ path: screenshotPath('invitations-join-page'), fullPage: true });

    await page.fill('#password', 'tailwater-rating-8');
    await page.fill('#passwordRepeat', 'tailwater-rating-8');
    await Promise.all([page.waitForURL(`${appUrl()}/`), page.keyboard.press('Enter')]);
    const signedIn = await page.textContent('[data-testid=signed-in-as]');
    expect(signedIn).toContain('Halvard Steen');
    expect(signedIn).toContain(`${firm.firm.name} · Reviewer`);

    // The link is spent: opening it again says so.
    await page.goto(link!);
    await page.waitForSelector('[data-testid=invitation-problem]');
    expect(await page.textContent('h1')).toContain('already been used');
    await page.screenshot({ path: screenshotPath('invitations-join-used'), fullPage: true });
    await context.close();

    await admin.reload();
    expect(await admin.locator('[data-testid=members-table] tbody tr').allTextContents()).toEqual(
      expect.arrayContaining([expect.stringContaining('Halvard Steen')]),
    );
    expect(await admin.locator('[data-testid=invitations-table]').count()).toBe(0);
  });
});
