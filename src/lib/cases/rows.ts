/**
 * The column selections and queries the case services share: a case with its author, a
 * revision with its author, key figures to and from columns. Every query filters by firm.
 */
import { and, eq } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Queryable } from '../../db/client';
import { caseFile, caseRevision, user } from '../../db/schema';
import { randomUUID } from 'node:crypto';
import type { CaseEvaluation } from '../calc';
import { keyFigures, type KeyFigures } from './keyFigures';
import type { CaseDetail, CaseRevisionDetail, CaseSummary } from './types';

/** The author of a revision (the `user` table under another name, to join it twice). */
export const revisionAuthor = alias(user, 'revision_author');

/** The key-figure columns of a revision, selected as one object. */
export const keyFigureColumns = {
  fr1Min: caseRevision.fr1Min,
  fr1Max: caseRevision.fr1Max,
  dischargeMin: caseRevision.dischargeMin,
  dischargeMax: caseRevision.dischargeMax,
  v1: caseRevision.v1,
  y1: caseRevision.y1,
  y2: caseRevision.y2,
  relativeLoss: caseRevision.relativeLoss,
  sectionShapes: caseRevision.sectionShapes,
  calcKinds: caseRevision.calcKinds,
} as const;

/** The columns of a case summary (join `user` on the case's author and its latest revision). */
export const summaryColumns = {
  id: caseFile.id,
  slug: caseFile.slug,
  title: caseFile.title,
  structureType: caseFile.structureType,
  sectionShape: caseFile.sectionShape,
  projectReference: caseFile.projectReference,
  summary: caseFile.summary,
  region: caseFile.region,
  tags: caseFile.tags,
  state: caseFile.state,
  authorId: caseFile.authorId,
  authorName: user.name,
  latestRevision: caseFile.latestRevision,
  publishedRevision: caseFile.publishedRevision,
  createdAt: caseFile.createdAt,
  updatedAt: caseFile.updatedAt,
  keyFigures: keyFigureColumns,
} as const;

/** The columns of a revision summary (join {@link revisionAuthor} on its author). */
export const revisionSummaryColumns = {
  number: caseRevision.number,
  authorId: caseRevision.authorId,
  authorName: revisionAuthor.name,
  createdAt: caseRevision.createdAt,
  solverVersion: caseRevision.solverVersion,
  keyFigures: keyFigureColumns,
} as const;

/** The columns of a whole revision. */
export const revisionColumns = { ...revisionSummaryColumns, body: caseRevision.body, results: caseRevision.results } as const;

/** Key figures as the revision's column values. */
export function keyFigureValues(figures: KeyFigures) {
  return { ...figures, sectionShapes: [...figures.sectionShapes], calcKinds: [...figures.calcKinds] };
}

/** The join condition of a case and its latest revision, inside one firm. */
export const latestRevisionOf = and(
  eq(caseRevision.caseId, caseFile.id),
  eq(caseRevision.firmId, caseFile.firmId),
  eq(caseRevision.number, caseFile.latestRevision),
);

/**
 * The case row of the firm, locked until the transaction `tx` ends (`SELECT … FOR UPDATE`),
 * or undefined (also for another firm's case). Every change of a case starts here, so
 * concurrent saves and review actions on one case run one after another.
 */
export async function lockCase(tx: Queryable, firmId: string, caseId: string) {
  const [found] = await tx
    .select()
    .from(caseFile)
    .where(and(eq(caseFile.id, caseId), eq(caseFile.firmId, firmId)))
    .for('update');
  return found;
}

/** One revision of a case of the firm, with its body and results, or null. */
export async function findRevision(
  database: Queryable,
  firmId: string,
  caseId: string,
  number: number,
): Promise<CaseRevisionDetail | null> {
  const [found] = await database
    .select(revisionColumns)
    .from(caseRevision)
    .innerJoin(revisionAuthor, eq(revisionAuthor.id, caseRevision.authorId))
    .where(and(eq(caseRevision.firmId, firmId), eq(caseRevision.caseId, caseId), eq(caseRevision.number, number)));
  return found ?? null;
}

/** A case of the firm with its author and latest revision, or null (also for another firm's case). */
export async function findCase(database: Queryable, firmId: string, caseId: string): Promise<CaseDetail | null> {
  // Drizzle nests selections one level only, so the revision's own columns come flat.
  const [found] = await database
    .select({
      ...summaryColumns,
      revisionAuthorId: caseRevision.authorId,
      revisionAuthorName: revisionAuthor.name,
      revisionCreatedAt: caseRevision.createdAt,
      revisionSolverVersion: caseRevision.solverVersion,
      revisionBody: caseRevision.body,
      revisionResults: caseRevision.results,
    })
    .from(caseFile)
    .innerJoin(user, eq(user.id, caseFile.authorId))
    .innerJoin(caseRevision, latestRevisionOf)
    .innerJoin(revisionAuthor, eq(revisionAuthor.id, caseRevision.authorId))
    .where(and(eq(caseFile.firmId, firmId), eq(caseFile.id, caseId)));
  if (!found) return null;
  const { revisionAuthorId, revisionAuthorName, revisionCreatedAt, revisionSolverVersion, revisionBody, revisionResults, ...summary } = found;
  const revision: CaseRevisionDetail = {
    number: summary.latestRevision,
    authorId: revisionAuthorId,
    authorName: revisionAuthorName,
    createdAt: revisionCreatedAt,
    solverVersion: revisionSolverVersion,
    keyFigures: summary.keyFigures,
    body: revisionBody,
    results: revisionResults,
  };
  return { ...(summary satisfies CaseSummary), revision };
}

/** Writes revision `number` of a case: its body, its results and the key figures they give. */
export async function insertRevision(
  tx: Queryable,
  r: { caseId: string; firmId: string; number: number; body: string; authorId: string; createdAt: Date; results: CaseEvaluation },
): Promise<void> {
  await tx.insert(caseRevision).values({
    id: randomUUID(),
    caseId: r.caseId,
    firmId: r.firmId,
    number: r.number,
    body: r.body,
    authorId: r.authorId,
    createdAt: r.createdAt,
    ...keyFigureValues(keyFigures(r.results)),
    results: r.results,
    solverVersion: r.results.solverVersion,
  });
}
