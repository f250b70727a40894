/**
 * The review loop in the browser, as two people at two desks: an engineer submits a case,
 * a reviewer comments on a block and returns it, the engineer fixes it and resubmits, the
 * reviewer approves, and the case reads as published with "checked by".
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl } from '../helpers/app';
import { launchBrowser, screenshotPath, signedInPage } from '../helpers/browser';

const BODY = `## Purpose

Plain basin below the Wrenmoor weir at the design flow.

\`\`\`jump basin
b = 14 m
Q = 96 m3/s
y1 = 0.62 m
\`\`\`
`;

let browser: Browser;
const errors: string[] = [];
let caseUrl = '';

const signedIn = (email: string) => signedInPage(browser, email, errors);

let engineer: Page;
let reviewer: Page;

beforeAll(async () => {
  browser = await launchBrowser();
  engineer = await signedIn('tomas.ilvar@kestrelweir.example');
  reviewer = await signedIn('helena.brandt@kestrelweir.example');
  const created = await engineer.request.post(`${appUrl()}/api/v1/cases`, {
    data: { title: 'Wrenmoor weir basin, design flow', structureType: 'weir-tailwater', sectionShape: 'rectangular', tags: ['basin'], body: BODY },
    headers: { origin: appUrl() },
  });
  expect(created.status()).toBe(201);
  caseUrl = `${appUrl()}/cases/${(await created.json()).case.id}`;
});

afterAll(async () => {
  await browser?.close();
});

const state = (page: Page) => page.getAttribute('[data-testid=review-panel]', 'data-state');

describe('the review queue', () => {
  it('lists the seeded cases waiting for the reviewer, longest wait first', async () => {
    await reviewer.goto(`${appUrl()}/review`);
    const waiting = await reviewer.textContent('[data-testid=queue-waiting]');
    expect(waiting).toContain('Fennick');
    expect(waiting).toContain('asked for you');
    await reviewer.screenshot({ path: screenshotPath('review-queue'), fullPage: true });
  });
});

describe('the review loop', () => {
  it('lets the engineer submit the draft to a chosen reviewer', async () => {
    await engineer.goto(caseUrl);
    expect(await state(engineer)).toBe('draft');
    await engineer.check('[data-testid=submit-form] label:has-text("Helena Brandt") input');
    await Promise.all([engineer.waitForURL(/done=submitted/), engineer.click('button:has-text("Submit for review")')]);
    expect(await state(engineer)).toBe('in_review');
    expect(await engineer.textContent('[data-testid=review-round]')).toContain('Helena Brandt');
  });

  it('lets the reviewer comment on the block and return the case', async () => {
    await reviewer.goto(caseUrl);
    await reviewer.selectOption('#comment-anchor', { index: 1 });
    await reviewer.fill('#comment-body', 'Which survey gives y1 = 0.62 m? Quote it beside the block.');
    await Promise.all([reviewer.waitForURL(/done=commented/), reviewer.click('button:has-text("Add comment")')]);
    const thread = reviewer.locator('[data-testid=comment-thread]').first();
    expect(await thread.textContent()).toContain('On block 1');
    // The reviewer's own open comment stands in the way of approving.
    expect(await reviewer.textContent('[data-testid=reviewer-actions]')).toContain('Resolve your open comment');
    await reviewer.fill('#return-reason', 'Add the source of the toe depth, then resubmit.');
    await Promise.all([reviewer.waitForURL(/done=returned/), reviewer.click('button:has-text("Return to the author")')]);
    expect(await state(reviewer)).toBe('returned');
    await reviewer.screenshot({ path: screenshotPath('review-returned'), fullPage: true });
  });

  it('lets the engineer fix the case, resolve the comments and resubmit', async () => {
    await engineer.goto(`${caseUrl}/edit`);
    const editor = engineer.locator('[data-testid=case-editor] textarea.w-md-editor-text-input');
    await engineer.waitForSelector('[data-testid=case-preview] table');
    await editor.fill(BODY.replace('Plain basin', 'Toe depth y1 from the 2026 Wrenmoor gauging survey. Plain basin'));
    await engineer.waitForSelector('[data-testid=save-status][data-state=saved]', { timeout: 15_000 });
    await engineer.goto(caseUrl);
    for (let open = await engineer.locator('[data-testid=comment-thread][data-resolved=false]').count(); open > 0; open -= 1) {
      const first = engineer.locator('[data-testid=comment-thread][data-resolved=false]').first();
      await Promise.all([engineer.waitForURL(/done=resolved/), first.locator('button:has-text("Resolve")').click()]);
    }
    expect(await engineer.textContent('[data-testid=open-comments]')).toContain('No open comments');
    await Promise.all([engineer.waitForURL(/done=submitted/), engineer.click('button:has-text("Submit for review")')]);
    expect(await state(engineer)).toBe('in_review');
  });

  it('lets the reviewer approve, and the case reads as published with “checked by”', async () => {
    await reviewer.goto(caseUrl);
    await Promise.all([reviewer.waitForURL(/done=published/), reviewer.click('button:has-text("Approve revision 2")')]);
    expect(await state(reviewer)).toBe('published');
    await engineer.goto(caseUrl);
    expect(await engineer.textContent('[data-testid=checked-by]')).toMatch(/Checked by Helena Brandt on \d/);
    await engineer.screenshot({ path: screenshotPath('review-published'), fullPage: true });
    expect(errors).toEqual([]);
  });
});
