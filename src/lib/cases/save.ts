import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { caseFile, caseRevision } from '../../db/schema';
import { recordAudit } from '../audit';
import { evaluateCase } from '../calc';
import { keyFigures } from './keyFigures';
import { findCase, findRevision, keyFigureValues, lockCase } from './rows';
import type { CaseDetail, LatestRevisionInfo } from './types';
import type { CaseMetadataPatch } from './validation';

/** A save from the editor (body and metadata already validated by `SaveCaseSchema`). */
export interface CaseSave {
  firmId: string;
  caseId: string;
  /** Who saves: for now only the author may. */
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
    }
  | { ok: false; reason: 'not_found' | 'forbidden' | 'not_editable' }
  | { ok: false; reason: 'conflict'; latest: LatestRevisionInfo };

type MetadataField = keyof CaseMetadataPatch;
const METADATA_FIELDS: readonly MetadataField[] = ['title', 'structureType', 'sectionShape', 'projectReference', 'region', 'tags'];

const same = (a: unknown, b: unknown) =>
  Array.isArray(a) && Array.isArray(b) ? a.length === b.length && a.every((x, i) => x === b[i]) : a === b;

/**
 * Saves a draft: with the case row locked (`FOR UPDATE`), refuses another firm's or a
 * missing case (`not_found`), someone other than the author (`forbidden`: for now a case is
 * a draft owned by its author), a case that is not a draft (`not_editable`) and a save
 * based on an older revision than the latest (`conflict`, with the latest revision so the
 * editor can show both). Otherwise, when the body changed, writes revision latest + 1 with
 * the body re-evaluated; metadata changes update the case without a new revision (they are
 * in the audit trail). An unchanged save writes nothing. Records `case.saved`.
 * The slug never changes.
 */
export async function saveCase(database: Database, input: CaseSave): Promise<SaveCaseResult> {
  // Evaluating is pure CPU: do it before the row lock is taken.
  const results = input.body !== undefined ? evaluateCase(input.body) : null;
  return database.transaction(async (tx): Promise<SaveCaseResult> => {
    const current = await lockCase(tx, input.firmId, input.caseId);
    if (!current) return { ok: false, reason: 'not_found' };
    if (current.authorId !== input.userId) return { ok: false, reason: 'forbidden' };
    if (current.state !== 'draft') return { ok: false, reason: 'not_editable' };
    const latest = await findRevision(tx, input.firmId, current.id, current.latestRevision);
    if (!latest) throw new Error(`case ${current.id} has no revision ${current.latestRevision}`);
    if (input.baseRevision !== current.latestRevision) {
      const { number, body, authorName, createdAt } = latest;
      return { ok: false, reason: 'conflict', latest: { number, body, authorName, createdAt } };
    }

    const changes: Partial<typeof caseFile.$inferInsert> = {};
    const changedFields: string[] = [];
    for (const field of METADATA_FIELDS) {
      const value = input.metadata?.[field];
      if (value === undefined || same(value, current[field])) continue;
      Object.assign(changes, { [field]: value });
      changedFields.push(field);
    }
    const newBody = results && input.body !== undefined && input.body !== latest.body ? { body: input.body, results } : null;
    const revisionCreated = newBody !== null;
    if (!revisionCreated && !changedFields.length) {
      return { ok: true, case: (await findCase(tx, input.firmId, current.id))!, revisionCreated: false, changedFields: [] };
    }

    const now = new Date();
    const number = revisionCreated ? current.latestRevision + 1 : current.latestRevision;
    if (newBody) {
      await tx.insert(caseRevision).values({
        id: randomUUID(),
        caseId: current.id,
        firmId: input.firmId,
        number,
        body: newBody.body,
        authorId: input.userId,
        createdAt: now,
        ...keyFigureValues(keyFigures(newBody.results)),
        results: newBody.results,
        solverVersion: newBody.results.solverVersion,
      });
    }
    await tx
      .update(caseFile)
      .set({ ...changes, latestRevision: number, updatedAt: now })
      .where(and(eq(caseFile.id, current.id), eq(caseFile.firmId, input.firmId)));
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
      },
    });
    return { ok: true, case: (await findCase(tx, input.firmId, current.id))!, revisionCreated, changedFields };
  });
}
