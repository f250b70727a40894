/**
 * What the reading page needs of a case, in one prepared query: the case with its author,
 * the latest revision's body and key figures (not its stored results: the page re-runs the
 * blocks), and the newest entries of its history with the number of revisions.
 */
import { and, eq, sql } from 'drizzle-orm';
import { prepared, type Database } from '../../db/client';
import { caseFile, caseRevision, user } from '../../db/schema';
import { latestRevisionOf, revisionAuthor, summaryColumns } from './rows';
import type { CaseSummary } from './types';

/** How many revisions the reading page lists at the side (the history page has them all). */
export const READING_HISTORY_LENGTH = 8;

/** One line of the history at the side. */
export interface HistoryEntry {
  number: number;
  authorName: string;
  createdAt: Date;
}

/** A case as its reading page shows it. */
export interface CaseReading extends CaseSummary {
  revision: { number: number; body: string; solverVersion: string; authorName: string; createdAt: Date };
  /** Newest first, at most {@link READING_HISTORY_LENGTH}. */
  history: HistoryEntry[];
  revisionCount: number;
}

const history = sql<Array<{ number: number; authorName: string; createdAt: string }>>`(
  select coalesce(json_agg(json_build_object('number', h.number, 'authorName', h.author_name, 'createdAt', h.created_at) order by h.number desc), '[]'::json)
  from (
    select r.number, u.name as author_name, r.created_at
    from ${caseRevision} r join ${user} u on u.id = r.author_id
    where r.case_id = ${caseFile.id} and r.firm_id = ${caseFile.firmId}
    order by r.number desc
    limit ${sql.raw(String(READING_HISTORY_LENGTH))}
  ) h
)`;

const revisionCount = sql<number>`(select count(*)::int from ${caseRevision} r where r.case_id = ${caseFile.id} and r.firm_id = ${caseFile.firmId})`;

const readingQuery = prepared((database: Database) =>
  database
    .select({
      ...summaryColumns,
      revisionBody: caseRevision.body,
      revisionSolverVersion: caseRevision.solverVersion,
      revisionAuthorName: revisionAuthor.name,
      revisionCreatedAt: caseRevision.createdAt,
      history: history.as('history'),
      revisionCount: revisionCount.as('revision_count'),
    })
    .from(caseFile)
    .innerJoin(user, eq(user.id, caseFile.authorId))
    .innerJoin(caseRevision, latestRevisionOf)
    .innerJoin(revisionAuthor, eq(revisionAuthor.id, caseRevision.authorId))
    .where(and(eq(caseFile.firmId, sql.placeholder('firmId')), eq(caseFile.id, sql.placeholder('caseId'))))
    .prepare('case_reading'),
);

/** The case `caseId` of the firm for its reading page, or null (also for another firm's case). */
export async function getCaseReading(database: Database, firmId: string, caseId: string): Promise<CaseReading | null> {
  const [found] = await readingQuery(database).execute({ firmId, caseId });
  if (!found) return null;
  const { revisionBody, revisionSolverVersion, revisionAuthorName, revisionCreatedAt, history: entries, revisionCount: count, ...summary } = found;
  return {
    ...(summary satisfies CaseSummary),
    revision: { number: summary.latestRevision, body: revisionBody, solverVersion: revisionSolverVersion, authorName: revisionAuthorName, createdAt: revisionCreatedAt },
    history: entries.map((e) => ({ number: e.number, authorName: e.authorName, createdAt: new Date(e.createdAt) })),
    revisionCount: count,
  };
}
