/**
 * A revision written because the files its blocks read changed (an attachment added or
 * removed on a draft): the same body, recalculated. Revisions are never changed in place,
 * so the results a file change brings are a new revision, and the one before keeps the
 * files and results it had.
 */
import { and, eq } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { caseFile, caseRevision } from '../../db/schema';
import type { CaseEvaluation } from '../calc';
import { insertRevision } from './rows';

/** The body of revision `number` of the firm's case, or null. */
export async function revisionBody(tx: Queryable, firmId: string, caseId: string, number: number): Promise<string | null> {
  const [found] = await tx
    .select({ body: caseRevision.body })
    .from(caseRevision)
    .where(and(eq(caseRevision.firmId, firmId), eq(caseRevision.caseId, caseId), eq(caseRevision.number, number)));
  return found?.body ?? null;
}

/**
 * Writes revision `number` (the latest + 1) with `body` and `results`, and makes it the
 * case's latest. The caller holds the case row lock and has checked the state.
 */
export async function writeRecalculatedRevision(
  tx: Queryable,
  input: { firmId: string; caseId: string; number: number; body: string; authorId: string; results: CaseEvaluation },
): Promise<void> {
  const now = new Date();
  await insertRevision(tx, { caseId: input.caseId, firmId: input.firmId, number: input.number, body: input.body, authorId: input.authorId, createdAt: now, results: input.results });
  await tx
    .update(caseFile)
    .set({ latestRevision: input.number, updatedAt: now })
    .where(and(eq(caseFile.id, input.caseId), eq(caseFile.firmId, input.firmId)));
}
