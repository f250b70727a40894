/**
 * The comparison of an approval's snapshot with today's results, kept in memory.
 *
 * What an approval is compared with never changes within a server process: the published
 * revision's body is immutable (a trigger refuses updates) and today's results depend only
 * on that body, the files it reads (fixed with the revision) and `SOLVER_VERSION`. So the comparison is computed once per approval *row
 * version* and solver version, and a case page that shows the drift notice reads neither the
 * snapshot (often the biggest value in the row) nor the body again. The row version is the
 * approval row's `xmin`, which PostgreSQL changes whenever the row is updated (a cancelled
 * approval, or a snapshot altered by hand, as the tests do): a changed row is a new key.
 */
import { and, eq, inArray, sql } from 'drizzle-orm';
import { LRUCache } from 'lru-cache';
import type { Database } from '../../db/client';
import { approval, caseRevision } from '../../db/schema';
import { evaluateRevision } from '../attachments/blockFiles';
import type { CaseEvaluation } from '../calc';
import { SOLVER_VERSION } from '../solver';
import { compareEvaluations, type BlockDrift } from './drift';

/** An approval as the cache knows it: its id and the version of its row (`xmin` as text). */
export interface ApprovalVersion {
  approvalId: string;
  rowVersion: string;
}

/** The approval's snapshot against today's results: the blocks that drift, or why they could not be compared. */
export interface DriftComparison {
  findings: BlockDrift[];
  /** Set when the approved snapshot could not be compared (unreadable); findings is then empty. */
  problem?: string;
}

/** Comparisons kept; each is small (usually no findings at all). */
const MAX_COMPARISONS = 5_000;

/** The problem reported for a snapshot that cannot be compared. */
export const UNREADABLE_SNAPSHOT = 'The approved snapshot of this case could not be read, so its results were not compared. Ask a reviewer to look at the case.';

/** The version of an approval row, in SQL (select it beside the approval's columns). */
export const approvalRowVersion = sql<string>`${approval}.xmin::text`;

const cache = new LRUCache<string, DriftComparison>({ max: MAX_COMPARISONS });
const keyOf = (v: ApprovalVersion) => `${SOLVER_VERSION}|${v.approvalId}|${v.rowVersion}`;

async function compare(snapshot: CaseEvaluation | null, current: () => Promise<CaseEvaluation>): Promise<DriftComparison> {
  if (!snapshot || !Array.isArray(snapshot.blocks)) return { findings: [], problem: UNREADABLE_SNAPSHOT };
  try {
    return { findings: compareEvaluations(snapshot, await current()) };
  } catch {
    return { findings: [], problem: UNREADABLE_SNAPSHOT };
  }
}

/**
 * The comparison of each approval (by id) of the firm, from the cache or, for those not in
 * it, from their snapshot and the approved revision's body, read in one query. `current`,
 * when given, is the approved revision evaluated with today's solver: then only snapshots
 * are read (pass it only when every approval is of that one revision). An approval the
 * query no longer finds comes back as unreadable.
 */
export async function compareApprovals(
  database: Pick<Database, 'select'>,
  firmId: string,
  approvals: readonly ApprovalVersion[],
  current?: CaseEvaluation,
): Promise<Map<string, DriftComparison>> {
  const out = new Map<string, DriftComparison>();
  const missing: string[] = [];
  for (const version of approvals) {
    const hit = cache.get(keyOf(version));
    if (hit) out.set(version.approvalId, hit);
    else missing.push(version.approvalId);
  }
  if (missing.length === 0) return out;
  const rows = await database
    .select({
      approvalId: approval.id,
      rowVersion: approvalRowVersion,
      snapshot: approval.snapshot,
      body: sql<string | null>`${current ? sql`null` : caseRevision.body}`,
      caseId: approval.caseId,
      revisionNumber: approval.revisionNumber,
    })
    .from(approval)
    .innerJoin(caseRevision, and(eq(caseRevision.caseId, approval.caseId), eq(caseRevision.firmId, approval.firmId), eq(caseRevision.number, approval.revisionNumber)))
    .where(and(eq(approval.firmId, firmId), inArray(approval.id, missing)));
  for (const row of rows) {
    const comparison = await compare(row.snapshot, async () =>
      current ?? evaluateRevision(database, { firmId, caseId: row.caseId, revision: row.revisionNumber, body: row.body ?? '' }),
    );
    // Keyed by the version just read: if the row changed since the caller looked, this is the newer one.
    cache.set(keyOf(row), comparison);
    out.set(row.approvalId, comparison);
  }
  for (const id of missing) if (!out.has(id)) out.set(id, { findings: [], problem: UNREADABLE_SNAPSHOT });
  return out;
}
