/**
 * Drift checks against the database: one published case (for the notice on its page) and
 * the whole firm's library (a `drift_run`, processed in the background in small batches,
 * its progress and findings written to the row as it goes so a page can poll it).
 */
import { randomUUID } from 'node:crypto';
import { and, desc, eq, inArray, isNotNull, isNull, ne, sql } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { approval, caseFile, driftRun, user } from '../../db/schema';
import type { CaseEvaluation } from '../calc';
import { SOLVER_VERSION } from '../solver';
import type { BlockDrift } from './drift';
import { approvalRowVersion, compareApprovals, type ApprovalVersion } from './driftCache';

/** A published case's results today against the snapshot of its latest standing approval. */
export interface CaseDrift {
  caseId: string;
  title: string;
  /** The published revision. */
  revision: number;
  /** Name of the reviewer whose approval is compared (the latest of that revision). */
  approvedBy: string;
  approvedAt: Date;
  solverVersionApproved: string;
  solverVersionNow: string;
  /** Blocks whose results differ beyond the tolerance; empty when nothing drifts. */
  findings: BlockDrift[];
  /** Set when the approved snapshot could not be compared (unreadable); findings is then empty. */
  problem?: string;
}

/**
 * What a drift check starts from: the published case and its latest standing approval
 * (without the snapshot, which the comparison cache usually makes unnecessary to read).
 */
export type DriftBasis = Omit<CaseDrift, 'solverVersionNow' | 'findings' | 'problem'> & ApprovalVersion;

/** A case with drift as a library run stores it (JSON: the approval time as ISO text). */
export type DriftRunFinding = Omit<CaseDrift, 'approvedAt'> & { approvedAt: string };

/** A library run as pages and the JSON route show it. */
export interface DriftRunView {
  id: string;
  startedAt: Date;
  finishedAt: Date | null;
  startedBy: string | null;
  solverVersion: string;
  total: number;
  checked: number;
  findings: DriftRunFinding[];
  error: string | null;
  running: boolean;
}

/** Cases checked per batch of a library run; the job yields to requests between batches. */
export const DRIFT_BATCH_SIZE = 10;

/** A run still unfinished after this long was cut off (a restart): it no longer blocks a new one. */
export const DRIFT_RUN_STALE_MS = 15 * 60_000;

/** What the read-only queries here need: the client or a transaction. */
type Reader = Pick<Database, 'select' | 'selectDistinctOn'>;

/** Published (not withdrawn) cases of the firm, optionally only `caseIds`. */
function publishedWhere(firmId: string, caseIds?: readonly string[]) {
  return and(
    eq(caseFile.firmId, firmId),
    isNotNull(caseFile.publishedRevision),
    ne(caseFile.state, 'withdrawn'),
    ...(caseIds ? [inArray(caseFile.id, [...caseIds])] : []),
  );
}

/** The bases of each of `caseIds` that is published and has a standing approval of its published revision. */
async function basesOf(database: Reader, firmId: string, caseIds: readonly string[]): Promise<DriftBasis[]> {
  if (caseIds.length === 0) return [];
  return database
    .selectDistinctOn([caseFile.id], {
      caseId: caseFile.id,
      title: caseFile.title,
      revision: approval.revisionNumber,
      approvalId: approval.id,
      rowVersion: approvalRowVersion,
      approvedBy: user.name,
      approvedAt: approval.createdAt,
      solverVersionApproved: approval.solverVersion,
    })
    .from(caseFile)
    .innerJoin(approval, and(eq(approval.caseId, caseFile.id), eq(approval.firmId, firmId), eq(approval.revisionNumber, caseFile.publishedRevision), isNull(approval.cancelledAt)))
    .innerJoin(user, eq(user.id, approval.reviewerId))
    .where(publishedWhere(firmId, caseIds))
    .orderBy(caseFile.id, desc(approval.createdAt));
}

/** The drift of each basis; `current` only when there is one basis (its published revision, evaluated today). */
async function driftFrom(database: Pick<Database, 'select'>, firmId: string, bases: readonly DriftBasis[], current?: CaseEvaluation): Promise<CaseDrift[]> {
  const comparisons = await compareApprovals(database, firmId, bases, bases.length === 1 ? current : undefined);
  return bases.map(({ approvalId, rowVersion: _version, ...basis }) => ({ ...basis, solverVersionNow: SOLVER_VERSION, ...comparisons.get(approvalId)! }));
}

/** The drift of each of `caseIds` that is published and has a standing approval of its published revision. */
async function driftOf(database: Reader, firmId: string, caseIds: readonly string[]): Promise<CaseDrift[]> {
  return driftFrom(database, firmId, await basesOf(database, firmId, caseIds));
}

/**
 * Re-runs the published revision of a case with today's solver and compares it with the
 * snapshot of the revision's latest standing approval. Null when the case is not published
 * in this firm (or has no approval to compare with). `current`, when given, is the published
 * revision already evaluated with today's solver (the reading page has it cached).
 */
export async function caseDrift(database: Reader, firmId: string, caseId: string, current?: CaseEvaluation): Promise<CaseDrift | null> {
  const [basis] = await basesOf(database, firmId, [caseId]);
  return basis ? caseDriftFrom(database, firmId, basis, current) : null;
}

/**
 * {@link caseDrift} from a basis already read (the case page has it from `getCaseReview`):
 * no query at all when the comparison is cached, else one for the snapshot.
 */
export async function caseDriftFrom(database: Pick<Database, 'select'>, firmId: string, basis: DriftBasis, current?: CaseEvaluation): Promise<CaseDrift> {
  const [found] = await driftFrom(database, firmId, [basis], current);
  return found!;
}

const runColumns = {
  id: driftRun.id,
  startedAt: driftRun.startedAt,
  finishedAt: driftRun.finishedAt,
  startedBy: user.name,
  solverVersion: driftRun.solverVersion,
  total: driftRun.total,
  checked: driftRun.checked,
  findings: driftRun.findings,
  error: driftRun.error,
};

type RunRow = Omit<DriftRunView, 'findings' | 'running'> & { findings: unknown[] };

// The findings column is only ever written by processRun, in the DriftRunFinding shape.
const toView = (row: RunRow): DriftRunView => ({ ...row, findings: row.findings as DriftRunFinding[], running: row.finishedAt === null });

/** One run of the firm; null for an unknown id or another firm's. */
export async function getDriftRun(database: Reader, firmId: string, runId: string): Promise<DriftRunView | null> {
  const [row] = await database.select(runColumns).from(driftRun).leftJoin(user, eq(user.id, driftRun.startedBy)).where(and(eq(driftRun.id, runId), eq(driftRun.firmId, firmId)));
  return row ? toView(row) : null;
}

/** The firm's most recent run, or null before the first. */
export async function latestDriftRun(database: Reader, firmId: string): Promise<DriftRunView | null> {
  const [row] = await database
    .select(runColumns)
    .from(driftRun)
    .leftJoin(user, eq(user.id, driftRun.startedBy))
    .where(eq(driftRun.firmId, firmId))
    .orderBy(desc(driftRun.startedAt), desc(driftRun.id))
    .limit(1);
  return row ? toView(row) : null;
}

/** The outcome of {@link startDriftRun}. */
export interface StartedDriftRun {
  run: DriftRunView;
  /** False when a run of the firm was already going: that one is returned. */
  started: boolean;
  /** Settles when the background job of a run started here ends (never rejects). */
  done: Promise<void>;
}

const nextTick = () => new Promise<void>((resolve) => setImmediate(resolve));

async function processRun(database: Database, firmId: string, runId: string, caseIds: readonly string[]): Promise<void> {
  let checked = 0;
  try {
    for (let i = 0; i < caseIds.length; i += DRIFT_BATCH_SIZE) {
      const batch = caseIds.slice(i, i + DRIFT_BATCH_SIZE);
      const drifts = await driftOf(database, firmId, batch);
      const findings = drifts.filter((d) => d.findings.length > 0 || d.problem).map((d) => ({ ...d, approvedAt: d.approvedAt.toISOString() }));
      checked += batch.length;
      await database
        .update(driftRun)
        .set({ checked, findings: sql`${driftRun.findings} || ${JSON.stringify(findings)}::jsonb` })
        .where(eq(driftRun.id, runId));
      await nextTick();
    }
    await database.update(driftRun).set({ finishedAt: new Date() }).where(eq(driftRun.id, runId));
  } catch (error) {
    const detail = error instanceof Error ? error.message : String(error);
    console.error(`drift run ${runId} stopped:`, detail);
    try {
      await database
        .update(driftRun)
        .set({ finishedAt: new Date(), error: `The check stopped after ${checked} of ${caseIds.length} cases on an unexpected error; start it again. If it stops again, tell your administrator (${detail.slice(0, 200)}).` })
        .where(eq(driftRun.id, runId));
    } catch (inner) {
      console.error(`drift run ${runId}: could not record the error:`, inner instanceof Error ? inner.message : inner);
    }
  }
}

/**
 * Starts re-checking every published case of the firm against today's solver, unless a run
 * is already going (then returns that one). The run goes on in this process after the call
 * returns; poll {@link getDriftRun} for progress. At most one unfinished run per firm: the
 * check and the insert hold a per-firm advisory lock. A run left unfinished for
 * {@link DRIFT_RUN_STALE_MS} (the server stopped) is closed with an error and no longer counts.
 */
export async function startDriftRun(database: Database, input: { firmId: string; userId: string | null }): Promise<StartedDriftRun> {
  const { firmId } = input;
  const outcome = await database.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`sequent.drift_run:${firmId}`}))`);
    const [open] = await tx
      .select({ id: driftRun.id, startedAt: driftRun.startedAt })
      .from(driftRun)
      .where(and(eq(driftRun.firmId, firmId), isNull(driftRun.finishedAt)))
      .orderBy(desc(driftRun.startedAt))
      .limit(1);
    if (open && Date.now() - open.startedAt.getTime() < DRIFT_RUN_STALE_MS) return { runId: open.id, caseIds: null };
    if (open) {
      await tx
        .update(driftRun)
        .set({ finishedAt: new Date(), error: 'This check was cut off before it finished (the server restarted). A new check was started.' })
        .where(and(eq(driftRun.firmId, firmId), isNull(driftRun.finishedAt)));
    }
    const cases = await tx.select({ id: caseFile.id }).from(caseFile).where(publishedWhere(firmId)).orderBy(caseFile.title, caseFile.id);
    const runId = randomUUID();
    await tx.insert(driftRun).values({ id: runId, firmId, startedBy: input.userId, solverVersion: SOLVER_VERSION, total: cases.length, checked: 0 });
    return { runId, caseIds: cases.map((c) => c.id) };
  });
  const done = outcome.caseIds ? processRun(database, firmId, outcome.runId, outcome.caseIds) : Promise.resolve();
  const run = await getDriftRun(database, firmId, outcome.runId);
  return { run: run!, started: outcome.caseIds !== null, done };
}
