import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db, pool } from '../../src/db/client';
import { approval, driftRun } from '../../src/db/schema';
import { SOLVER_VERSION } from '../../src/lib/solver';
import { DEMO_PASSWORD } from '../../src/db/seed';
import { createCase } from '../../src/lib/cases';
import { actOnCase } from '../../src/lib/review';
import { appUrl } from '../helpers/app';
import { launchBrowser, screenshotPath } from '../helpers/browser';
import { makeFirm, TEST_PASSWORD } from '../helpers/firms';

let browser: Browser;

async function signedIn(email: string, password: string, path: string): Promise<Page> {
  const page = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
  await page.goto(`${appUrl()}${path}`);
  await page.fill('#email', email);
  await page.fill('#password', password);
  await Promise.all([page.waitForURL(`${appUrl()}${path}`), page.keyboard.press('Enter')]);
  return page;
}

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

describe('the firm admin’s audit trail and drift pages (demo firm)', () => {
  let page: Page;
  beforeAll(async () => {
    page = await signedIn('maren.castell@kestrelweir.example', DEMO_PASSWORD, '/firm/audit');
  });

  it('shows the audit trail with the firm tabs and filters', async () => {
    await page.waitForSelector('[data-testid=firm-nav]');
    expect(await page.locator('[data-testid=firm-nav] a').allTextContents()).toEqual(['Members', 'Audit trail', 'Drift']);
    await page.waitForSelector('[data-testid=audit-table], [data-testid=audit-empty]');
    await page.screenshot({ path: screenshotPath('audit-trail'), fullPage: true });
  });

  it('filters by action with the keyboard', async () => {
    await page.selectOption('#f-action', 'member.added');
    await page.focus('#f-to');
    await Promise.all([page.waitForURL(/action=member\.added/), page.keyboard.press('Enter')]);
    const actions = await page.locator('[data-testid=audit-table] tbody tr').evaluateAll((rows) => rows.map((r) => r.getAttribute('data-action')));
    expect(actions.length).toBeGreaterThan(0);
    expect(new Set(actions)).toEqual(new Set(['member.added']));
    expect(await page.getAttribute('[data-testid=audit-csv]', 'href')).toBe('/api/v1/firms/audit.csv?action=member.added');
  });

  it('shows the drift page empty, then a finished check', async () => {
    await page.goto(`${appUrl()}/firm/drift`);
    await page.waitForSelector('[data-testid=drift-empty], [data-testid=drift-run]');
    await page.screenshot({ path: screenshotPath('drift-empty'), fullPage: true });
    await Promise.all([page.waitForURL(/\/firm\/drift\?/), page.click('[data-testid=recheck]')]);
    await page.waitForSelector('[data-testid=drift-none], [data-testid=drift-findings]', { timeout: 20_000 });
    await page.screenshot({ path: screenshotPath('drift-checked'), fullPage: true });
  });
});

describe('the drift page with a drifting case', () => {
  it('lists the case, block and figures after the progress bar', async () => {
    const f = await makeFirm({ author: 'engineer', rev: 'reviewer', admin: 'admin' });
    const body = 'Basin.\n\n```jump basin\nb = 12 m\nQ = 85 m3/s\ny1 = 0.53 m\n```\n';
    const created = await createCase(db(), { firmId: f.firm.id, authorId: f.people.author!.userId, metadata: { title: 'Harlow Fen outfall basin', structureType: 'spillway-basin', sectionShape: 'rectangular', tags: [] }, body });
    const as = (who: string) => ({ userId: f.people[who]!.userId, role: f.people[who]!.role });
    await actOnCase(db(), { firmId: f.firm.id, caseId: created.id, actor: as('author'), action: 'submit' });
    await actOnCase(db(), { firmId: f.firm.id, caseId: created.id, actor: as('rev'), action: 'approve' });
    const [row] = await db().select({ snapshot: approval.snapshot }).from(approval).where(eq(approval.caseId, created.id));
    const k = row!.snapshot.blocks[0]!.outputs.findIndex((o) => o.name === 'y2');
    await pool().query(`update approval set snapshot = jsonb_set(jsonb_set(snapshot, $1::text[], to_jsonb(4.25::float8)), $2::text[], '"4.250"') where case_id = $3`, [
      `{blocks,0,outputs,${k},si}`,
      `{blocks,0,outputs,${k},text}`,
      created.id,
    ]);

    const page = await signedIn(f.people.admin!.email, TEST_PASSWORD, '/firm/drift');
    await Promise.all([page.waitForURL(/\/firm\/drift\?/), page.click('[data-testid=recheck]')]);
    await page.waitForSelector('[data-testid=drift-findings]', { timeout: 20_000 });
    const text = await page.textContent('[data-testid=drift-findings]');
    expect(text).toContain('Harlow Fen outfall basin');
    expect(text).toContain('Block 1 “basin”');
    expect(text).toContain('Sequent depth');
    expect(text).toContain('4.250 m');
    await page.screenshot({ path: screenshotPath('drift-findings'), fullPage: true });
  });
});

describe('the drift page while a check runs', () => {
  it('shows a progress bar that follows the run and then the result', async () => {
    const f = await makeFirm({ admin: 'admin' });
    const id = randomUUID();
    await db().insert(driftRun).values({ id, firmId: f.firm.id, startedBy: f.people.admin!.userId, solverVersion: SOLVER_VERSION, total: 12, checked: 5 });
    const page = await signedIn(f.people.admin!.email, TEST_PASSWORD, '/firm/drift');
    await page.waitForSelector('progress');
    expect(await page.getAttribute('progress', 'value')).toBe('5');
    expect(await page.getAttribute('progress', 'max')).toBe('12');
    expect(await page.locator('head noscript').count()).toBe(1);
    await page.screenshot({ path: screenshotPath('drift-running'), fullPage: true });
    await db().update(driftRun).set({ checked: 9 }).where(eq(driftRun.id, id));
    await page.waitForFunction(() => document.querySelector('progress')?.value === 9, undefined, { timeout: 10_000 });
    expect(await page.textContent('[data-count]')).toContain('9 of 12');
    await db().update(driftRun).set({ checked: 12, finishedAt: new Date() }).where(eq(driftRun.id, id));
    await page.waitForSelector('[data-testid=drift-none]', { timeout: 10_000 });
    expect(await page.locator('progress').count()).toBe(0);
  });
});
