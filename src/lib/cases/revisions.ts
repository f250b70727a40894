import { and, desc, eq } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { caseRevision } from '../../db/schema';
import { diffRevisions, type TextDiff } from './diff';
import { findRevision, revisionAuthor, revisionSummaryColumns } from './rows';
import type { CaseRevisionDetail, RevisionSummary } from './types';

/**
 * The revisions of a case of the firm, newest first, without bodies or results; null when
 * the case is not the firm's (or does not exist).
 */
export async function listRevisions(database: Queryable, firmId: string, caseId: string): Promise<RevisionSummary[] | null> {
  // Every case has its first revision from the moment it exists: no rows means no such case
  // in this firm, so one query answers both.
  const rows = await database
    .select(revisionSummaryColumns)
    .from(caseRevision)
    .innerJoin(revisionAuthor, eq(revisionAuthor.id, caseRevision.authorId))
    .where(and(eq(caseRevision.firmId, firmId), eq(caseRevision.caseId, caseId)))
    .orderBy(desc(caseRevision.number));
  return rows.length > 0 ? rows : null;
}

/** One revision of a case of the firm, with its body and stored results, or null. */
export async function getRevision(
  database: Queryable,
  firmId: string,
  caseId: string,
  number: number,
): Promise<CaseRevisionDetail | null> {
  if (!Number.isSafeInteger(number) || number < 1) return null;
  return findRevision(database, firmId, caseId, number);
}

/** The difference between two revisions of a case, with who wrote each and when. */
export interface RevisionDiff {
  from: { number: number; authorName: string; createdAt: Date };
  to: { number: number; authorName: string; createdAt: Date };
  diff: TextDiff;
}

/** The outcome of {@link diffCaseRevisions}. */
export type RevisionDiffResult = { ok: true; value: RevisionDiff } | { ok: false; reason: 'not_found' };

/**
 * The line difference of the bodies of revisions `from` and `to` of a case of the firm
 * (`from` may be newer than `to`: the diff then reads backwards). `not_found` when the case
 * or either revision is not the firm's.
 */
export async function diffCaseRevisions(
  database: Queryable,
  firmId: string,
  caseId: string,
  numbers: { from: number; to: number },
): Promise<RevisionDiffResult> {
  const [from, to] = await Promise.all([
    getRevision(database, firmId, caseId, numbers.from),
    getRevision(database, firmId, caseId, numbers.to),
  ]);
  if (!from || !to) return { ok: false, reason: 'not_found' };
  const about = (r: CaseRevisionDetail) => ({ number: r.number, authorName: r.authorName, createdAt: r.createdAt });
  return { ok: true, value: { from: about(from), to: about(to), diff: diffRevisions(from.body, to.body) } };
}
