import { beforeAll, describe, expect, it } from 'vitest';
import { call, sessionOf } from '../helpers/app';
import { makeFirm, TEST_PASSWORD, type TestFirm } from '../helpers/firms';

// A member of firm A must learn nothing of firm B's cases: every route answers 404 for a
// firm-B case exactly as for a case that never existed, and lists never include them.
let a: TestFirm;
let b: TestFirm;
let adminOfA: string;
let authorOfB: string;
let caseOfB: { id: string; title: string };

const MISSING = '00000000-0000-0000-0000-000000000000';
const BODY = '```jump\nb = 12 m\nQ = 85 m3/s\ny1 = 0.62 m\n```\n';

beforeAll(async () => {
  a = await makeFirm({ admin: 'admin', eng: 'engineer' });
  b = await makeFirm({ admin: 'admin', eng: 'engineer' });
  adminOfA = await sessionOf(a.people.admin!.email, TEST_PASSWORD);
  authorOfB = await sessionOf(b.people.eng!.email, TEST_PASSWORD);
  const created = await call('/api/v1/cases', {
    cookie: authorOfB,
    json: { title: `Brightwater secret outfall ${b.firm.slug}`, structureType: 'outfall', sectionShape: 'circular', body: BODY },
  });
  caseOfB = (await created.json()).case;
  await call(`/api/v1/cases/${caseOfB.id}`, { cookie: authorOfB, method: 'PATCH', json: { baseRevision: 1, body: `${BODY}\nSecond.\n` } });
});

describe('firm isolation of cases', () => {
  const routes: Array<[string, (id: string) => { path: string; method?: string; json?: unknown }]> = [
    ['the case', (id) => ({ path: `/api/v1/cases/${id}` })],
    ['a save of the case', (id) => ({ path: `/api/v1/cases/${id}`, method: 'PATCH', json: { baseRevision: 2, body: 'taken over' } })],
    ['a stale save of the case', (id) => ({ path: `/api/v1/cases/${id}`, method: 'PATCH', json: { baseRevision: 1, body: 'taken over' } })],
    ['its revisions', (id) => ({ path: `/api/v1/cases/${id}/revisions` })],
    ['one revision', (id) => ({ path: `/api/v1/cases/${id}/revisions/1` })],
    ['a diff', (id) => ({ path: `/api/v1/cases/${id}/diff?from=1&to=2` })],
    ['its calculation sheet as PDF', (id) => ({ path: `/api/v1/cases/${id}/sheet.pdf?rev=1` })],
    ['its CSV export', (id) => ({ path: `/api/v1/cases/${id}/export.csv` })],
    ['its JSON export', (id) => ({ path: `/api/v1/cases/${id}/export.json?rev=2` })],
  ];

  it.each(routes)('answers 404 for firm B’s case: %s, the same as for a case that never existed', async (_label, request) => {
    const real = request(caseOfB.id);
    const response = await call(real.path, { cookie: adminOfA, method: real.method, json: real.json });
    expect(response.status).toBe(404);
    const body = await response.json();
    expect(body.error.code).toBe('not_found');
    expect(JSON.stringify(body)).not.toContain(caseOfB.title);
    expect(JSON.stringify(body)).not.toContain('Second.');
    const missing = request(MISSING);
    const other = await call(missing.path, { cookie: adminOfA, method: missing.method, json: missing.json });
    expect(other.status).toBe(404);
    expect(await other.json()).toEqual(body);
  });

  it('never lists firm B’s cases', async () => {
    for (const query of ['', '?sort=title', '?sort=fr1', '?limit=100']) {
      const response = await call(`/api/v1/cases${query}`, { cookie: adminOfA });
      expect(response.status).toBe(200);
      const text = await response.text();
      expect(text).not.toContain(caseOfB.id);
      expect(text).not.toContain(caseOfB.title);
    }
  });

  it('leaves firm B’s case untouched after refused saves', async () => {
    const response = await call(`/api/v1/cases/${caseOfB.id}`, { cookie: authorOfB });
    const body = await response.json();
    expect(body.case).toMatchObject({ latestRevision: 2, revision: { body: `${BODY}\nSecond.\n` } });
  });
});
