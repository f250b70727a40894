/** Drift checks: one case against its approved snapshot, the library run, and the JSON routes' access rules. */
import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db, pool } from '../../src/db/client';
import { approval, driftRun } from '../../src/db/schema';
import { createCase, type CaseMetadata } from '../../src/lib/cases';
import { actOnCase, caseDrift, caseDriftFrom, DRIFT_BATCH_SIZE, getCaseReview, getDriftRun, latestDriftRun, startDriftRun, type DriftRunView } from '../../src/lib/review';
import { SOLVER_VERSION } from '../../src/lib/solver';
import { call, sessionOf } from '../helpers/app';
import { makeFirm, TEST_PASSWORD, type TestFirm } from '../helpers/firms';

const BODY = 'Basin check.\n\n```jump basin\nb = 12 m\nQ = 85 m3/s\ny1 = 0.53 m\n```\n\n```gate sluice\nb = 4 m\na = 0.5 m\nCc = 0.61\ny0 = 3.2 m\n```\n';
const metadata = (title: string): CaseMetadata => ({ title, structureType: 'spillway-basin', sectionShape: 'rectangular', tags: [] });

const firmOf = () => makeFirm({ author: 'engineer', rev: 'reviewer', admin: 'admin' });

/** Creates and publishes a case (submit → approve); returns its id. */
async function publish(f: TestFirm, title: string, body = BODY): Promise<string> {
  const created = await createCase(db(), { firmId: f.firm.id, authorId: f.people.author!.userId, metadata: metadata(title), body });
  const as = (who: string) => ({ userId: f.people[who]!.userId, role: f.people[who]!.role });
  expect(await actOnCase(db(), { firmId: f.firm.id, caseId: created.id, actor: as('author'), action: 'submit' })).toMatchObject({ ok: true });
  expect(await actOnCase(db(), { firmId: f.firm.id, caseId: created.id, actor: as('rev'), action: 'approve' })).toMatchObject({ ok: true, state: 'published' });
  return created.id;
}

/** Scales the approved SI value of output `name` of block 0 in SQL (the approval table is not append-only). */
async function scaleApprovedOutput(caseId: string, name: string, factor: number): Promise<void> {
  const [row] = await db().select({ snapshot: approval.snapshot }).from(approval).where(eq(approval.caseId, caseId));
  const k = row!.snapshot.blocks[0]!.outputs.findIndex((o) => o.name === name);
  expect(k).toBeGreaterThanOrEqual(0);
  const path = `{blocks,0,outputs,${k},si}`;
  const result = await pool().query(`update approval set snapshot = jsonb_set(snapshot, $1::text[], to_jsonb((snapshot #>> $1::text[])::float8 * $2)) where case_id = $3`, [path, factor, caseId]);
  expect(result.rowCount).toBe(1);
}

async function waitForRun(cookie: string, id: string): Promise<{ seen: number[]; run: DriftRunView }> {
  const seen: number[] = [];
  for (let i = 0; i < 200; i++) {
    const response = await call(`/api/v1/firms/drift-runs/${id}`, { cookie });
    expect(response.status).toBe(200);
    const { run } = (await response.json()) as { run: DriftRunView };
    seen.push(run.checked);
    if (!run.running) return { seen, run };
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error('the drift run did not finish');
}

describe('caseDrift', () => {
  it('reports no drift right after approval, then the block and figure once the snapshot is changed', async () => {
    const f = await firmOf();
    const caseId = await publish(f, 'Orrin Beck weir stilling basin');
    const fresh = await caseDrift(db(), f.firm.id, caseId);
    expect(fresh).toMatchObject({ caseId, revision: 1, approvedBy: `rev ${f.people.rev!.email.split('.')[1]!.split('@')[0]}`, solverVersionApproved: SOLVER_VERSION, solverVersionNow: SOLVER_VERSION, findings: [] });
    expect(fresh!.approvedAt).toBeInstanceOf(Date);

    await scaleApprovedOutput(caseId, 'y2', 1.02);
    const drift = await caseDrift(db(), f.firm.id, caseId);
    expect(drift!.findings).toHaveLength(1);
    const [block] = drift!.findings;
    expect(block).toMatchObject({ index: 0, name: 'basin', change: 'figures' });
    expect(block!.figures).toHaveLength(1);
    expect(block!.figures[0]).toMatchObject({ name: 'y2', label: 'Sequent depth', unit: 'm' });
    expect(block!.figures[0]!.relativeDifference).toBeCloseTo(1 / 1.02 - 1, 6);
    expect(block!.figures[0]!.approved!.value as number).toBeCloseTo((block!.figures[0]!.current!.value as number) * 1.02, 9);
  });

  it('stays quiet within the tolerance', async () => {
    const f = await firmOf();
    const caseId = await publish(f, 'Small change basin');
    await scaleApprovedOutput(caseId, 'y2', 1.0004);
    expect((await caseDrift(db(), f.firm.id, caseId))!.findings).toEqual([]);
  });

  it('is null for a case that is not published, and for another firm', async () => {
    const f = await firmOf();
    const other = await firmOf();
    const draft = await createCase(db(), { firmId: f.firm.id, authorId: f.people.author!.userId, metadata: metadata('Draft basin'), body: BODY });
    expect(await caseDrift(db(), f.firm.id, draft.id)).toBeNull();
    const caseId = await publish(f, 'Published basin');
    expect(await caseDrift(db(), other.firm.id, caseId)).toBeNull();
    expect(await caseDrift(db(), f.firm.id, randomUUID())).toBeNull();
  });

  it('gives the case page the basis caseDrift uses, compared again once the approval row changes, and none once withdrawn', async () => {
    const f = await firmOf();
    const caseId = await publish(f, 'Page basis basin');
    const { driftBasis } = await getCaseReview(db(), f.firm.id, caseId);
    expect(driftBasis).toMatchObject({ caseId, title: 'Page basis basin', revision: 1, solverVersionApproved: SOLVER_VERSION });
    expect(await caseDriftFrom(db(), f.firm.id, driftBasis!)).toEqual(await caseDrift(db(), f.firm.id, caseId));
    await scaleApprovedOutput(caseId, 'y2', 1.02);
    const changed = (await getCaseReview(db(), f.firm.id, caseId)).driftBasis!;
    expect(changed.rowVersion).not.toBe(driftBasis!.rowVersion);
    expect((await caseDriftFrom(db(), f.firm.id, changed)).findings).toHaveLength(1);
    const rev = { userId: f.people.rev!.userId, role: f.people.rev!.role };
    expect(await actOnCase(db(), { firmId: f.firm.id, caseId, actor: rev, action: 'withdraw', reason: 'Superseded by the 2031 survey.' })).toMatchObject({ ok: true });
    expect((await getCaseReview(db(), f.firm.id, caseId)).driftBasis).toBeNull();
    expect(await caseDrift(db(), f.firm.id, caseId)).toBeNull();
  });

  it('says so when an approved snapshot cannot be read', async () => {
    const f = await firmOf();
    const caseId = await publish(f, 'Damaged snapshot basin');
    await pool().query(`update approval set snapshot = '{"blocks": "not a list"}'::jsonb where case_id = $1`, [caseId]);
    const drift = await caseDrift(db(), f.firm.id, caseId);
    expect(drift).toMatchObject({ findings: [] });
    expect(drift!.problem).toMatch(/could not be read/);
  });
});

describe('library drift run', () => {
  it('checks every published case in batches and finds the one that drifts', async () => {
    const f = await firmOf();
    const ids: string[] = [];
    for (let i = 0; i < DRIFT_BATCH_SIZE + 2; i++) ids.push(await publish(f, `Basin ${String(i).padStart(2, '0')}`));
    await createCase(db(), { firmId: f.firm.id, authorId: f.people.author!.userId, metadata: metadata('Unpublished basin'), body: BODY });
    await scaleApprovedOutput(ids[3]!, 'fr1', 0.9);

    const { run, started, done } = await startDriftRun(db(), { firmId: f.firm.id, userId: f.people.admin!.userId });
    expect(started).toBe(true);
    expect(run).toMatchObject({ total: ids.length, solverVersion: SOLVER_VERSION });
    await done;
    const finished = await getDriftRun(db(), f.firm.id, run.id);
    expect(finished).toMatchObject({ running: false, error: null, total: ids.length, checked: ids.length, startedBy: `admin ${f.people.admin!.email.split('.')[1]!.split('@')[0]}` });
    expect(finished!.findings).toHaveLength(1);
    expect(finished!.findings[0]).toMatchObject({ caseId: ids[3], title: 'Basin 03', revision: 1 });
    expect(finished!.findings[0]!.findings[0]!.figures.map((x) => x.name)).toEqual(['fr1']);
    expect((await latestDriftRun(db(), f.firm.id))!.id).toBe(run.id);
    expect(await getDriftRun(db(), (await firmOf()).firm.id, run.id)).toBeNull();
  });

  it('returns the running run when asked again, and replaces one left unfinished long ago', async () => {
    const f = await firmOf();
    const runningId = randomUUID();
    await db().insert(driftRun).values({ id: runningId, firmId: f.firm.id, solverVersion: SOLVER_VERSION, total: 5, checked: 2 });
    const again = await startDriftRun(db(), { firmId: f.firm.id, userId: f.people.admin!.userId });
    expect(again).toMatchObject({ started: false, run: { id: runningId, running: true, checked: 2 } });

    await db().update(driftRun).set({ startedAt: new Date(Date.now() - 60 * 60_000) }).where(eq(driftRun.id, runningId));
    const fresh = await startDriftRun(db(), { firmId: f.firm.id, userId: f.people.admin!.userId });
    expect(fresh.started).toBe(true);
    expect(fresh.run.id).not.toBe(runningId);
    await fresh.done;
    const [stale] = await db().select().from(driftRun).where(and(eq(driftRun.id, runningId), eq(driftRun.firmId, f.firm.id)));
    expect(stale!.finishedAt).not.toBeNull();
    expect(stale!.error).toMatch(/cut off/);
  });

  it('lets only one of two concurrent starts begin a run', async () => {
    const f = await firmOf();
    await publish(f, 'Concurrent basin');
    const both = await Promise.all([0, 1].map(() => startDriftRun(db(), { firmId: f.firm.id, userId: f.people.admin!.userId })));
    await Promise.all(both.map((b) => b.done));
    const rows = await db().select().from(driftRun).where(eq(driftRun.firmId, f.firm.id));
    // The second either saw the first running or started after it had finished: never two at once.
    if (both.every((b) => b.started)) expect(rows.every((r) => r.finishedAt !== null)).toBe(true);
    else expect(new Set(both.map((b) => b.run.id)).size).toBe(1);
  });
});

describe('drift routes and page', () => {
  it('starts a run over HTTP and reports progress to completion', async () => {
    const f = await firmOf();
    const caseId = await publish(f, 'Kettle Run basin');
    await publish(f, 'Second basin');
    await scaleApprovedOutput(caseId, 'y2', 1.5);
    const cookie = await sessionOf(f.people.admin!.email, TEST_PASSWORD);
    const response = await call('/api/v1/firms/drift-runs', { json: {}, cookie });
    expect(response.status).toBe(202);
    const { run, started } = (await response.json()) as { run: DriftRunView; started: boolean };
    expect(started).toBe(true);
    expect(run.total).toBe(2);
    const { seen, run: finished } = await waitForRun(cookie, run.id);
    expect(seen).toEqual([...seen].sort((a, b) => a - b));
    expect(finished).toMatchObject({ checked: 2, total: 2, error: null });
    expect(finished.findings.map((x) => x.caseId)).toEqual([caseId]);

    const latest = await call('/api/v1/firms/drift-runs', { cookie });
    expect(((await latest.json()) as { run: DriftRunView }).run.id).toBe(run.id);

    const page = await call('/firm/drift', { cookie });
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('Re-check the library');
    expect(html).toContain(`href="/cases/${caseId}"`);
    expect(html).toContain('Kettle Run basin');
    expect(html).toContain('Sequent depth');
    expect(html).not.toContain('Second basin');
  });

  it('answers 401 signed out, 403 for engineers and reviewers, 404 for another firm’s run', async () => {
    const f = await firmOf();
    const other = await firmOf();
    const { run, done } = await startDriftRun(db(), { firmId: f.firm.id, userId: f.people.admin!.userId });
    await done;
    expect((await call(`/api/v1/firms/drift-runs/${run.id}`)).status).toBe(401);
    expect((await call('/api/v1/firms/drift-runs', { json: {} })).status).toBe(401);
    for (const who of ['author', 'rev']) {
      const cookie = await sessionOf(f.people[who]!.email, TEST_PASSWORD);
      expect((await call(`/api/v1/firms/drift-runs/${run.id}`, { cookie })).status).toBe(403);
      expect((await call('/api/v1/firms/drift-runs', { json: {}, cookie })).status).toBe(403);
      const page = await call('/firm/drift', { cookie });
      expect(page.status).toBe(403);
      expect(await page.text()).toContain('Only a firm admin can check the library');
    }
    const outsider = await sessionOf(other.people.admin!.email, TEST_PASSWORD);
    const foreign = await call(`/api/v1/firms/drift-runs/${run.id}`, { cookie: outsider });
    expect(foreign.status).toBe(404);
    expect(await foreign.json()).toMatchObject({ error: { code: 'not_found' } });
    expect((await call(`/api/v1/firms/drift-runs/${randomUUID()}`, { cookie: outsider })).status).toBe(404);
  });

  it('starts a run from the page’s form and comes back to the page', async () => {
    const f = await firmOf();
    const cookie = await sessionOf(f.people.admin!.email, TEST_PASSWORD);
    const empty = await call('/firm/drift', { cookie });
    expect(await empty.text()).toContain('The library has not been checked yet');
    const posted = await call('/firm/drift', { cookie, form: { intent: 'start' } });
    expect(posted.status).toBe(303);
    expect(posted.headers.get('location')).toMatch(/^\/firm\/drift\?(started|already)=1$/);
    const rows = await db().select().from(driftRun).where(eq(driftRun.firmId, f.firm.id));
    expect(rows).toHaveLength(1);
  });
});
