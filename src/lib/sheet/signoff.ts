/**
 * Who checked and who approved one revision of a case, for its calculation sheet: the
 * standing approvals of that revision (not cancelled by a later edit), and whether one of
 * them completed a round that published it (the last approval of that round is the one
 * that published the revision).
 */
import { and, asc, eq, isNull } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { approval, reviewRound, user } from '../../db/schema';

/** One standing approval of the revision. */
export interface SheetApproval {
  reviewerId: string;
  reviewerName: string;
  createdAt: Date;
  solverVersion: string;
}

/** The sign-off of one revision. */
export interface SheetSignoff {
  /** Standing approvals, oldest first ("checked by"). */
  checkedBy: SheetApproval[];
  /** The approval that published the revision; null: the revision was never published. */
  approvedBy: SheetApproval | null;
}

/** The sign-off of revision `revision` of the firm's case `caseId`. */
export async function getSheetSignoff(database: Database, firmId: string, caseId: string, revision: number): Promise<SheetSignoff> {
  const rows = await database
    .select({
      reviewerId: approval.reviewerId,
      reviewerName: user.name,
      createdAt: approval.createdAt,
      solverVersion: approval.solverVersion,
      outcome: reviewRound.outcome,
    })
    .from(approval)
    .innerJoin(user, eq(user.id, approval.reviewerId))
    .innerJoin(reviewRound, eq(reviewRound.id, approval.roundId))
    .where(and(eq(approval.firmId, firmId), eq(approval.caseId, caseId), eq(approval.revisionNumber, revision), isNull(approval.cancelledAt)))
    .orderBy(asc(approval.createdAt));
  const checkedBy = rows.map(({ outcome: _outcome, ...entry }) => entry);
  const publishing = rows.filter((r) => r.outcome === 'published').at(-1);
  return { checkedBy, approvedBy: publishing ? checkedBy[rows.indexOf(publishing)]! : null };
}
