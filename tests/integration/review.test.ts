/** The review services against PostgreSQL: transitions, rules, races and the records they leave. */
import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '../../src/db/client';
import { approval, auditEvent, caseFile, firmReviewSetting } from '../../src/db/schema';
import { createCase, saveCase, type CaseMetadata } from '../../src/lib/cases';
import { actOnCase, type ReviewRequest } from '../../src/lib/review';
import { SOLVER_VERSION } from '../../src/lib/solver';
import { makeFirm } from '../helpers/firms';

const BODY = 'Basin check.\n\n```jump basin\nb = 12 m\nQ = 85 m3/s\ny1 = 0.53 m\n```\n';
const metadata: CaseMetadata = { title: 'Orrin Beck weir stilling basin', structureType: 'spillway-basin', sectionShape: 'rectangular', tags: [] };

async function setUp(requiredApprovals = 1) {
  const f = await makeFirm({ author: 'engineer', rev: 'reviewer', rev2: 'reviewer', admin: 'admin', colleague: 'engineer' });
  if (requiredApprovals !== 1) await db().insert(firmReviewSetting).values({ firmId: f.firm.id, requiredApprovals });
  const created = await createCase(db(), { firmId: f.firm.id, authorId: f.people.author!.userId, metadata, body: BODY });
  const as = (who: keyof typeof f.people) => ({ userId: f.people[who]!.userId, role: f.people[who]!.role });
  const act = (who: keyof typeof f.people, action: ReviewRequest['action'], extra: Partial<ReviewRequest> = {}) =>
    actOnCase(db(), { firmId: f.firm.id, caseId: created.id, actor: as(who), action, ...extra });
  const edit = (body: string, baseRevision: number, metadataPatch?: { title: string }) =>
    saveCase(db(), { firmId: f.firm.id, caseId: created.id, userId: f.people.author!.userId, baseRevision, body, ...(metadataPatch ? { metadata: metadataPatch } : {}) });
  return { f, caseId: created.id, act, edit };
}

const stateOf = async (caseId: string) => (await db().select().from(caseFile).where(eq(caseFile.id, caseId)))[0]!;

describe('review services', () => {
  it('runs submit → approve → published, recording the approval with its solver version and snapshot', async () => {
    const { f, caseId, act } = await setUp();
    expect(await act('author', 'submit')).toMatchObject({ ok: true, state: 'in_review' });
    expect(await act('rev', 'approve')).toMatchObject({ ok: true, state: 'published', publishes: true, approvals: 1 });
    const row = await stateOf(caseId);
    expect(row).toMatchObject({ state: 'published', publishedRevision: 1 });
    const [given] = await db().select().from(approval).where(eq(approval.caseId, caseId));
    expect(given).toMatchObject({ reviewerId: f.people.rev!.userId, revisionNumber: 1, solverVersion: SOLVER_VERSION });
    expect(given!.snapshot.blocks[0]!.name).toBe('basin');
    const actions = (await db().select({ a: auditEvent.action }).from(auditEvent).where(and(eq(auditEvent.firmId, f.firm.id), eq(auditEvent.targetId, caseId)))).map((r) => r.a);
    expect(actions).toEqual(expect.arrayContaining(['case.submitted', 'case.approved', 'case.published']));
  });

  it('refuses self-approval, engineers and admins approving, and a second submit', async () => {
    const { act } = await setUp();
    expect(await act('author', 'approve')).toMatchObject({ ok: false, status: 403 });
    await act('author', 'submit');
    expect(await act('author', 'submit')).toMatchObject({ ok: false, reason: 'wrong_state', status: 409 });
    expect(await act('colleague', 'approve')).toMatchObject({ ok: false, reason: 'not_reviewer', status: 403 });
    expect(await act('admin', 'approve')).toMatchObject({ ok: false, reason: 'not_reviewer', status: 403 });
  });

  it('lets exactly one of two concurrent approvals win', async () => {
    const { caseId, act } = await setUp();
    await act('author', 'submit');
    const results = await Promise.all([act('rev', 'approve'), act('rev2', 'approve')]);
    expect(results.filter((r) => r.ok)).toHaveLength(1);
    expect(results.find((r) => !r.ok)).toMatchObject({ reason: 'wrong_state', status: 409 });
    expect(await db().select().from(approval).where(eq(approval.caseId, caseId))).toHaveLength(1);
  });

  it('publishes on the second approval when the firm asks for two', async () => {
    const { caseId, act } = await setUp(2);
    await act('author', 'submit');
    expect(await act('rev', 'approve')).toMatchObject({ ok: true, state: 'in_review', approvals: 1, requiredApprovals: 2 });
    expect(await act('rev', 'approve')).toMatchObject({ ok: false, reason: 'already_approved' });
    expect(await act('rev2', 'approve')).toMatchObject({ ok: true, state: 'published' });
    expect((await stateOf(caseId)).publishedRevision).toBe(1);
  });

  it('returns with comments, then takes the resubmission; only the reviewers asked for may act', async () => {
    const { f, act } = await setUp();
    expect(await act('author', 'submit', { reviewerIds: [f.people.author!.userId] })).toMatchObject({ ok: false, reason: 'unknown_reviewer', status: 422 });
    await act('author', 'submit', { reviewerIds: [f.people.rev!.userId] });
    expect(await act('rev2', 'return', { reason: 'Check y1.' })).toMatchObject({ ok: false, reason: 'not_requested' });
    expect(await act('rev', 'return')).toMatchObject({ ok: false, reason: 'reason_required', status: 422 });
    expect(await act('rev', 'return', { reason: 'Check the toe depth against the gate opening.' })).toMatchObject({ ok: true, state: 'returned' });
    expect(await act('author', 'submit')).toMatchObject({ ok: true, state: 'in_review' });
    expect(await act('rev2', 'approve')).toMatchObject({ ok: true, state: 'published' });
  });

  it('withdraws a published case with a reason; another firm sees no such case', async () => {
    const { caseId, act } = await setUp();
    await act('author', 'submit');
    await act('rev', 'approve');
    expect(await act('admin', 'withdraw')).toMatchObject({ ok: false, reason: 'reason_required' });
    expect(await act('admin', 'withdraw', { reason: 'Tailwater rating revised by the river authority.' })).toMatchObject({ ok: true, state: 'withdrawn' });
    const other = await makeFirm({ rev: 'reviewer' });
    const outside = await actOnCase(db(), { firmId: other.firm.id, caseId, actor: { userId: other.people.rev!.userId, role: 'reviewer' }, action: 'withdraw', reason: 'x' });
    expect(outside).toMatchObject({ ok: false, reason: 'not_found', status: 404 });
  });

  describe('editing during review', () => {
    it('lets the author revise a returned case and resubmit it', async () => {
      const { caseId, act, edit } = await setUp();
      await act('author', 'submit');
      await act('rev', 'return', { reason: 'Check the tailwater at the design flood.' });
      const saved = await edit(BODY + '\nTailwater checked at the design flood.\n', 1);
      expect(saved).toMatchObject({ ok: true, revisionCreated: true, startedDraft: false, cancelledApprovals: [] });
      expect(await stateOf(caseId)).toMatchObject({ state: 'returned', latestRevision: 2 });
      expect(await act('author', 'submit')).toMatchObject({ ok: true, state: 'in_review', revision: 2 });
    });

    it('cancels the approvals given so far when the case is edited in review, and names those reviewers', async () => {
      const { f, caseId, act, edit } = await setUp(2);
      await act('author', 'submit');
      await act('rev', 'approve');
      const saved = await edit(BODY + '\nApron level corrected.\n', 1);
      expect(saved).toMatchObject({ ok: true, cancelledApprovals: [f.people.rev!.userId] });
      expect(await stateOf(caseId)).toMatchObject({ state: 'in_review', latestRevision: 2 });
      const [given] = await db().select().from(approval).where(eq(approval.caseId, caseId));
      expect(given!.cancelledAt).toBeInstanceOf(Date);
      // The cancelled approval no longer counts: it takes two fresh approvals of revision 2.
      expect(await act('rev2', 'approve')).toMatchObject({ ok: true, state: 'in_review', approvals: 1 });
      expect(await act('rev', 'approve')).toMatchObject({ ok: true, state: 'published', revision: 2 });
      const actions = (await db().select({ a: auditEvent.action }).from(auditEvent).where(eq(auditEvent.targetId, caseId))).map((r) => r.a);
      expect(actions).toContain('case.approvals_cancelled');
    });

    it('starts a new draft when a published case is edited, keeps the publication, and supersedes it on the next publish', async () => {
      const { caseId, act, edit } = await setUp();
      await act('author', 'submit');
      await act('rev', 'approve');
      // A metadata-only change of a published case is a new revision too: the published one never changes.
      const renamed = await edit(BODY, 1, { title: 'Orrin Beck weir stilling basin (raised crest)' });
      expect(renamed).toMatchObject({ ok: true, revisionCreated: true, startedDraft: true });
      expect(await stateOf(caseId)).toMatchObject({ state: 'draft', latestRevision: 2, publishedRevision: 1 });
      await act('author', 'submit');
      expect(await act('rev', 'approve')).toMatchObject({ ok: true, state: 'published', revision: 2 });
      expect(await stateOf(caseId)).toMatchObject({ state: 'published', publishedRevision: 2 });
      const superseded = await db().select().from(auditEvent).where(and(eq(auditEvent.targetId, caseId), eq(auditEvent.action, 'case.superseded')));
      expect(superseded[0]!.details).toMatchObject({ supersededRevision: 1 });
    });

    it('refuses edits of a withdrawn case and edits by anyone but the author', async () => {
      const { f, caseId, act, edit } = await setUp();
      await act('author', 'submit');
      await act('rev', 'approve');
      const byReviewer = await saveCase(db(), { firmId: f.firm.id, caseId, userId: f.people.rev!.userId, baseRevision: 1, body: 'x' });
      expect(byReviewer).toMatchObject({ ok: false, reason: 'forbidden' });
      await act('admin', 'withdraw', { reason: 'Superseded by the 2026 survey.' });
      expect(await edit(BODY + '\nmore', 1)).toMatchObject({ ok: false, reason: 'not_editable' });
    });
  });
});
