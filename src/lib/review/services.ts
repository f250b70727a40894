/**
 * The review transitions against the database. Each runs in one transaction that first
 * locks the case row (`SELECT … FOR UPDATE`), reads what the decision needs, lets
 * `decideReview` decide, then writes the new state, the round or approval and the audit
 * events together. Two concurrent approvals or submits are serialised by the lock: the
 * second sees the state the first left and is refused with 409.
 */
import { randomUUID } from 'node:crypto';
import { and, eq, gt, inArray, isNull, sql } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { approval, caseFile, caseRevision, member, reviewComment, reviewRound } from '../../db/schema';
import { recordAudit } from '../audit';
import type { Role } from '../auth/roles';
import { evaluateRevision } from '../attachments/blockFiles';
import { lockCase, type CaseState } from '../cases';
import { SOLVER_VERSION } from '../solver';
import { wakeMailWorker } from '../mail';
import { queueSearchUpdate, wakeSearchWorker } from '../search';
import { openCommentCounts } from './comments';
import { notifyReview, type ReviewNotice } from './notify';
import { requiredApprovalsOf } from './settings';
import { decideReview, type ReviewAction, type ReviewRefusal } from './transitions';

/** A review action as a route hands it over (already validated). */
export interface ReviewRequest {
  firmId: string;
  caseId: string;
  actor: { userId: string; role: Role };
  action: ReviewAction;
  /** Comments of a return, reason of a withdrawal. */
  reason?: string;
  /** With submit: the reviewers asked for (empty or absent: the firm's reviewer pool). */
  reviewerIds?: readonly string[];
}

/** The outcome of {@link actOnCase}. */
export type ReviewResult =
  | { ok: true; state: CaseState; publishes: boolean; revision: number; approvals: number; requiredApprovals: number }
  | { ok: false; reason: ReviewRefusal | 'not_found' | 'unknown_reviewer'; status: 403 | 404 | 409 | 422; message: string };

/** Applies `request` to the case; see the module comment. Never throws for a refused action. */
export async function actOnCase(database: Database, request: ReviewRequest): Promise<ReviewResult> {
  const result = await applyReview(database, request);
  // The transaction has committed: the messages and search updates it queued can go now.
  if (result.ok) {
    wakeMailWorker();
    if (result.publishes || result.state === 'withdrawn') wakeSearchWorker();
  }
  return result;
}

function applyReview(database: Database, request: ReviewRequest): Promise<ReviewResult> {
  return database.transaction(async (tx): Promise<ReviewResult> => {
    const current = await lockCase(tx, request.firmId, request.caseId);
    if (!current) return { ok: false, reason: 'not_found', status: 404, message: 'No such case in this firm.' };

    const [round] = await tx
      .select()
      .from(reviewRound)
      .where(and(eq(reviewRound.caseId, current.id), isNull(reviewRound.outcome)));
    const standing = round
      ? await tx
          .select({ reviewerId: approval.reviewerId })
          .from(approval)
          .where(and(eq(approval.roundId, round.id), eq(approval.revisionNumber, current.latestRevision), isNull(approval.cancelledAt)))
      : [];
    // Everyone who wrote a revision since the last publication edited the version under review.
    const editors = await tx
      .selectDistinct({ id: caseRevision.authorId })
      .from(caseRevision)
      .where(and(eq(caseRevision.caseId, current.id), gt(caseRevision.number, current.publishedRevision ?? 0)));
    const requiredApprovals = await requiredApprovalsOf(tx, request.firmId);
    const openComments = request.action === 'approve' ? (await openCommentCounts(tx, current.id, request.actor.userId)).mine : 0;

    const decision = decideReview(
      request.action,
      { ...request.actor, openComments },
      {
        state: current.state,
        authorId: current.authorId,
        editorIds: editors.map((e) => e.id),
        requestedReviewerIds: round?.reviewerIds ?? [],
        approverIds: standing.map((a) => a.reviewerId),
        requiredApprovals,
      },
      { reason: request.reason },
    );
    if (!decision.ok) return decision;

    const now = new Date();
    const notified = { firmId: request.firmId, caseId: current.id, title: current.title, revision: current.latestRevision, authorId: current.authorId };
    const notify = (notice: ReviewNotice) => notifyReview(tx, notified, request.actor.userId, notice);
    const audit = (action: Parameters<typeof recordAudit>[1]['action'], details: Record<string, unknown> = {}) =>
      recordAudit(tx, { firmId: request.firmId, actorUserId: request.actor.userId, action, targetType: 'case', targetId: current.id, details: { revision: current.latestRevision, ...details } });

    if (request.action === 'submit') {
      const reviewerIds = [...new Set(request.reviewerIds ?? [])];
      if (reviewerIds.length > 0) {
        const found = await tx
          .select({ userId: member.userId })
          .from(member)
          .where(and(eq(member.organizationId, request.firmId), eq(member.role, 'reviewer'), inArray(member.userId, reviewerIds)));
        const editorIds = new Set(editors.map((e) => e.id));
        if (found.length !== reviewerIds.length || reviewerIds.some((id) => editorIds.has(id))) {
          return { ok: false, reason: 'unknown_reviewer', status: 422, message: 'Choose reviewers of this firm who neither wrote nor edited the case.' };
        }
      }
      await tx.insert(reviewRound).values({ id: randomUUID(), caseId: current.id, firmId: request.firmId, submittedRevision: current.latestRevision, submittedBy: request.actor.userId, reviewerIds });
      await audit('case.submitted', { reviewerIds });
      await notify({ kind: 'submitted', reviewerIds });
    } else if (request.action === 'return') {
      await tx.update(reviewRound).set({ outcome: 'returned', closedAt: now }).where(eq(reviewRound.id, round!.id));
      await audit('case.returned', { comments: request.reason?.trim() });
      // The return's comments open a thread on the case, which the author resolves once fixed.
      await tx.insert(reviewComment).values({
        id: randomUUID(),
        caseId: current.id,
        firmId: request.firmId,
        authorId: request.actor.userId,
        body: request.reason!.trim(),
        revisionNumber: current.latestRevision,
      });
      await notify({ kind: 'returned', comments: request.reason!.trim() });
    } else if (request.action === 'approve') {
      // Approval re-runs every block: the snapshot is what the reviewer checked, with today's solver.
      const [latest] = await tx
        .select({ body: caseRevision.body })
        .from(caseRevision)
        .where(and(eq(caseRevision.caseId, current.id), eq(caseRevision.number, current.latestRevision)));
      await tx.insert(approval).values({
        id: randomUUID(),
        roundId: round!.id,
        caseId: current.id,
        firmId: request.firmId,
        revisionNumber: current.latestRevision,
        reviewerId: request.actor.userId,
        solverVersion: SOLVER_VERSION,
        snapshot: await evaluateRevision(tx, { firmId: request.firmId, caseId: current.id, revision: current.latestRevision, body: latest?.body ?? '' }),
      });
      await audit('case.approved', { solverVersion: SOLVER_VERSION, approvals: decision.approverIds.length, requiredApprovals });
      if (decision.publishes) {
        await tx.update(reviewRound).set({ outcome: 'published', closedAt: now }).where(eq(reviewRound.id, round!.id));
        if (current.publishedRevision !== null) await audit('case.superseded', { supersededRevision: current.publishedRevision });
        await audit('case.published');
        await notify({ kind: 'published', approverIds: decision.approverIds });
      } else {
        await notify({ kind: 'approved', approvals: decision.approverIds.length, requiredApprovals });
      }
    } else {
      await audit('case.withdrawn', { reason: request.reason?.trim() });
      const checkers = await tx
        .select({ reviewerId: approval.reviewerId })
        .from(approval)
        .where(and(eq(approval.caseId, current.id), eq(approval.revisionNumber, current.publishedRevision ?? current.latestRevision), isNull(approval.cancelledAt)));
      await notify({ kind: 'withdrawn', reason: request.reason!.trim(), notifyIds: checkers.map((c) => c.reviewerId) });
    }

    // Precedent search follows publication: the new revision replaces the old in the index,
    // a withdrawn case leaves it. Same transaction, so the index never misses either.
    if (decision.publishes) {
      await queueSearchUpdate(tx, { firmId: request.firmId, caseId: current.id, reason: current.publishedRevision === null ? 'published' : 'superseded' });
    } else if (request.action === 'withdraw') {
      await queueSearchUpdate(tx, { firmId: request.firmId, caseId: current.id, reason: 'withdrawn' });
    }
    await tx
      .update(caseFile)
      .set({ state: decision.to, updatedAt: now, ...(decision.publishes ? { publishedRevision: sql`${caseFile.latestRevision}` } : {}) })
      .where(eq(caseFile.id, current.id));
    return { ok: true, state: decision.to, publishes: decision.publishes, revision: current.latestRevision, approvals: decision.approverIds.length, requiredApprovals };
  });
}
