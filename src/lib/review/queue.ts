/**
 * The review queue: cases waiting for the reviewer's check, and cases the author has
 * submitted (in review or returned), each with its age, open comments and approvals.
 */
import { and, desc, eq, inArray, isNull, ne, or, sql } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { approval, caseFile, reviewComment, reviewRound, user } from '../../db/schema';
import type { CaseState } from '../cases/states';
import { requiredApprovalsOf } from './settings';

/** One line of the queue. */
export interface QueueEntry {
  caseId: string;
  title: string;
  structureType: string;
  state: CaseState;
  authorName: string;
  latestRevision: number;
  /** When the case was last submitted (the round's start). */
  submittedAt: Date;
  /** Reviewers asked for by id; empty: the firm's pool. */
  reviewerIds: string[];
  openThreads: number;
  /** Standing approvals of the latest revision. */
  approverIds: string[];
}

/** Both lists of the queue, oldest submission first (the longest wait on top). */
export interface ReviewQueue {
  waiting: QueueEntry[];
  submitted: QueueEntry[];
  requiredApprovals: number;
}

const openThreads = sql<number>`(select count(*)::int from ${reviewComment} c where c.case_id = ${caseFile.id} and c.thread_id is null and c.resolved_at is null)`;
const approverIds = sql<string[]>`(select coalesce(array_agg(a.reviewer_id order by a.created_at), '{}') from ${approval} a where a.round_id = ${reviewRound.id} and a.revision_number = ${caseFile.latestRevision} and a.cancelled_at is null)`;

const columns = {
  caseId: caseFile.id,
  title: caseFile.title,
  structureType: caseFile.structureType,
  state: caseFile.state,
  authorName: user.name,
  latestRevision: caseFile.latestRevision,
  submittedAt: reviewRound.submittedAt,
  reviewerIds: reviewRound.reviewerIds,
  openThreads: openThreads.as('open_threads'),
  approverIds: approverIds.as('approver_ids'),
};

/** The queue of `userId` in the firm; `reviews` says whether they check cases (the waiting list). */
export async function listReviewQueue(database: Queryable, firmId: string, userId: string, reviews: boolean): Promise<ReviewQueue> {
  // The latest round of each case: the open one in review, the returned one when returned.
  const latestRound = sql`${reviewRound.submittedAt} = (select max(r.submitted_at) from ${reviewRound} r where r.case_id = ${caseFile.id})`;
  const [waiting, submitted, requiredApprovals] = await Promise.all([
    reviews
      ? database
          .select(columns)
          .from(caseFile)
          .innerJoin(reviewRound, and(eq(reviewRound.caseId, caseFile.id), isNull(reviewRound.outcome)))
          .innerJoin(user, eq(user.id, caseFile.authorId))
          .where(
            and(
              eq(caseFile.firmId, firmId),
              eq(caseFile.state, 'in_review'),
              ne(caseFile.authorId, userId),
              or(sql`cardinality(${reviewRound.reviewerIds}) = 0`, sql`${userId} = any(${reviewRound.reviewerIds})`),
            ),
          )
          .orderBy(reviewRound.submittedAt)
          .limit(200)
      : Promise.resolve([]),
    database
      .select(columns)
      .from(caseFile)
      .innerJoin(reviewRound, and(eq(reviewRound.caseId, caseFile.id), latestRound))
      .innerJoin(user, eq(user.id, caseFile.authorId))
      .where(and(eq(caseFile.firmId, firmId), eq(caseFile.authorId, userId), inArray(caseFile.state, ['in_review', 'returned'])))
      .orderBy(desc(caseFile.state), reviewRound.submittedAt)
      .limit(200),
    requiredApprovalsOf(database, firmId),
  ]);
  return { waiting, submitted, requiredApprovals };
}
