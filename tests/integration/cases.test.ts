import { and, eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { db, pool } from '../../src/db/client';
import { auditEvent, caseRevision } from '../../src/db/schema';
import { createCase, saveCase } from '../../src/lib/cases';
import { SOLVER_VERSION } from '../../src/lib/solver';
import { call, sessionOf } from '../helpers/app';
import { makeFirm, TEST_PASSWORD, type TestFirm } from '../helpers/firms';

const JUMP = '```jump basin\nb = 12 m\nQ = 85 m3/s\ny1 = 0.62 m\n```';
const BODY_1 = `# Aldmere weir basin\n\nDesign flood.\n\n${JUMP}\n`;
const BODY_2 = `# Aldmere weir basin\n\nDesign flood, checked against the 1:100 year event.\n\n${JUMP}\n`;
const metadata = { title: 'Aldmere weir stilling basin', structureType: 'spillway-basin', sectionShape: 'rectangular' } as const;

// Rectangular jump from first principles: V1 = Q/(b·y1), Fr1 = V1/√(g·y1), Bélanger
// y2/y1 = ½(√(1 + 8·Fr1²) − 1) (Chow 1959, Open-Channel Hydraulics, §15-2).
const v1 = 85 / (12 * 0.62);
const fr1 = v1 / Math.sqrt(9.80665 * 0.62);
const y2 = (0.62 / 2) * (Math.sqrt(1 + 8 * fr1 * fr1) - 1);

let f: TestFirm;
let author: string;
let colleague: string;

beforeAll(async () => {
  f = await makeFirm({ eng: 'engineer', other: 'engineer', rev: 'reviewer' });
  author = await sessionOf(f.people.eng!.email, TEST_PASSWORD);
  colleague = await sessionOf(f.people.other!.email, TEST_PASSWORD);
});

const create = async (cookie: string, json: Record<string, unknown> = { ...metadata, body: BODY_1 }) => {
  const response = await call('/api/v1/cases', { cookie, json });
  expect(response.status).toBe(201);
  return (await response.json()).case;
};

describe('a case from creation to its second revision', () => {
  it('creates, reads, saves on the right base and refuses a stale one with the latest body', async () => {
    const created = await create(author, { ...metadata, body: BODY_1, tags: ['Basin', 'basin', 'USBR II'], region: ' Vale of Tarn ' });
    expect(created).toMatchObject({
      title: metadata.title,
      slug: 'aldmere-weir-stilling-basin',
      state: 'draft',
      latestRevision: 1,
      tags: ['basin', 'usbr ii'],
      region: 'Vale of Tarn',
      projectReference: null,
      authorId: f.people.eng!.userId,
      authorName: `eng ${f.firm.slug.slice(5)}`,
      revision: { number: 1, body: BODY_1, solverVersion: SOLVER_VERSION },
    });

    const got = await call(`/api/v1/cases/${created.id}`, { cookie: colleague });
    expect(got.status).toBe(200);
    const read = await got.json();
    expect(read.case.revision.body).toBe(BODY_1);
    expect(read.caution).toContain('licensed engineer');

    const saved = await call(`/api/v1/cases/${created.id}`, { cookie: author, method: 'PATCH', json: { baseRevision: 1, body: BODY_2 } });
    expect(saved.status).toBe(200);
    const second = await saved.json();
    expect(second).toMatchObject({ revisionCreated: true, case: { latestRevision: 2, revision: { number: 2, body: BODY_2 } } });

    const stale = await call(`/api/v1/cases/${created.id}`, { cookie: author, method: 'PATCH', json: { baseRevision: 1, body: 'my older tab' } });
    expect(stale.status).toBe(409);
    const conflict = await stale.json();
    expect(conflict.error).toMatchObject({ code: 'conflict', latest: { number: 2, body: BODY_2, authorName: second.case.authorName } });
    expect(new Date(conflict.error.latest.createdAt).toISOString()).toBe(conflict.error.latest.createdAt);

    const first = await (await call(`/api/v1/cases/${created.id}/revisions/1`, { cookie: author })).json();
    expect(first.revision).toMatchObject({ number: 1, body: BODY_1 });
    const history = await (await call(`/api/v1/cases/${created.id}/revisions`, { cookie: author })).json();
    expect(history.revisions.map((r: { number: number }) => r.number)).toEqual([2, 1]);
    expect(history.revisions[0]).not.toHaveProperty('body');
    expect(history.revisions[0].keyFigures.fr1Max).toBeCloseTo(fr1, 9);

    const diff = await (await call(`/api/v1/cases/${created.id}/diff?from=1&to=2`, { cookie: author })).json();
    expect(diff).toMatchObject({ from: { number: 1 }, to: { number: 2 }, diff: { added: 1, removed: 1 } });
    const changed = diff.diff.hunks[0].lines.filter((l: { kind: string }) => l.kind !== 'same');
    expect(changed).toEqual([
      { kind: 'removed', oldNumber: 3, newNumber: null, text: 'Design flood.' },
      { kind: 'added', oldNumber: null, newNumber: 3, text: 'Design flood, checked against the 1:100 year event.' },
    ]);

    const events = await db()
      .select({ action: auditEvent.action, details: auditEvent.details })
      .from(auditEvent)
      .where(and(eq(auditEvent.firmId, f.firm.id), eq(auditEvent.targetId, created.id)));
    expect(events.map((e) => e.action).sort()).toEqual(['case.created', 'case.saved']);
  });

  it('stores key figures on the revision that match the evaluated jump block', async () => {
    const created = await create(author);
    const [row] = await db().select().from(caseRevision).where(and(eq(caseRevision.caseId, created.id), eq(caseRevision.number, 1)));
    expect(row!.fr1Min).toBeCloseTo(fr1, 9);
    expect(row!.fr1Max).toBeCloseTo(fr1, 9);
    expect(row!.dischargeMin).toBe(85);
    expect(row!.dischargeMax).toBe(85);
    expect(row!.v1).toBeCloseTo(v1, 9);
    expect(row!.y1).toBe(0.62);
    expect(row!.y2).toBeCloseTo(y2, 9);
    expect(row!.relativeLoss).toBeGreaterThan(0);
    expect(row!.sectionShapes).toEqual(['rectangular']);
    expect(row!.calcKinds).toEqual(['hydraulic-jump']);
    expect(row!.solverVersion).toBe(SOLVER_VERSION);
    const block = row!.results.blocks[0]!;
    expect(block.outputs.find((o) => o.name === 'y2')!.si).toBe(row!.y2);
    expect(created.keyFigures).toMatchObject({ dischargeMax: 85, y1: 0.62, calcKinds: ['hydraulic-jump'] });
  });

  it('de-duplicates slugs within the firm and keeps a slug when the title changes', async () => {
    const title = `Culvert outlet ${f.firm.slug}`;
    const one = await create(author, { ...metadata, title });
    const two = await create(author, { ...metadata, title });
    const three = await create(colleague, { ...metadata, title });
    expect([one.slug, two.slug, three.slug]).toEqual([one.slug, `${one.slug}-2`, `${one.slug}-3`]);
    const renamed = await call(`/api/v1/cases/${one.id}`, { cookie: author, method: 'PATCH', json: { baseRevision: 1, metadata: { title: 'Another title' } } });
    expect((await renamed.json()).case).toMatchObject({ title: 'Another title', slug: one.slug });
  });

  it('gives concurrent creations with the same title different slugs', async () => {
    const title = `Drop structure ${f.firm.slug}`;
    const made = await Promise.all(
      Array.from({ length: 4 }, () => createCase(db(), { firmId: f.firm.id, authorId: f.people.eng!.userId, metadata: { ...metadata, title, tags: [] } })),
    );
    expect(new Set(made.map((c) => c.slug)).size).toBe(4);
  });

  it('changes metadata without a new revision when the body is unchanged, and writes nothing for an empty change', async () => {
    const created = await create(author);
    const response = await call(`/api/v1/cases/${created.id}`, {
      cookie: author,
      method: 'PATCH',
      json: { baseRevision: 1, body: BODY_1, metadata: { sectionShape: 'trapezoidal', tags: ['outlet'], region: 'North' } },
    });
    expect(response.status).toBe(200);
    const saved = await response.json();
    expect(saved).toMatchObject({ revisionCreated: false, changedFields: ['sectionShape', 'region', 'tags'] });
    expect(saved.case).toMatchObject({ latestRevision: 1, sectionShape: 'trapezoidal', tags: ['outlet'], region: 'North' });
    const clear = await (await call(`/api/v1/cases/${created.id}`, { cookie: author, method: 'PATCH', json: { baseRevision: 1, metadata: { region: '' } } })).json();
    expect(clear.case.region).toBeNull();
    const nothing = await (await call(`/api/v1/cases/${created.id}`, { cookie: author, method: 'PATCH', json: { baseRevision: 1, body: BODY_1 } })).json();
    expect(nothing).toMatchObject({ revisionCreated: false, changedFields: [] });
    expect(nothing.case.updatedAt).toBe(clear.case.updatedAt);
  });

  it('lets exactly one of two saves on the same base through', async () => {
    const created = await create(author);
    const save = (body: string) => saveCase(db(), { firmId: f.firm.id, caseId: created.id, userId: f.people.eng!.userId, baseRevision: 1, body });
    const results = await Promise.all([save('tab one'), save('tab two')]);
    expect(results.filter((r) => r.ok)).toHaveLength(1);
    expect(results.filter((r) => !r.ok && r.reason === 'conflict')).toHaveLength(1);
  });
});

describe('revisions never change', () => {
  it('refuses a direct UPDATE, DELETE or TRUNCATE on case_revision and keeps revision 1 as written', async () => {
    const created = await create(author);
    await call(`/api/v1/cases/${created.id}`, { cookie: author, method: 'PATCH', json: { baseRevision: 1, body: BODY_2 } });
    await call(`/api/v1/cases/${created.id}`, { cookie: author, method: 'PATCH', json: { baseRevision: 2, body: `${BODY_2}\nMore.\n` } });
    // Plain SQL through the pool, as a script or a console session would send it.
    await expect(pool().query(`update case_revision set body = 'tampered' where case_id = $1`, [created.id])).rejects.toThrow(
      /case revisions are immutable: UPDATE/,
    );
    await expect(pool().query('delete from case_revision where case_id = $1', [created.id])).rejects.toThrow(
      /case revisions are immutable: DELETE/,
    );
    await expect(pool().query('truncate case_revision cascade')).rejects.toThrow(/case revisions are immutable: TRUNCATE/);
    const rows = await db().select({ number: caseRevision.number, body: caseRevision.body }).from(caseRevision).where(eq(caseRevision.caseId, created.id));
    expect(rows.sort((a, b) => a.number - b.number).map((r) => r.number)).toEqual([1, 2, 3]);
    expect(rows.find((r) => r.number === 1)!.body).toBe(BODY_1);
  });
});

describe('who may do what', () => {
  it('needs a session on every case route (401)', async () => {
    const created = await create(author);
    const routes: Array<[string, string, unknown?]> = [
      ['GET', '/api/v1/cases'],
      ['POST', '/api/v1/cases', metadata],
      ['GET', `/api/v1/cases/${created.id}`],
      ['PATCH', `/api/v1/cases/${created.id}`, { baseRevision: 1, body: 'x' }],
      ['GET', `/api/v1/cases/${created.id}/revisions`],
      ['GET', `/api/v1/cases/${created.id}/revisions/1`],
      ['GET', `/api/v1/cases/${created.id}/diff?from=1&to=1`],
    ];
    for (const [method, path, json] of routes) {
      const response = await call(path, { method, json });
      expect(response.status, `${method} ${path}`).toBe(401);
    }
  });

  it('refuses a save by someone other than the author (403), a reviewer included, and changes nothing', async () => {
    const created = await create(author);
    const reviewer = await sessionOf(f.people.rev!.email, TEST_PASSWORD);
    for (const cookie of [colleague, reviewer]) {
      const response = await call(`/api/v1/cases/${created.id}`, { cookie, method: 'PATCH', json: { baseRevision: 1, body: 'not mine' } });
      expect(response.status).toBe(403);
      expect((await response.json()).error.code).toBe('forbidden');
    }
    expect((await (await call(`/api/v1/cases/${created.id}`, { cookie: author })).json()).case.latestRevision).toBe(1);
  });

  it('explains invalid metadata field by field (422)', async () => {
    const response = await call('/api/v1/cases', { cookie: author, json: { title: 'ab', structureType: 'bridge', sectionShape: 'round', tags: [''] } });
    expect(response.status).toBe(422);
    const body = await response.json();
    expect(body.error.code).toBe('invalid_input');
    expect(body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(['sectionShape', 'structureType', 'tags.0', 'title']);
    expect(body.error.issues.find((i: { path: string }) => i.path === 'title').message).toBe('Give the case a title of at least 3 characters.');
    const created = await create(author);
    const save = await call(`/api/v1/cases/${created.id}`, { cookie: author, method: 'PATCH', json: { baseRevision: 1, metadata: { sectionShape: 'oval' } } });
    expect(save.status).toBe(422);
    expect((await save.json()).error.issues[0].path).toBe('metadata.sectionShape');
  });

  it('answers bad list and diff queries with 422 and a missing revision with 404', async () => {
    const created = await create(author);
    expect((await call('/api/v1/cases?limit=500', { cookie: author })).status).toBe(422);
    expect((await call(`/api/v1/cases/${created.id}/diff?from=1`, { cookie: author })).status).toBe(422);
    expect((await call(`/api/v1/cases/${created.id}/diff?from=1&to=9`, { cookie: author })).status).toBe(404);
    expect((await call(`/api/v1/cases/${created.id}/revisions/9`, { cookie: author })).status).toBe(404);
    expect((await call(`/api/v1/cases/${created.id}/revisions/one`, { cookie: author })).status).toBe(404);
  });
});

describe('GET /api/v1/cases', () => {
  it('lists the firm’s cases with key figures, filters to mine, sorts and pages', async () => {
    const g = await makeFirm({ a: 'engineer', b: 'engineer' });
    const a = await sessionOf(g.people.a!.email, TEST_PASSWORD);
    const b = await sessionOf(g.people.b!.email, TEST_PASSWORD);
    await create(a, { ...metadata, title: 'Bravo basin', body: JUMP });
    await create(a, { ...metadata, title: 'alpha outfall', structureType: 'outfall' });
    await create(b, { ...metadata, title: 'Charlie chute', body: JUMP.replace('y1 = 0.62 m', 'y1 = 0.4 m') });

    const all = await (await call('/api/v1/cases', { cookie: a })).json();
    expect(all).toMatchObject({ total: 3, limit: 50, offset: 0 });
    expect(all.cases.map((c: { title: string }) => c.title)).toEqual(['Charlie chute', 'alpha outfall', 'Bravo basin']);
    expect(all.cases[0]).toMatchObject({ authorName: expect.stringMatching(/^b /), latestRevision: 1, keyFigures: { y1: 0.4 } });
    expect(all.cases[0]).not.toHaveProperty('revision');

    const mine = await (await call('/api/v1/cases?mine=1', { cookie: a })).json();
    expect(mine.cases.map((c: { title: string }) => c.title).sort()).toEqual(['Bravo basin', 'alpha outfall']);

    const byTitle = await (await call('/api/v1/cases?sort=title', { cookie: a })).json();
    expect(byTitle.cases.map((c: { title: string }) => c.title)).toEqual(['alpha outfall', 'Bravo basin', 'Charlie chute']);

    const byFr1 = await (await call('/api/v1/cases?sort=fr1&dir=asc', { cookie: a })).json();
    expect(byFr1.cases.map((c: { title: string }) => c.title)).toEqual(['Bravo basin', 'Charlie chute', 'alpha outfall']);

    const page = await (await call('/api/v1/cases?sort=title&limit=1&offset=1', { cookie: a })).json();
    expect(page).toMatchObject({ total: 3, limit: 1, offset: 1, cases: [{ title: 'Bravo basin' }] });

    const drafts = await (await call('/api/v1/cases?state=published', { cookie: a })).json();
    expect(drafts).toMatchObject({ total: 0, cases: [] });
  });
});
