/** The review over HTTP: the JSON routes, the case page's forms, the queue, and who may do what. */
import { beforeAll, describe, expect, it } from 'vitest';
import { pool } from '../../src/db/client';
import { call, sessionOf } from '../helpers/app';
import { makeFirm, TEST_PASSWORD, type TestFirm } from '../helpers/firms';

const BODY = 'Outfall check.\n\n```jump outfall\nb = 4 m\nQ = 12 m3/s\ny1 = 0.35 m\n```\n';
const metadata = { title: 'Quillmere outfall apron', structureType: 'outfall', sectionShape: 'rectangular' } as const;

let f: TestFirm;
const cookies: Record<string, string> = {};
let outsider: string;

beforeAll(async () => {
  f = await makeFirm({ author: 'engineer', rev: 'reviewer', rev2: 'reviewer', admin: 'admin', colleague: 'engineer' });
  for (const key of Object.keys(f.people)) cookies[key] = await sessionOf(f.people[key]!.email, TEST_PASSWORD);
  const other = await makeFirm({ rev: 'reviewer' });
  outsider = await sessionOf(other.people.rev!.email, TEST_PASSWORD);
});

async function newCase(): Promise<string> {
  const response = await call('/api/v1/cases', { cookie: cookies.author, json: { ...metadata, body: BODY } });
  expect(response.status).toBe(201);
  return (await response.json()).case.id;
}
const review = (id: string, who: string, json: unknown) => call(`/api/v1/cases/${id}/review`, { cookie: cookies[who] ?? who, json });

describe('POST /api/v1/cases/:id/review', () => {
  it('takes a case from draft to published and answers refusals with fitting codes and messages', async () => {
    const id = await newCase();
    expect((await call(`/api/v1/cases/${id}/review`, { json: { action: 'submit' } })).status).toBe(401);
    expect((await review(id, 'author', { action: 'publish' })).status).toBe(422);
    expect((await review(id, outsider, { action: 'submit' })).status).toBe(404);
    const submitted = await review(id, 'author', { action: 'submit', reviewerIds: [f.people.rev!.userId] });
    expect(submitted.status).toBe(200);
    expect(await submitted.json()).toMatchObject({ ok: true, state: 'in_review' });

    const byEngineer = await review(id, 'colleague', { action: 'approve' });
    expect(byEngineer.status).toBe(403);
    expect((await byEngineer.json()).error).toMatchObject({ code: 'not_reviewer', message: expect.stringContaining('reviewer') });
    expect((await review(id, 'rev2', { action: 'approve' })).status).toBe(403); // not the one asked
    expect((await review(id, 'rev', { action: 'return' })).status).toBe(422); // no comments
    const approved = await review(id, 'rev', { action: 'approve' });
    expect(await approved.json()).toMatchObject({ ok: true, state: 'published', publishes: true });
    const again = await review(id, 'rev', { action: 'approve' });
    expect(again.status).toBe(409);
    expect((await again.json()).error.message).toMatch(/reload/);

    const panel = await (await call(`/api/v1/cases/${id}/review`, { cookie: cookies.colleague })).json();
    expect(panel).toMatchObject({ state: 'published', publishedRevision: 1, checkedBy: [{ reviewerName: `rev ${f.people.rev!.email.split('.')[1]!.split('@')[0]}`, revisionNumber: 1 }] });
    expect((await call(`/api/v1/cases/${id}/review`, { cookie: outsider })).status).toBe(404);
    expect((await review(id, 'admin', { action: 'withdraw' })).status).toBe(422);
    expect(await (await review(id, 'admin', { action: 'withdraw', reason: 'Survey found wrong.' })).json()).toMatchObject({ state: 'withdrawn' });
  });
});

describe('comments over HTTP', () => {
  it('adds, replies, resolves; refuses colleagues, other firms and bad input', async () => {
    const id = await newCase();
    const url = `/api/v1/cases/${id}/comments`;
    expect((await call(url, { json: { body: 'x' } })).status).toBe(401);
    expect((await call(url, { cookie: cookies.rev, json: { body: '   ' } })).status).toBe(422);
    expect((await call(url, { cookie: cookies.colleague, json: { body: 'Nice.' } })).status).toBe(403);
    expect((await call(url, { cookie: outsider, json: { body: 'Hello' } })).status).toBe(404);
    const made = await call(url, { cookie: cookies.rev, json: { body: 'Where is the apron end?', blockIndex: 0 } });
    expect(made.status).toBe(201);
    const { threadId } = await made.json();
    expect((await call(url, { cookie: cookies.author, json: { body: 'At chainage 42 m.', threadId } })).status).toBe(201);
    const listed = await (await call(url, { cookie: cookies.colleague })).json();
    expect(listed).toMatchObject({ open: 1, threads: [{ id: threadId, blockIndex: 0, blockTitle: expect.stringContaining('outfall'), replies: [{ body: 'At chainage 42 m.' }] }] });
    expect((await call(`${url}/${threadId}`, { method: 'PATCH', cookie: outsider, json: { resolved: true } })).status).toBe(404);
    expect((await call(`${url}/${threadId}`, { method: 'PATCH', cookie: cookies.author, json: { resolved: 'yes' } })).status).toBe(422);
    expect((await call(`${url}/${threadId}`, { method: 'PATCH', cookie: cookies.author, json: { resolved: true } })).status).toBe(200);
    expect(await (await call(url, { cookie: cookies.rev })).json()).toMatchObject({ open: 0 });
  });
});

describe('the case page forms and the queue', () => {
  it('submits by form with a redirect, and shows a refusal on the page with its status', async () => {
    const id = await newCase();
    const submitted = await call(`/cases/${id}`, { cookie: cookies.author, form: { intent: 'review', action: 'submit', reviewerIds: f.people.rev2!.userId } });
    expect(submitted.status).toBe(303);
    expect(submitted.headers.get('location')).toBe(`/cases/${id}?done=submitted`);
    const refused = await call(`/cases/${id}`, { cookie: cookies.author, form: { intent: 'review', action: 'submit' } });
    expect(refused.status).toBe(409);
    expect(await refused.text()).toContain('reload to see where it stands');

    const waiting = await (await call('/review', { cookie: cookies.rev2 })).text();
    expect(waiting).toContain(metadata.title);
    expect(waiting).toContain('asked for you');
    // Asked for rev2 only: rev's queue does not list it; the author sees it under "Submitted by me".
    const otherReviewer = await (await call('/review', { cookie: cookies.rev })).text();
    expect(otherReviewer.split('queue-waiting')[1] ?? '').not.toContain(`/cases/${id}`);
    expect(await (await call('/review', { cookie: cookies.author })).text()).toContain(`/cases/${id}`);

    const page = await (await call(`/cases/${id}`, { cookie: cookies.rev2 })).text();
    expect(page).toContain('Approve revision 1');
    const returned = await call(`/cases/${id}`, { cookie: cookies.rev2, form: { intent: 'review', action: 'return', reason: 'Give the apron length.' } });
    expect(returned.headers.get('location')).toBe(`/cases/${id}?done=returned`);
    const authorView = await (await call(`/cases/${id}?done=returned`, { cookie: cookies.author })).text();
    expect(authorView).toContain('Give the apron length.');
    expect(authorView).toContain('Revise');
  });
});

describe('the firm review rule', () => {
  it('lets only an admin ask for two approvals, and records the change', async () => {
    const g = await makeFirm({ admin: 'admin', rev: 'reviewer' });
    const admin = await sessionOf(g.people.admin!.email, TEST_PASSWORD);
    const rev = await sessionOf(g.people.rev!.email, TEST_PASSWORD);
    expect((await call('/firm/members', { cookie: rev, form: { intent: 'review-setting', requiredApprovals: '2' } })).status).toBe(403);
    expect((await call('/firm/members', { cookie: admin, form: { intent: 'review-setting', requiredApprovals: '3' } })).status).toBe(422);
    const saved = await call('/firm/members', { cookie: admin, form: { intent: 'review-setting', requiredApprovals: '2' } });
    expect(saved.status).toBe(200);
    expect(await saved.text()).toContain('two reviewers’ approvals');
    expect(await (await call('/review', { cookie: rev })).text()).toContain('Two reviewers’ approvals publish a case');
  });
});

describe('drift on the case page', () => {
  it('shows a notice naming the block and the figure when the approved snapshot differs from today’s results', async () => {
    const id = await newCase();
    await review(id, 'author', { action: 'submit' });
    await review(id, 'rev', { action: 'approve' });
    const quiet = await (await call(`/cases/${id}`, { cookie: cookies.colleague })).text();
    expect(quiet).not.toContain('data-testid="drift-notice"');
    expect(quiet).toContain('Checked by');
    // As if the solver had given another sequent depth when the reviewer approved.
    const { rows } = await pool().query(`select snapshot from approval where case_id = $1`, [id]);
    const k = rows[0].snapshot.blocks[0].outputs.findIndex((o: { name: string }) => o.name === 'y2');
    const path = `{blocks,0,outputs,${k},si}`;
    await pool().query(`update approval set snapshot = jsonb_set(snapshot, $1::text[], to_jsonb((snapshot #>> $1::text[])::float8 * 1.05)) where case_id = $2`, [path, id]);
    const page = await (await call(`/cases/${id}`, { cookie: cookies.colleague })).text();
    const notice = page.split('data-testid="drift-notice"')[1]?.split('</section>')[0] ?? '';
    expect(notice).toContain('outfall');
    expect(notice).toMatch(/Sequent depth|y2|y<sub>2/);
  });
});
