/**
 * What the review panel of a case page shows: the open round (who submitted, whom they
 * asked, the approvals so far), who checked the published revision, the firm's reviewers
 * (to ask for on submission), the comment threads and the case's review history.
 */
import { and, asc, desc, eq, inArray, isNull } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { approval, auditEvent, member, reviewRound, user } from '../../db/schema';
import { listComments, type CommentThread } from './comments';
import { requiredApprovalsOf } from './settings';

/** A person by id and name. */
export interface Person {
  userId: string;
  name: string;
}

/** A standing approval: who checked which revision, when, with which solver. */
export interface ApprovalEntry {
  reviewerId: string;
  reviewerName: string;
  revisionNumber: number;
  solverVersion: string;
  createdAt: Date;
}

/** One event of the case's review history, newest first. */
export interface ReviewEvent {
  action: string;
  actorName: string | null;
  createdAt: Date;
  details: Record<string, unknown>;
}

/** Everything the review panel shows. */
export interface ReviewPanel {
  requiredApprovals: number;
  round: {
    submittedByName: string;
    submittedAt: Date;
    submittedRevision: number;
    /** Reviewers asked for; empty: the firm's reviewer pool. */
    reviewers: Person[];
    /** Approvals of the revision under review that still stand. */
    approvals: ApprovalEntry[];
  } | null;
  /** Standing approvals of the published revision ("checked by … on …"). */
  checkedBy: ApprovalEntry[];
  /** The firm's reviewers. */
  reviewers: Person[];
  threads: CommentThread[];
  openThreads: number;
  history: ReviewEvent[];
}

/** The review actions recorded against a case, as history shows them. */
const REVIEW_EVENTS = [
  'case.submitted',
  'case.returned',
  'case.approved',
  'case.approvals_cancelled',
  'case.published',
  'case.superseded',
  'case.withdrawn',
] as const;

const approvalColumns = {
  reviewerId: approval.reviewerId,
  reviewerName: user.name,
  revisionNumber: approval.revisionNumber,
  solverVersion: approval.solverVersion,
  createdAt: approval.createdAt,
};

/** The review panel of a case of the firm (`latestRevision` and `publishedRevision` from the case row). */
export async function getReviewPanel(
  database: Queryable,
  firmId: string,
  caseFacts: { id: string; latestRevision: number; publishedRevision: number | null },
): Promise<ReviewPanel> {
  const caseId = caseFacts.id;
  const [openRound] = await database
    .select({ id: reviewRound.id, submittedAt: reviewRound.submittedAt, submittedRevision: reviewRound.submittedRevision, reviewerIds: reviewRound.reviewerIds, submittedByName: user.name })
    .from(reviewRound)
    .innerJoin(user, eq(user.id, reviewRound.submittedBy))
    .where(and(eq(reviewRound.firmId, firmId), eq(reviewRound.caseId, caseId), isNull(reviewRound.outcome)));

  const [reviewers, roundApprovals, checkedBy, threads, history, requiredApprovals] = await Promise.all([
    database
      .select({ userId: user.id, name: user.name })
      .from(member)
      .innerJoin(user, eq(user.id, member.userId))
      .where(and(eq(member.organizationId, firmId), eq(member.role, 'reviewer')))
      .orderBy(asc(user.name)),
    openRound
      ? database
          .select(approvalColumns)
          .from(approval)
          .innerJoin(user, eq(user.id, approval.reviewerId))
          .where(and(eq(approval.roundId, openRound.id), eq(approval.revisionNumber, caseFacts.latestRevision), isNull(approval.cancelledAt)))
          .orderBy(asc(approval.createdAt))
      : Promise.resolve([]),
    caseFacts.publishedRevision === null
      ? Promise.resolve([])
      : database
          .select(approvalColumns)
          .from(approval)
          .innerJoin(user, eq(user.id, approval.reviewerId))
          .where(and(eq(approval.firmId, firmId), eq(approval.caseId, caseId), eq(approval.revisionNumber, caseFacts.publishedRevision), isNull(approval.cancelledAt)))
          .orderBy(asc(approval.createdAt)),
    listComments(database, firmId, caseId),
    database
      .select({ action: auditEvent.action, actorName: user.name, createdAt: auditEvent.createdAt, details: auditEvent.details })
      .from(auditEvent)
      .leftJoin(user, eq(user.id, auditEvent.actorUserId))
      .where(and(eq(auditEvent.targetId, caseId), eq(auditEvent.firmId, firmId), inArray(auditEvent.action, [...REVIEW_EVENTS])))
      .orderBy(desc(auditEvent.createdAt), desc(auditEvent.id))
      .limit(30),
    requiredApprovalsOf(database, firmId),
  ]);

  const byId = new Map(reviewers.map((r) => [r.userId, r]));
  return {
    requiredApprovals,
    round: openRound
      ? {
          submittedByName: openRound.submittedByName,
          submittedAt: openRound.submittedAt,
          submittedRevision: openRound.submittedRevision,
          reviewers: openRound.reviewerIds.map((id) => byId.get(id) ?? { userId: id, name: 'a former member' }),
          approvals: roundApprovals,
        }
      : null,
    checkedBy,
    reviewers,
    threads,
    openThreads: threads.filter((t) => !t.resolvedAt).length,
    history,
  };
}
