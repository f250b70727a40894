/** The audit trail page and its CSV export: admins only, one firm's events, filters, paging, quoting. */
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '../../src/db/client';
import { recordAudit } from '../../src/lib/audit';
import { createCase } from '../../src/lib/cases';
import { actOnCase } from '../../src/lib/review';
import { call, sessionOf } from '../helpers/app';
import { makeFirm, TEST_PASSWORD, type TestFirm } from '../helpers/firms';

const BODY = 'Basin.\n\n```jump basin\nb = 12 m\nQ = 85 m3/s\ny1 = 0.53 m\n```\n';
const DANGEROUS_TITLE = '=HYPERLINK("http://bad.example"), "Weir" basin';
const WITHDRAW_REASON = 'Superseded by the 2027 survey, "revised" levels';

let a: TestFirm;
let b: TestFirm;
let caseId: string;
let adminA: string;

/** A small RFC 4180 reader, enough to check what a spreadsheet would see. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') (cell += '"'), i++;
      else if (c === '"') quoted = false;
      else cell += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') row.push(cell), (cell = '');
    else if (c === '\r' && text[i + 1] === '\n') {
      row.push(cell), rows.push(row), (row = []), (cell = ''), i++;
    } else cell += c;
  }
  if (cell || row.length) row.push(cell), rows.push(row);
  return rows;
}

const today = () => new Date().toISOString().slice(0, 10);
const dayOffset = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

beforeAll(async () => {
  a = await makeFirm({ author: 'engineer', rev: 'reviewer', admin: 'admin' });
  b = await makeFirm({ author: 'engineer', admin: 'admin' });
  const created = await createCase(db(), { firmId: a.firm.id, authorId: a.people.author!.userId, metadata: { title: DANGEROUS_TITLE, structureType: 'spillway-basin', sectionShape: 'rectangular', tags: [] }, body: BODY });
  caseId = created.id;
  const as = (who: string) => ({ userId: a.people[who]!.userId, role: a.people[who]!.role });
  await actOnCase(db(), { firmId: a.firm.id, caseId, actor: as('author'), action: 'submit' });
  await actOnCase(db(), { firmId: a.firm.id, caseId, actor: as('rev'), action: 'approve' });
  expect(await actOnCase(db(), { firmId: a.firm.id, caseId, actor: as('admin'), action: 'withdraw', reason: WITHDRAW_REASON })).toMatchObject({ ok: true });
  await createCase(db(), { firmId: b.firm.id, authorId: b.people.author!.userId, metadata: { title: 'Other firm secret basin', structureType: 'spillway-basin', sectionShape: 'rectangular', tags: [] }, body: BODY });
  adminA = await sessionOf(a.people.admin!.email, TEST_PASSWORD);
});

describe('audit trail page', () => {
  it('shows a firm admin their firm’s events newest first, in words, with the case linked', async () => {
    const response = await call('/firm/audit', { cookie: adminA });
    expect(response.status).toBe(200);
    const html = await response.text();
    const actions = [...html.matchAll(/<tr data-action="([^"]+)"/g)].map((m) => m[1]);
    expect(actions[0]).toBe('case.withdrawn');
    expect(actions).toEqual(expect.arrayContaining(['case.published', 'case.approved', 'case.submitted', 'case.created', 'member.added', 'firm.created']));
    expect(actions.indexOf('case.withdrawn')).toBeLessThan(actions.indexOf('case.submitted'));
    expect(html).toContain('Submitted for review');
    expect(html).toContain(`href="/cases/${caseId}"`);
    expect(html).toContain('=HYPERLINK(&quot;http://bad.example&quot;), &quot;Weir&quot; basin');
    expect(html).toContain('Superseded by the 2027 survey');
    expect(html).toContain(`admin ${a.people.admin!.email.split('.')[1]!.split('@')[0]}`);
    expect(html).not.toContain('Other firm secret basin');
    expect(html).toContain('Download CSV');
  });

  it('filters by action and by dates, and says when nothing matches', async () => {
    const withdrawn = await (await call('/firm/audit?action=case.withdrawn', { cookie: adminA })).text();
    expect([...withdrawn.matchAll(/<tr data-action="([^"]+)"/g)].map((m) => m[1])).toEqual(['case.withdrawn']);
    expect(withdrawn).toContain('href="/api/v1/firms/audit.csv?action=case.withdrawn"');

    const fromToday = await (await call(`/firm/audit?from=${today()}&to=${today()}`, { cookie: adminA })).text();
    expect(fromToday).toContain('data-action="case.withdrawn"');
    const future = await (await call(`/firm/audit?from=${dayOffset(2)}`, { cookie: adminA })).text();
    expect(future).toContain('No events match');
    const past = await (await call(`/firm/audit?to=${dayOffset(-2)}`, { cookie: adminA })).text();
    expect(past).toContain('No events match');

    const bad = await call('/firm/audit?from=2026-13-45', { cookie: adminA });
    expect(bad.status).toBe(422);
    expect(await bad.text()).toContain('That is not a calendar date.');
    const reversed = await call(`/firm/audit?from=${today()}&to=${dayOffset(-1)}`, { cookie: adminA });
    expect(reversed.status).toBe(422);
  });

  it('pages 50 at a time without repeating or losing an event', async () => {
    const f = await makeFirm({ admin: 'admin' });
    for (let i = 0; i < 60; i++) await recordAudit(db(), { firmId: f.firm.id, actorUserId: f.people.admin!.userId, action: 'case.saved', details: { revision: i + 1 } });
    const cookie = await sessionOf(f.people.admin!.email, TEST_PASSWORD);
    const first = await (await call('/firm/audit', { cookie })).text();
    const idsOf = (html: string) => [...html.matchAll(/<tr data-action/g)].length;
    expect(idsOf(first)).toBe(50);
    expect(first).toContain('revision 60');
    const older = /href="(\/firm\/audit\?before=\d+)"[^>]*rel="next"/.exec(first);
    expect(older).not.toBeNull();
    const second = await (await call(older![1]!, { cookie })).text();
    // 60 saves + the firm's creation and the admin's addition.
    expect(idsOf(second)).toBe(12);
    expect(second).toContain('revision 10');
    expect(second).not.toContain('revision 11<');
    expect(second).not.toContain('rel="next"');
    expect(second).toContain('Newest events');
  });

  it('refuses engineers and reviewers with a clear notice', async () => {
    for (const who of ['author', 'rev']) {
      const cookie = await sessionOf(a.people[who]!.email, TEST_PASSWORD);
      const response = await call('/firm/audit', { cookie });
      expect(response.status).toBe(403);
      const html = await response.text();
      expect(html).toContain('Only a firm admin can see the audit trail');
      expect(html).not.toContain('data-action=');
    }
  });
});

describe('GET /api/v1/firms/audit.csv', () => {
  it('exports the firm’s events as quoted CSV with the formula guard', async () => {
    const response = await call('/api/v1/firms/audit.csv', { cookie: adminA });
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('text/csv; charset=utf-8');
    expect(response.headers.get('content-disposition')).toMatch(new RegExp(`^attachment; filename="sequent-audit-${a.firm.slug}-\\d{4}-\\d{2}-\\d{2}\\.csv"$`));
    const text = (await response.text()).replace(/^\uFEFF/, '');
    expect(text).toContain('\r\n');
    const [header, ...rows] = parseCsv(text);
    expect(header).toEqual(['time', 'actor_name', 'actor_email', 'action', 'target_type', 'target_id', 'target_title', 'details']);
    expect(rows.every((r) => r.length === 8)).toBe(true);
    expect(rows[0]![3]).toBe('case.withdrawn');
    expect(rows[0]![0]).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/);
    expect(rows[0]![2]).toBe(a.people.admin!.email);
    expect(rows[0]![6]).toBe(`'${DANGEROUS_TITLE}`);
    expect(JSON.parse(rows[0]![7]!)).toMatchObject({ reason: WITHDRAW_REASON, revision: 1 });
    expect(text).toContain(`"'=HYPERLINK(""http://bad.example""), ""Weir"" basin"`);
    const firmRow = rows.find((r) => r[3] === 'firm.created')!;
    expect(firmRow[1]).toBe('System');
    expect(text).not.toContain('Other firm secret basin');
    expect(rows.every((r) => r[5] !== b.firm.id)).toBe(true);
  });

  it('applies the same filters, and 422 for bad ones', async () => {
    const rows = parseCsv((await (await call('/api/v1/firms/audit.csv?action=case.approved', { cookie: adminA })).text()).replace(/^\uFEFF/, ''));
    expect(rows.slice(1).map((r) => r[3])).toEqual(['case.approved']);
    const none = parseCsv((await (await call(`/api/v1/firms/audit.csv?from=${dayOffset(2)}`, { cookie: adminA })).text()).replace(/^\uFEFF/, ''));
    expect(none).toHaveLength(1);
    const bad = await call('/api/v1/firms/audit.csv?to=yesterday', { cookie: adminA });
    expect(bad.status).toBe(422);
    expect(await bad.json()).toMatchObject({ error: { code: 'invalid_input' } });
  });

  it('answers 401 signed out and 403 for engineers and reviewers; another firm’s admin sees only theirs', async () => {
    expect((await call('/api/v1/firms/audit.csv')).status).toBe(401);
    for (const who of ['author', 'rev']) {
      const cookie = await sessionOf(a.people[who]!.email, TEST_PASSWORD);
      expect((await call('/api/v1/firms/audit.csv', { cookie })).status).toBe(403);
    }
    const adminB = await sessionOf(b.people.admin!.email, TEST_PASSWORD);
    const text = await (await call('/api/v1/firms/audit.csv', { cookie: adminB })).text();
    expect(text).toContain('Other firm secret basin');
    expect(text).not.toContain('HYPERLINK');
    expect(text).not.toContain(caseId);
  });
});
