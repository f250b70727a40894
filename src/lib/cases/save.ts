import { and, eq, isNull } from 'drizzle-orm';
import type { Database, Queryable } from '../../db/client';
import { approval, caseFile } from '../../db/schema';
import { recordAudit } from '../audit';
import { evaluateRevision } from '../attachments/blockFiles';
import { evaluateCase, filesNamedIn } from '../calc';
// The pure decision module only (the review barrel carries services that import this one).
import { afterEdit } from '../review/transitions';
import { notifyReview } from '../review/notify';
import { wakeMailWorker } from '../mail';
import { queueSearchUpdate, wakeSearchWorker } from '../search';
import { findCase, findRevision, insertRevision, lockCase } from './rows';
import type { CaseDetail, LatestRevisionInfo } from './types';
import type { CaseMetadataPatch } from './validation';

/** A save from the editor (body and metadata already validated by `SaveCaseSchema`). */
export interface CaseSave {
  firmId: string;
  caseId: string;
  /** Who saves: only the author may. */
  userId: string;
  /** The revision the editor started from. */
  baseRevision: number;
  /** The whole new body; left out to change metadata only. */
  body?: string;
  /** Metadata fields to change; fields left out stay as they are. */
  metadata?: CaseMetadataPatch;
}

/** The outcome of a save. */
export type SaveCaseResult =
  | {
      ok: true;
      case: CaseDetail;
      /** True when the body changed, so revision `case.latestRevision` was just written. */
      revisionCreated: boolean;
      /** Metadata fields whose value changed. */
      changedFields: string[];
      /** Reviewers whose approvals this edit of a case in review cancelled. */
      cancelledApprovals: string[];
      /** True when this edit of a published case started a new draft. */
      startedDraft: boolean;
    }
  | { ok: false; reason: 'not_found' | 'forbidden' | 'not_editable' }
  | { ok: false; reason: 'conflict'; latest: LatestRevisionInfo };

type MetadataField = keyof CaseMetadataPatch;
const METADATA_FIELDS: readonly MetadataField[] = ['title', 'structureType', 'sectionShape', 'projectReference', 'summary', 'region', 'tags'];

const same = (a: unknown, b: unknown) =>
  Array.isArray(a) && Array.isArray(b) ? a.length === b.length && a.every((x, i) => x === b[i]) : a === b;

/**
 * Saves the author's edit: with the case row locked (`FOR UPDATE`), refuses another firm's
 * or a missing case (`not_found`), someone other than the author (`forbidden`), a case no
 * one edits any more (`not_editable`: withdrawn) and a save based on an older revision than
 * the latest (`conflict`, with the latest revision so the editor can show both). What the
 * edit does to the case follows `afterEdit`:
 * - draft or returned: stays so;
 * - in review: every approval given so far is cancelled (kept, with `cancelled_at`); those
 *   reviewers are told by e-mail (queued in the same transaction) and named in the result;
 * - published: a new draft revision starts (even for a metadata-only change, so the
 *   published revision is never changed) while `published_revision` stays readable.
 * When the body changed, writes revision latest + 1 with the body re-evaluated. An unchanged
 * save writes nothing. Records `case.saved` (and `case.approvals_cancelled`).
 * The slug never changes.
 */
export async function saveCase(database: Database, input: CaseSave): Promise<SaveCaseResult> {
  const result = await applySave(database, input);
  // Committed: messages to reviewers whose approvals were cancelled can go now.
  if (result.ok && result.cancelledApprovals.length) wakeMailWorker();
  if (result.ok && result.changedFields.length && result.case.publishedRevision !== null) wakeSearchWorker();
  return result;
}

/**
 * Whether the text of revision `base` is still the latest text: revisions written since by
 * a file change (the same body, recalculated) are no conflict for an editor that started
 * from `base`.
 */
async function sameTextSince(tx: Queryable, firmId: string, caseId: string, base: number, latestBody: string): Promise<boolean> {
  if (!Number.isInteger(base) || base < 1) return false;
  const older = await findRevision(tx, firmId, caseId, base);
  return older !== null && older.body === latestBody;
}

async function applySave(database: Database, input: CaseSave): Promise<SaveCaseResult> {
  // Evaluating is pure CPU: do it before the row lock is taken, unless blocks read attached
  // files, which are loaded under the lock (a file change also locks the case).
  const namesFiles = input.body !== undefined && filesNamedIn(input.body).length > 0;
  let results = input.body !== undefined && !namesFiles ? evaluateCase(input.body) : null;
  return database.transaction(async (tx): Promise<SaveCaseResult> => {
    const current = await lockCase(tx, input.firmId, input.caseId);
    if (!current) return { ok: false, reason: 'not_found' };
    if (current.authorId !== input.userId) return { ok: false, reason: 'forbidden' };
    const next = afterEdit(current.state);
    if (!next) return { ok: false, reason: 'not_editable' };
    const latest = await findRevision(tx, input.firmId, current.id, current.latestRevision);
    if (!latest) throw new Error(`case ${current.id} has no revision ${current.latestRevision}`);
    if (input.baseRevision !== current.latestRevision && !(await sameTextSince(tx, input.firmId, current.id, input.baseRevision, latest.body))) {
      const { number, body, authorName, createdAt } = latest;
      return { ok: false, reason: 'conflict', latest: { number, body, authorName, createdAt } };
    }
    if (namesFiles) {
      // The new revision (latest + 1) sees the files the revision being worked on sees.
      results = await evaluateRevision(tx, { firmId: input.firmId, caseId: current.id, revision: current.latestRevision + 1, body: input.body! });
    }

    const changes: Partial<typeof caseFile.$inferInsert> = {};
    const changedFields: string[] = [];
    for (const field of METADATA_FIELDS) {
      const value = input.metadata?.[field];
      if (value === undefined || same(value, current[field])) continue;
      Object.assign(changes, { [field]: value });
      changedFields.push(field);
    }
    const bodyChanged = results !== null && input.body !== undefined && input.body !== latest.body;
    if (!bodyChanged && !changedFields.length) {
      const unchanged = (await findCase(tx, input.firmId, current.id))!;
      return { ok: true, case: unchanged, revisionCreated: false, changedFields: [], cancelledApprovals: [], startedDraft: false };
    }
    // A published revision is never changed: any edit of a published case is a new revision.
    const startedDraft = current.state === 'published';
    const newBody = bodyChanged
      ? { body: input.body!, results: results! }
      : startedDraft
        ? {
            body: latest.body,
            // Files may have changed for the next revision since this one was published.
            results: filesNamedIn(latest.body).length
              ? await evaluateRevision(tx, { firmId: input.firmId, caseId: current.id, revision: current.latestRevision + 1, body: latest.body })
              : latest.results,
          }
        : null;
    const revisionCreated = newBody !== null;

    const now = new Date();
    const number = revisionCreated ? current.latestRevision + 1 : current.latestRevision;
    if (newBody) {
      await insertRevision(tx, { caseId: current.id, firmId: input.firmId, number, body: newBody.body, authorId: input.userId, createdAt: now, results: newBody.results });
    }
    await tx
      .update(caseFile)
      .set({ ...changes, state: next.state, latestRevision: number, updatedAt: now })
      .where(and(eq(caseFile.id, current.id), eq(caseFile.firmId, input.firmId)));
    const cancelled = next.cancelsApprovals
      ? await tx
          .update(approval)
          .set({ cancelledAt: now })
          .where(and(eq(approval.caseId, current.id), eq(approval.firmId, input.firmId), isNull(approval.cancelledAt)))
          .returning({ reviewerId: approval.reviewerId, revisionNumber: approval.revisionNumber })
      : [];
    const cancelledApprovals = [...new Set(cancelled.map((a) => a.reviewerId))];
    await recordAudit(tx, {
      firmId: input.firmId,
      actorUserId: input.userId,
      action: 'case.saved',
      targetType: 'case',
      targetId: current.id,
      details: {
        revision: number,
        revisionCreated,
        changedFields,
        ...(changedFields.length
          ? { from: Object.fromEntries(changedFields.map((f) => [f, current[f as MetadataField]])), to: changes }
          : {}),
        ...(newBody ? { solverVersion: newBody.results.solverVersion } : {}),
        ...(startedDraft ? { startedDraftFrom: current.publishedRevision } : {}),
      },
    });
    if (cancelledApprovals.length) {
      await recordAudit(tx, {
        firmId: input.firmId,
        actorUserId: input.userId,
        action: 'case.approvals_cancelled',
        targetType: 'case',
        targetId: current.id,
        details: { revision: number, reviewerIds: cancelledApprovals, approvedRevisions: [...new Set(cancelled.map((a) => a.revisionNumber))] },
      });
    }
    if (cancelledApprovals.length) {
      await notifyReview(tx, { firmId: input.firmId, caseId: current.id, title: changes.title ?? current.title, revision: number, authorId: current.authorId }, input.userId, {
        kind: 'approvals_cancelled',
        reviewerIds: cancelledApprovals,
      });
    }
    // The search document shows the case's metadata (title, summary, tags…) beside the
    // published revision's figures: a metadata change of a published case reaches it now.
    if (changedFields.length && current.publishedRevision !== null) {
      await queueSearchUpdate(tx, { firmId: input.firmId, caseId: current.id, reason: 'edited' });
    }
    const saved = (await findCase(tx, input.firmId, current.id))!;
    return { ok: true, case: saved, revisionCreated, changedFields, cancelledApprovals, startedDraft };
  });
}
