import { and, asc, count, desc, eq, sql, type SQL } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { caseFile, caseRevision, user } from '../../db/schema';
import { findCase, latestRevisionOf, summaryColumns } from './rows';
import type { CaseState } from './states';
import type { CaseDetail, CaseSummary } from './types';

/** How {@link listCases} filters, orders and pages. */
export interface ListCasesOptions {
  /** Only this author's cases. */
  authorId?: string;
  state?: CaseState;
  /** updated (default), title, or fr1 (largest Fr1 of the latest revision; cases without one last). */
  sort?: 'updated' | 'title' | 'fr1';
  /** Defaults: updated desc, title asc, fr1 desc. */
  direction?: 'asc' | 'desc';
  /** 1–100, 50 by default. */
  limit?: number;
  offset?: number;
}

/** A page of cases and how many match in all. */
export interface CaseList {
  cases: CaseSummary[];
  total: number;
}

const DEFAULT_DIRECTION = { updated: 'desc', title: 'asc', fr1: 'desc' } as const;

function orderOf(sort: NonNullable<ListCasesOptions['sort']>, direction: 'asc' | 'desc'): SQL[] {
  const by = direction === 'asc' ? asc : desc;
  const tieBreak = [desc(caseFile.updatedAt), asc(caseFile.id)];
  switch (sort) {
    case 'title':
      return [by(sql`lower(${caseFile.title})`), ...tieBreak];
    case 'fr1':
      // Cases whose latest revision has no Fr1 go last in either direction.
      return [sql`${caseRevision.fr1Max} ${sql.raw(direction)} nulls last`, ...tieBreak];
    default:
      return [by(caseFile.updatedAt), asc(caseFile.id)];
  }
}

/**
 * The firm's cases with their author and the key figures of their latest revision,
 * filtered, ordered and paged (see {@link ListCasesOptions}), and the total that match.
 */
export async function listCases(database: Queryable, firmId: string, options: ListCasesOptions = {}): Promise<CaseList> {
  const sort = options.sort ?? 'updated';
  const direction = options.direction ?? DEFAULT_DIRECTION[sort];
  const limit = Math.min(100, Math.max(1, Math.trunc(options.limit ?? 50)));
  const offset = Math.max(0, Math.trunc(options.offset ?? 0));
  const where = and(
    eq(caseFile.firmId, firmId),
    options.authorId !== undefined ? eq(caseFile.authorId, options.authorId) : undefined,
    options.state !== undefined ? eq(caseFile.state, options.state) : undefined,
  );
  const rows = await database
    .select(summaryColumns)
    .from(caseFile)
    .innerJoin(user, eq(user.id, caseFile.authorId))
    .innerJoin(caseRevision, latestRevisionOf)
    .where(where)
    .orderBy(...orderOf(sort, direction))
    .limit(limit)
    .offset(offset);
  const [counted] = await database.select({ total: count() }).from(caseFile).where(where);
  return { cases: rows as CaseSummary[], total: counted?.total ?? 0 };
}

/** A case of the firm with its author and latest revision (body, key figures, results), or null. */
export async function getCase(database: Queryable, firmId: string, caseId: string): Promise<CaseDetail | null> {
  return findCase(database, firmId, caseId);
}
