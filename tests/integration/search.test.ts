/**
 * Precedent search end to end against the search fake (search-fake/), through the app's
 * outbox and worker: publish → searchable, supersede → replaced, withdraw → gone, firm
 * isolation (crafted parameters included), the search service down and back, a reindex
 * from scratch, the API's validation and the "start from this one" form.
 */
import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { db, pool } from '../../src/db/client';
import { searchOutbox } from '../../src/db/schema';
import { reindexAll, searchService } from '../../src/lib/search';
import { call, sessionOf } from '../helpers/app';
import { makeFirm, TEST_PASSWORD, type TestFirm } from '../helpers/firms';

const word = `quarrel${randomUUID().slice(0, 6).replace(/[^a-z]/g, 'q')}`;
const jump = (q: number, y1: number) => `\`\`\`jump outlet\nb = 3 m\nQ = ${q} m3/s\ny1 = ${y1} m\n\`\`\``;
const body = (q: number, y1: number, extra = '') => `## Context\n\nThe ${word} culvert outlet apron ${extra}.\n\n${jump(q, y1)}\n`;

let a: TestFirm;
let b: TestFirm;
const cookie: Record<string, string> = {};

beforeAll(async () => {
  a = await makeFirm({ author: 'engineer', rev: 'reviewer', admin: 'admin', reader: 'engineer' });
  b = await makeFirm({ author: 'engineer', rev: 'reviewer' });
  for (const key of Object.keys(a.people)) cookie[`a.${key}`] = await sessionOf(a.people[key]!.email, TEST_PASSWORD);
  for (const key of Object.keys(b.people)) cookie[`b.${key}`] = await sessionOf(b.people[key]!.email, TEST_PASSWORD);
});

async function createCase(firm: 'a' | 'b', title: string, markdown: string, extra: Record<string, unknown> = {}): Promise<string> {
  const response = await call('/api/v1/cases', {
    cookie: cookie[`${firm}.author`],
    json: { title, structureType: 'culvert-outlet', sectionShape: 'rectangular', tags: ['apron', word], body: markdown, ...extra },
  });
  expect(response.status).toBe(201);
  return (await response.json()).case.id;
}

async function publish(firm: 'a' | 'b', id: string): Promise<void> {
  const people = firm === 'a' ? a : b;
  const submit = await call(`/api/v1/cases/${id}/review`, { cookie: cookie[`${firm}.author`], json: { action: 'submit', reviewerIds: [people.people.rev!.userId] } });
  expect(submit.status).toBe(200);
  const approve = await call(`/api/v1/cases/${id}/review`, { cookie: cookie[`${firm}.rev`], json: { action: 'approve' } });
  expect(await approve.json()).toMatchObject({ state: 'published' });
}

const search = async (who: string, params: string) => call(`/api/v1/search?${params}`, { cookie: cookie[who] });
const idsOf = async (who: string, params: string): Promise<string[]> => {
  const response = await search(who, params);
  expect(response.status).toBe(200);
  return (await response.json()).hits.map((h: { id: string }) => h.id);
};

/** Polls until `check` passes (the worker indexes within moments of a commit). */
async function eventually<T>(read: () => Promise<T>, check: (value: T) => boolean, timeoutMs = 20_000): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const value = await read();
    if (check(value)) return value;
    if (Date.now() > until) throw new Error(`not reached in ${timeoutMs} ms; last: ${JSON.stringify(value)}`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

const fake = (path: string, json: unknown) =>
  fetch(`${inject('searchUrl')}${path}`, { method: 'POST', headers: { authorization: `Bearer ${inject('searchKey')}`, 'content-type': 'application/json' }, body: JSON.stringify(json) });

describe('publish, supersede, withdraw', () => {
  it('makes a published case findable by words and Froude range, and only the published one', async () => {
    const draft = await createCase('a', `Draft ${word} outlet`, body(10, 0.3));
    const id = await createCase('a', `Kestle Lane ${word} outlet`, body(10, 0.3), { summary: 'Outlet jump, apron depressed.' });
    await publish('a', id);
    const hits = await eventually(() => idsOf('a.reader', `q=${word}`), (ids) => ids.includes(id));
    expect(hits).not.toContain(draft);

    const found = await (await search('a.reader', `q=${word}&frMin=3&frMax=20`)).json();
    const hit = found.hits.find((h: { id: string }) => h.id === id);
    // Q = 10 m³/s on b = 3 m at y1 = 0.3 m: V1 = 11.1 m/s, Fr1 = V1/√(g·y1) = 6.48.
    expect(hit.figures.fr1Min).toBeCloseTo(10 / 3 / 0.3 / Math.sqrt(9.80665 * 0.3), 6);
    expect(hit.title.some((s: { text: string; hit: boolean }) => s.hit && s.text.toLowerCase() === word)).toBe(true);
    expect(hit).toMatchObject({ structureType: 'culvert-outlet', revision: 1, reviewerNames: [`rev ${a.people.rev!.email.split('.')[1]!.split('@')[0]}`] });
    expect(found.caution).toMatch(/licensed engineer/);
    expect(found.facets.structure).toContainEqual({ value: 'culvert-outlet', label: 'Culvert outlet', count: expect.any(Number) });
    // Outside the case's Fr1 range: not found.
    expect(await idsOf('a.reader', `q=${word}&frMin=8`)).not.toContain(id);
    expect(await idsOf('a.reader', `q=${word}&frMax=5`)).not.toContain(id);
  });

  it('replaces the document when a new revision is published, and removes it on withdrawal', async () => {
    const id = await createCase('a', `Mardle ${word} outlet`, body(10, 0.3));
    await publish('a', id);
    await eventually(() => idsOf('a.reader', `q=${word}&frMin=6&frMax=7`), (ids) => ids.includes(id));
    const saved = await call(`/api/v1/cases/${id}`, { method: 'PATCH', cookie: cookie['a.author'], json: { baseRevision: 1, body: body(4, 0.5, 'after the survey') } });
    expect(saved.status).toBe(200);
    // The new draft is not published: colleagues still find revision 1 and its figures.
    expect(await idsOf('a.reader', `q=${word}&frMin=6&frMax=7`)).toContain(id);
    await publish('a', id);
    // Q = 4 m³/s, y1 = 0.5 m: Fr1 = 4/3/0.5/√(g·0.5) = 1.20.
    await eventually(() => idsOf('a.reader', `q=${word}&frMax=1.5`), (ids) => ids.includes(id));
    expect(await idsOf('a.reader', `q=${word}&frMin=6&frMax=7`)).not.toContain(id);
    const hits = (await (await search('a.reader', `q=${word}`)).json()).hits.filter((h: { id: string }) => h.id === id);
    expect(hits).toHaveLength(1);
    expect(hits[0].revision).toBe(2);

    const withdrawn = await call(`/api/v1/cases/${id}/review`, { cookie: cookie['a.admin'], json: { action: 'withdraw', reason: 'Superseded by the new culvert design.' } });
    expect(withdrawn.status).toBe(200);
    await eventually(() => idsOf('a.reader', `q=${word}`), (ids) => !ids.includes(id));
  });
});

describe('firm isolation', () => {
  it('never shows firm B what firm A published, whatever the query says', async () => {
    const id = await createCase('a', `Penrose ${word} outlet`, body(10, 0.3));
    await publish('a', id);
    await eventually(() => idsOf('a.reader', `q=${word}`), (ids) => ids.includes(id));
    const crafted = [
      `q=${word}`,
      '',
      `q=${word}&firmId=${a.firm.id}`,
      `tag=${encodeURIComponent(`x" OR firmId = "${a.firm.id}`)}`,
      `tag=${encodeURIComponent(`${word}"] OR firmId EXISTS OR tags IN ["`)}`,
      `region=${encodeURIComponent(`\\" OR firmId != "`)}`,
      `q=${encodeURIComponent(`${word} firmId = "${a.firm.id}"`)}`,
    ];
    for (const params of crafted) expect(await idsOf('b.author', params), params).not.toContain(id);
    // B's own facet counts do not count A's cases either.
    const facets = (await (await search('b.author', '')).json()).facets;
    expect(facets.tag.find((t: { value: string }) => t.value === word)).toBeUndefined();
  });

  it('answers without a session with 401, and a query that does not read with 422 and the reason', async () => {
    expect((await call('/api/v1/search?q=x')).status).toBe(401);
    const inverted = await search('a.reader', 'frMin=6&frMax=4');
    expect(inverted.status).toBe(422);
    expect((await inverted.json()).error.message).toContain('The lowest Fr₁ must not be above the highest.');
    const notNumber = await search('a.reader', 'dischargeMin=lots');
    expect((await notNumber.json()).error.message).toContain('The lowest discharge must be a number.');
    expect((await search('a.reader', `q=${'x'.repeat(201)}`)).status).toBe(422);
    expect((await search('a.reader', 'structure=aqueduct')).status).toBe(422);
  });
});

describe('the search service down and back', () => {
  it('publishes while search is down, says so on search, and catches up when it returns', async () => {
    expect((await fake('/_fake/outage', { down: true })).status).toBe(200);
    let id = '';
    try {
      id = await createCase('a', `Tregarth ${word} outlet`, body(10, 0.3));
      await publish('a', id);
      const down = await search('a.reader', `q=${word}`);
      expect(down.status).toBe(503);
      const answer = await down.json();
      expect(answer.error.code).toBe('search_unavailable');
      expect(answer.error.message).toMatch(/Publishing and everything else still works/);
      expect(answer.pending).toBeGreaterThanOrEqual(1);
      // The worker tried and left the row for later, with the reason.
      const rows = await eventually(
        () => db().select().from(searchOutbox),
        (r) => r.some((row) => row.caseId === id && row.attempts >= 1 && row.lastError !== null),
      );
      expect(rows.find((row) => row.caseId === id)!.lastError).toBeTruthy();
    } finally {
      expect((await fake('/_fake/outage', { down: false })).status).toBe(200);
    }
    await eventually(() => idsOf('a.reader', `q=${word}`), (ids) => ids.includes(id), 30_000);
    // The count of waiting changes is reused for a second; then it is back to nothing.
    await eventually(async () => (await (await search('a.reader', `q=${word}`)).json()).pending, (n) => n === 0);
  });
});

describe('reindex from scratch', () => {
  it('rebuilds the index from PostgreSQL with the same results, reporting progress', async () => {
    const queries = [`q=${word}`, `q=${word}&frMin=6&frMax=7`, 'sort=newest', `tag=${word}&sort=fr1-asc`];
    const before = await Promise.all(queries.map((q) => idsOf('a.reader', q)));
    const service = searchService()!;
    // Start from nothing: the live index is dropped first.
    await service.client.deleteIndex(service.indexUid).waitTask();
    const progress: number[] = [];
    const result = await reindexAll(pool(), service, (done) => progress.push(done));
    expect(result.indexed).toBeGreaterThanOrEqual(4);
    expect(progress.at(-1)).toBe(result.indexed);
    expect(await Promise.all(queries.map((q) => idsOf('a.reader', q)))).toEqual(before);
  });
});

describe('start a new case from a result', () => {
  it('copies the published body into a new draft of the caller, and refuses another firm’s case', async () => {
    const id = await createCase('a', `Cradock ${word} outlet`, body(10, 0.3));
    await publish('a', id);
    const form = await call(`/cases/new?from=${id}`, { cookie: cookie['a.reader'] });
    expect(form.status).toBe(200);
    expect(await form.text()).toContain('data-testid="copy-source"');
    const created = await call(`/cases/new?from=${id}`, {
      cookie: cookie['a.reader'],
      form: { title: `Cradock copy ${word}`, structureType: 'culvert-outlet', sectionShape: 'rectangular', projectReference: '', summary: '', region: '', tags: '', start: 'copy' },
    });
    expect(created.status).toBe(303);
    const newId = created.headers.get('location')!.split('/')[2]!;
    const copy = await (await call(`/api/v1/cases/${newId}`, { cookie: cookie['a.reader'] })).json();
    expect(copy.case).toMatchObject({ state: 'draft', authorId: a.people.reader!.userId });
    expect(copy.case.revision.body).toBe(body(10, 0.3));
    const elsewhere = await call(`/cases/new?from=${id}`, { cookie: cookie['b.author'] });
    expect(elsewhere.status).toBe(404);
    expect(await elsewhere.text()).toContain('not in this firm');
  });
});
