/**
 * Attachments of a case: add, list, caption, remove. Which revisions see a file is
 * `added_in_revision <= n < removed_in_revision`; changes go to the revision being worked
 * on (the latest, or the next one when the latest is published), so a published revision
 * keeps its files. Every change locks the case row and records an audit event.
 */
import { randomUUID } from 'node:crypto';
import { and, asc, count, eq, sql } from 'drizzle-orm';
import type { Database, Queryable } from '../../db/client';
import { attachment, caseFile, user } from '../../db/schema';
import { recordAudit } from '../audit';
import { filesNamedIn } from '../calc';
import { lockCase, revisionBody, writeRecalculatedRevision } from '../cases';
import { evaluateRevision } from './blockFiles';
import type { FileStore, StoredFile } from '../storage';
import { MAX_FILES_PER_CASE } from './limits';
import { visibleIn } from './visibility';
import type { AttachmentFailure } from './messages';

/** An attachment as the API and pages show it. */
export interface AttachmentView {
  id: string;
  caseId: string;
  fileName: string;
  contentType: string;
  size: number;
  sha256: string;
  caption: string;
  hasThumbnail: boolean;
  addedInRevision: number;
  removedInRevision: number | null;
  uploaderId: string;
  uploaderName: string;
  createdAt: Date;
  url: string;
  thumbnailUrl: string | null;
}

/** A file that passed the checks, ready to store. */
export interface CheckedFile {
  fileName: string;
  contentType: string;
  bytes: Uint8Array;
  thumbnail: Uint8Array | null;
}

type Fail = { ok: false; reason: AttachmentFailure };

const columns = {
  id: attachment.id,
  caseId: attachment.caseId,
  fileName: attachment.fileName,
  contentType: attachment.contentType,
  size: attachment.size,
  sha256: attachment.sha256,
  caption: attachment.caption,
  thumbnailKey: attachment.thumbnailKey,
  addedInRevision: attachment.addedInRevision,
  removedInRevision: attachment.removedInRevision,
  uploaderId: attachment.uploaderId,
  uploaderName: user.name,
  createdAt: attachment.createdAt,
};

/** A row read with {@link columns}: the attachment's own columns and the uploader's name. */
type Row = Pick<typeof attachment.$inferSelect, Exclude<keyof typeof columns, 'uploaderName'>> & { uploaderName: string };

function toView(row: Row): AttachmentView {
  const { thumbnailKey, ...rest } = row;
  return {
    ...rest,
    hasThumbnail: thumbnailKey !== null,
    url: `/api/v1/attachments/${row.id}`,
    thumbnailUrl: thumbnailKey ? `/api/v1/attachments/${row.id}/thumbnail` : null,
  };
}

/** The revision attachment changes go to: the latest, or the next once the latest is published. */
export function workingRevision(found: { latestRevision: number; publishedRevision: number | null }): number {
  return found.publishedRevision !== null && found.publishedRevision >= found.latestRevision ? found.latestRevision + 1 : found.latestRevision;
}

const EDITABLE = new Set(['draft', 'returned', 'published']);


/**
 * The files of a case of the firm seen by `revision` (default: the revision being worked
 * on, which is what the editor shows), oldest first; null for a case not in the firm.
 */
export async function listAttachments(
  database: Queryable,
  firmId: string,
  caseId: string,
  revision?: number,
): Promise<{ revision: number; attachments: AttachmentView[] } | null> {
  const working = await findWorkingRevision(database, firmId, caseId);
  if (working === null) return null;
  const n = revision ?? working;
  return { revision: n, attachments: await attachmentsOfRevision(database, firmId, caseId, n) };
}

/** The revision file changes of the firm's case go to ({@link workingRevision}), or null for a case not in the firm. */
export async function findWorkingRevision(database: Queryable, firmId: string, caseId: string): Promise<number | null> {
  const [found] = await database
    .select({ latestRevision: caseFile.latestRevision, publishedRevision: caseFile.publishedRevision })
    .from(caseFile)
    .where(and(eq(caseFile.id, caseId), eq(caseFile.firmId, firmId)));
  return found ? workingRevision(found) : null;
}

/**
 * The files revision `revision` of a case of the firm shows, oldest first, in one query
 * (for pages that already know the case is the firm's; another firm's case has none).
 */
export async function attachmentsOfRevision(database: Queryable, firmId: string, caseId: string, revision: number): Promise<AttachmentView[]> {
  const rows = await database
    .select(columns)
    .from(attachment)
    .innerJoin(user, eq(user.id, attachment.uploaderId))
    .where(and(eq(attachment.firmId, firmId), eq(attachment.caseId, caseId), visibleIn(revision)))
    .orderBy(asc(attachment.createdAt), asc(attachment.id));
  return rows.map(toView);
}

/** The stored keys and type of one attachment of the firm (for downloads), or null. */
export async function findAttachmentFile(database: Queryable, firmId: string, attachmentId: string) {
  if (!/^[0-9a-f-]{36}$/.test(attachmentId)) return null;
  const [found] = await database
    .select({ fileName: attachment.fileName, contentType: attachment.contentType, size: attachment.size, storageKey: attachment.storageKey, thumbnailKey: attachment.thumbnailKey, sha256: attachment.sha256 })
    .from(attachment)
    .where(and(eq(attachment.id, attachmentId), eq(attachment.firmId, firmId)));
  return found ?? null;
}

/** Whether the caller may change the case's files at all (author, editable state); for checks before reading bytes. */
export async function canChangeAttachments(database: Queryable, firmId: string, caseId: string, userId: string): Promise<{ ok: true } | Fail> {
  const [found] = await database
    .select({ authorId: caseFile.authorId, state: caseFile.state })
    .from(caseFile)
    .where(and(eq(caseFile.id, caseId), eq(caseFile.firmId, firmId)));
  if (!found) return { ok: false, reason: 'not_found' };
  if (found.authorId !== userId) return { ok: false, reason: 'not_author' };
  if (!EDITABLE.has(found.state)) return { ok: false, reason: 'not_editable' };
  return { ok: true };
}

/**
 * Stores checked files and adds them to the case (the author only, in an editable state,
 * within {@link MAX_FILES_PER_CASE}). Bytes are written before the transaction: a refused
 * transaction leaves unreferenced content-addressed files, never a row without its bytes.
 */
export async function addAttachments(
  database: Database,
  store: FileStore,
  input: { firmId: string; caseId: string; userId: string; files: CheckedFile[]; caption: string },
): Promise<{ ok: true; revision: number; recalculated: boolean; attachments: AttachmentView[] } | Fail> {
  const allowed = await canChangeAttachments(database, input.firmId, input.caseId, input.userId);
  if (!allowed.ok) return allowed;
  const stored: Array<{ file: CheckedFile; main: StoredFile; thumb: StoredFile | null }> = [];
  for (const file of input.files) {
    const main = await store.put(file.bytes);
    const thumb = file.thumbnail ? await store.put(file.thumbnail) : null;
    stored.push({ file, main, thumb });
  }
  return database.transaction(async (tx) => {
    const found = await lockCase(tx, input.firmId, input.caseId);
    if (!found) return { ok: false, reason: 'not_found' } as const;
    if (found.authorId !== input.userId) return { ok: false, reason: 'not_author' } as const;
    if (!EDITABLE.has(found.state)) return { ok: false, reason: 'not_editable' } as const;
    const recalculate = await recalculation(tx, input.firmId, found, input.files.map((f) => f.fileName));
    const revision = recalculate ? recalculate.revision : workingRevision(found);
    const [{ n }] = (await tx
      .select({ n: count() })
      .from(attachment)
      .where(and(eq(attachment.caseId, found.id), eq(attachment.firmId, input.firmId), visibleIn(revision)))) as [{ n: number }];
    if (n + stored.length > MAX_FILES_PER_CASE) return { ok: false, reason: 'too_many' } as const;
    const ids: string[] = [];
    for (const { file, main, thumb } of stored) {
      const id = randomUUID();
      ids.push(id);
      await tx.insert(attachment).values({
        id,
        firmId: input.firmId,
        caseId: found.id,
        addedInRevision: revision,
        uploaderId: input.userId,
        fileName: file.fileName,
        contentType: file.contentType,
        size: main.size,
        sha256: main.sha256,
        storageKey: main.key,
        thumbnailKey: thumb?.key ?? null,
        caption: input.caption,
        // Distinct and increasing within the transaction, so files list in the order sent.
        createdAt: sql`clock_timestamp()`,
      });
      await recordAudit(tx, {
        firmId: input.firmId,
        actorUserId: input.userId,
        action: 'case.attachment_added',
        targetType: 'case',
        targetId: found.id,
        details: { attachmentId: id, fileName: file.fileName, contentType: file.contentType, size: main.size, sha256: main.sha256, revision },
      });
    }
    if (recalculate) await recalculate.write(input.userId, store);
    const rows = await tx
      .select(columns)
      .from(attachment)
      .innerJoin(user, eq(user.id, attachment.uploaderId))
      .where(and(eq(attachment.firmId, input.firmId), sql`${attachment.id} in ${ids}`))
      .orderBy(asc(attachment.createdAt), asc(attachment.id));
    const order = new Map(ids.map((id, i) => [id, i]));
    rows.sort((a, b) => order.get(a.id)! - order.get(b.id)!);
    return { ok: true, revision, recalculated: recalculate !== null, attachments: rows.map(toView) } as const;
  });
}

/**
 * When a file change on a draft touches a file its latest body reads (by name), the change
 * goes to a new revision (the latest + 1: the same body, recalculated with the files it
 * then sees), so the revision before keeps its files and results. Null when no block reads
 * any of `fileNames`, or the case has no draft revision to recalculate (a published case:
 * the next save evaluates with the files).
 */
async function recalculation(
  tx: Queryable,
  firmId: string,
  found: { id: string; latestRevision: number; publishedRevision: number | null },
  fileNames: readonly string[],
): Promise<{ revision: number; write: (authorId: string, store?: FileStore) => Promise<void> } | null> {
  if (workingRevision(found) !== found.latestRevision) return null;
  const body = await revisionBody(tx, firmId, found.id, found.latestRevision);
  if (body === null) return null;
  const named = new Set(filesNamedIn(body).map((n) => n.toLowerCase()));
  if (!fileNames.some((n) => named.has(n.toLowerCase()))) return null;
  const revision = found.latestRevision + 1;
  return {
    revision,
    write: async (authorId, store) => {
      const results = await evaluateRevision(tx, { firmId, caseId: found.id, revision, body }, store);
      await writeRecalculatedRevision(tx, { firmId, caseId: found.id, number: revision, body, authorId, results });
    },
  };
}

async function lockedAttachment(tx: Queryable, firmId: string, caseId: string, attachmentId: string, userId: string) {
  if (!/^[0-9a-f-]{36}$/.test(attachmentId)) return { ok: false, reason: 'attachment_not_found' } as const;
  const found = await lockCase(tx, firmId, caseId);
  if (!found) return { ok: false, reason: 'not_found' } as const;
  const [row] = await tx
    .select()
    .from(attachment)
    .where(and(eq(attachment.id, attachmentId), eq(attachment.caseId, found.id), eq(attachment.firmId, firmId)));
  const revision = workingRevision(found);
  if (!row || row.addedInRevision > revision) return { ok: false, reason: 'attachment_not_found' } as const;
  if (found.authorId !== userId) return { ok: false, reason: 'not_author' } as const;
  if (!EDITABLE.has(found.state)) return { ok: false, reason: 'not_editable' } as const;
  if (row.removedInRevision !== null && row.removedInRevision <= revision) return { ok: false, reason: 'already_removed' } as const;
  return { ok: true, found, row, revision } as const;
}

/**
 * Removes a file from the revision being worked on. On a published case that is the next
 * revision: the published one keeps the file (it stays downloadable).
 */
export async function removeAttachment(
  database: Database,
  input: { firmId: string; caseId: string; attachmentId: string; userId: string },
  store?: FileStore,
): Promise<{ ok: true; removedInRevision: number; recalculated: boolean } | Fail> {
  return database.transaction(async (tx) => {
    const locked = await lockedAttachment(tx, input.firmId, input.caseId, input.attachmentId, input.userId);
    if (!locked.ok) return locked;
    const recalculate = await recalculation(tx, input.firmId, locked.found, [locked.row.fileName]);
    const revision = recalculate ? recalculate.revision : locked.revision;
    await tx.update(attachment).set({ removedInRevision: revision, removedAt: new Date() }).where(eq(attachment.id, locked.row.id));
    if (recalculate) await recalculate.write(input.userId, store);
    await recordAudit(tx, {
      firmId: input.firmId,
      actorUserId: input.userId,
      action: 'case.attachment_removed',
      targetType: 'case',
      targetId: locked.found.id,
      details: { attachmentId: locked.row.id, fileName: locked.row.fileName, revision, ...(recalculate ? { recalculated: true } : {}) },
    });
    return { ok: true, removedInRevision: revision, recalculated: recalculate !== null } as const;
  });
}

/**
 * Changes a file's caption (the author, in an editable state). A file a published revision
 * shows is not changed in place: it ends at the working revision and a copy with the new
 * caption (a new id, the same stored bytes) starts there.
 */
export async function captionAttachment(
  database: Database,
  input: { firmId: string; caseId: string; attachmentId: string; userId: string; caption: string },
): Promise<{ ok: true; attachment: AttachmentView } | Fail> {
  return database.transaction(async (tx) => {
    const locked = await lockedAttachment(tx, input.firmId, input.caseId, input.attachmentId, input.userId);
    if (!locked.ok) return locked;
    let id = locked.row.id;
    const frozen = locked.found.publishedRevision !== null && locked.row.addedInRevision <= locked.found.publishedRevision;
    if (frozen) {
      // The published revision keeps the caption it had: the old row ends here, a copy carries the new one.
      id = randomUUID();
      await tx.update(attachment).set({ removedInRevision: locked.revision, removedAt: new Date() }).where(eq(attachment.id, locked.row.id));
      const { id: _old, removedInRevision: _r, removedAt: _a, createdAt: _c, ...copy } = locked.row;
      await tx.insert(attachment).values({ ...copy, id, addedInRevision: locked.revision, caption: input.caption });
    } else {
      await tx.update(attachment).set({ caption: input.caption }).where(eq(attachment.id, id));
    }
    await recordAudit(tx, {
      firmId: input.firmId,
      actorUserId: input.userId,
      action: 'case.attachment_captioned',
      targetType: 'case',
      targetId: locked.found.id,
      details: { attachmentId: id, ...(frozen ? { replaces: locked.row.id } : {}), fileName: locked.row.fileName, caption: input.caption, revision: locked.revision },
    });
    const [row] = await tx.select(columns).from(attachment).innerJoin(user, eq(user.id, attachment.uploaderId)).where(eq(attachment.id, id));
    return { ok: true, attachment: toView(row!) } as const;
  });
}
