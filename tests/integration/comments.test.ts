/** Review comments against PostgreSQL: threads, block anchors, resolving, and the approval rule they feed. */
import { describe, expect, it } from 'vitest';
import { db } from '../../src/db/client';
import { createCase, saveCase, type CaseMetadata } from '../../src/lib/cases';
import { actOnCase, addComment, listComments, openCommentCounts, resolveThread, type ReviewRequest } from '../../src/lib/review';
import { makeFirm } from '../helpers/firms';

const BODY = 'Gate check.\n\n```jump toe\nb = 6 m\nQ = 30 m3/s\ny1 = 0.4 m\n```\n';
const metadata: CaseMetadata = { title: 'Tarn Mill sluice', structureType: 'gate-tailwater', sectionShape: 'rectangular', tags: [] };

async function setUp() {
  const f = await makeFirm({ author: 'engineer', rev: 'reviewer', rev2: 'reviewer', colleague: 'engineer' });
  const created = await createCase(db(), { firmId: f.firm.id, authorId: f.people.author!.userId, metadata, body: BODY });
  const who = (k: string) => ({ userId: f.people[k]!.userId, role: f.people[k]!.role });
  const comment = (k: string, body: string, extra: { threadId?: string; blockIndex?: number } = {}) =>
    addComment(db(), { firmId: f.firm.id, caseId: created.id, commenter: who(k), comment: { body, ...extra } });
  const act = (k: string, action: ReviewRequest['action'], reason?: string) =>
    actOnCase(db(), { firmId: f.firm.id, caseId: created.id, actor: who(k), action, ...(reason ? { reason } : {}) });
  const resolve = (k: string, threadId: string, resolved = true) =>
    resolveThread(db(), { firmId: f.firm.id, caseId: created.id, threadId, commenter: who(k), resolved });
  return { f, caseId: created.id, comment, act, resolve };
}

describe('review comments', () => {
  it('keeps threads with replies, anchored to a block or the whole case', async () => {
    const { f, caseId, comment } = await setUp();
    const onBlock = await comment('rev', 'Is y1 measured at the vena contracta?', { blockIndex: 0 });
    expect(onBlock).toMatchObject({ ok: true, revisionNumber: 1 });
    if (!onBlock.ok) return;
    await comment('author', 'Yes: 0.61 × gate opening.', { threadId: onBlock.threadId });
    await comment('rev', 'Add the tailwater rating source.');
    const threads = await listComments(db(), f.firm.id, caseId);
    expect(threads).toHaveLength(2);
    expect(threads[0]).toMatchObject({ blockIndex: 0, blockTitle: 'Stationary hydraulic jump (toe)', replies: [{ body: 'Yes: 0.61 × gate opening.' }] });
    expect(threads[1]).toMatchObject({ blockIndex: null, blockTitle: null, replies: [] });
    // A block index past the last block anchors to the whole case.
    const beyond = await comment('rev', 'Which block?', { blockIndex: 7 });
    expect(beyond.ok).toBe(true);
    expect((await listComments(db(), f.firm.id, caseId))[2]).toMatchObject({ blockIndex: null });
  });

  it('names a block anchor from the latest revision’s stored results', async () => {
    const { f, caseId, comment } = await setUp();
    const gate = '\n```gate sluice\nb = 4 m\na = 0.5 m\nCc = 0.61\ny0 = 3.2 m\n```\n';
    expect(await saveCase(db(), { firmId: f.firm.id, caseId, userId: f.people.author!.userId, baseRevision: 1, body: BODY + gate })).toMatchObject({ ok: true });
    const onGate = await comment('rev', 'Which contraction coefficient source?', { blockIndex: 1 });
    expect(onGate).toMatchObject({ ok: true, revisionNumber: 2 });
    expect((await listComments(db(), f.firm.id, caseId))[0]).toMatchObject({ blockIndex: 1, blockTitle: 'Sluice gate (free flow) (sluice)', revisionNumber: 2 });
  });

  it('lets only the author and reviewers take part, and only in the firm', async () => {
    const { f, caseId, comment } = await setUp();
    expect(await comment('colleague', 'Looks fine to me.')).toEqual({ ok: false, reason: 'not_participant' });
    const other = await makeFirm({ rev: 'reviewer' });
    const outside = await addComment(db(), { firmId: other.firm.id, caseId, commenter: { userId: other.people.rev!.userId, role: 'reviewer' }, comment: { body: 'Hello' } });
    expect(outside).toEqual({ ok: false, reason: 'not_found' });
    expect(await listComments(db(), other.firm.id, caseId)).toEqual([]);
    expect(await comment('rev', 'Reply', { threadId: 'no-such-thread' })).toEqual({ ok: false, reason: 'thread_not_found' });
    void f;
  });

  it('stops a reviewer approving while their own comments are open; resolving clears the way; a reply reopens', async () => {
    const { caseId, comment, act, resolve, f } = await setUp();
    await act('author', 'submit');
    const asked = await comment('rev', 'Check the jump length against the apron.', { blockIndex: 0 });
    if (!asked.ok) throw new Error('comment failed');
    expect(await openCommentCounts(db(), caseId, f.people.rev!.userId)).toEqual({ open: 1, mine: 1 });
    expect(await act('rev', 'approve')).toMatchObject({ ok: false, reason: 'open_comments', status: 409, message: 'Resolve your open comment before approving.' });
    expect(await resolve('author', asked.threadId)).toEqual({ ok: true, resolved: true });
    const reply = await comment('rev', 'Not yet: the apron is 2 m short.', { threadId: asked.threadId });
    expect(reply).toMatchObject({ ok: true, reopened: true });
    expect(await act('rev', 'approve')).toMatchObject({ ok: false, reason: 'open_comments' });
    await resolve('rev', asked.threadId);
    expect(await act('rev', 'approve')).toMatchObject({ ok: true, state: 'published' });
  });

  it('turns the comments of a return into a thread the author resolves before the reviewer can approve', async () => {
    const { f, caseId, act, resolve } = await setUp();
    await act('author', 'submit');
    await act('rev', 'return', 'State the design flood return period.');
    const [thread] = await listComments(db(), f.firm.id, caseId);
    expect(thread).toMatchObject({ body: 'State the design flood return period.', authorId: f.people.rev!.userId, resolvedAt: null });
    await act('author', 'submit');
    expect(await act('rev', 'approve')).toMatchObject({ ok: false, reason: 'open_comments' });
    await resolve('author', thread!.id);
    expect(await act('rev', 'approve')).toMatchObject({ ok: true, state: 'published' });
  });
});
