import { randomUUID } from 'node:crypto';
import { and, eq, or, sql } from 'drizzle-orm';
import type { Database, Queryable } from '../../db/client';
import { caseFile } from '../../db/schema';
import { recordAudit } from '../audit';
import { evaluateCase } from '../calc';
import { findCase, insertRevision } from './rows';
import { nextFreeSlug, slugify } from './slug';
import type { CaseDetail } from './types';
import type { CaseMetadata } from './validation';

/** Everything a new case is made from (metadata already validated by `CreateCaseSchema`). */
export interface NewCase {
  firmId: string;
  authorId: string;
  metadata: CaseMetadata;
  /** Markdown body of revision 1; empty when left out. */
  body?: string;
  /** The case (and revision) whose body this one starts from, recorded in the audit trail. */
  copiedFrom?: { caseId: string; revision: number };
}

/**
 * The first free slug for `title` in the firm. Call inside the creating transaction after
 * {@link lockSlugs}; the unique index (firm_id, slug) is the last word either way.
 */
async function allocateSlug(tx: Queryable, firmId: string, title: string): Promise<string> {
  const base = slugify(title);
  // Slugs are [a-z0-9-] only, so the base needs no escaping inside the pattern.
  const rows = await tx
    .select({ slug: caseFile.slug })
    .from(caseFile)
    .where(and(eq(caseFile.firmId, firmId), or(eq(caseFile.slug, base), sql`${caseFile.slug} ~ ${`^${base}-[0-9]+$`}`)));
  return nextFreeSlug(
    base,
    rows.map((r) => r.slug),
  );
}

/** Serialises case creation within one firm until the transaction ends, so slugs never collide. */
async function lockSlugs(tx: Queryable, firmId: string): Promise<void> {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`case.slug:${firmId}`}))`);
}

/**
 * Creates a draft case owned by its author, with revision 1 holding the body, its key
 * figures and the whole evaluation; records `case.created`. One transaction. Valid input
 * always succeeds (a body whose blocks have errors is saved with those errors), so this
 * returns the new case itself.
 */
export async function createCase(database: Database, input: NewCase): Promise<CaseDetail> {
  const body = input.body ?? '';
  // Evaluating is pure CPU: do it before the transaction so no lock waits on it.
  const results = evaluateCase(body);
  const caseId = randomUUID();
  const { metadata } = input;
  return database.transaction(async (tx) => {
    await lockSlugs(tx, input.firmId);
    const slug = await allocateSlug(tx, input.firmId, metadata.title);
    const now = new Date();
    await tx.insert(caseFile).values({
      id: caseId,
      firmId: input.firmId,
      title: metadata.title,
      slug,
      structureType: metadata.structureType,
      sectionShape: metadata.sectionShape,
      projectReference: metadata.projectReference ?? null,
      summary: metadata.summary ?? null,
      region: metadata.region ?? null,
      tags: metadata.tags,
      authorId: input.authorId,
      state: 'draft',
      latestRevision: 1,
      createdAt: now,
      updatedAt: now,
    });
    await insertRevision(tx, { caseId, firmId: input.firmId, number: 1, body, authorId: input.authorId, createdAt: now, results });
    await recordAudit(tx, {
      firmId: input.firmId,
      actorUserId: input.authorId,
      action: 'case.created',
      targetType: 'case',
      targetId: caseId,
      details: { slug, title: metadata.title, revision: 1, solverVersion: results.solverVersion, ...(input.copiedFrom ? { copiedFrom: input.copiedFrom } : {}) },
    });
    return (await findCase(tx, input.firmId, caseId))!;
  });
}
