/**
 * Files attached to a case: photos, PDFs and CSVs. The bytes live in the file store
 * (src/lib/storage, content-addressed by SHA-256); this table says which case, which
 * revisions see them, who added them and what they are. Rows are never deleted: removing
 * an attachment sets `removed_in_revision`, so a published revision keeps its files.
 */
import { sql } from 'drizzle-orm';
import { bigint, check, foreignKey, index, integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { organization, user } from './auth';
import { caseFile } from './cases';

/** One file of a case, visible for revisions `added_in_revision <= n < removed_in_revision`. */
export const attachment = pgTable(
  'attachment',
  {
    id: text('id').primaryKey(),
    firmId: text('firm_id')
      .notNull()
      .references(() => organization.id, { onDelete: 'restrict' }),
    caseId: text('case_id').notNull(),
    /** The first revision that shows the file. */
    addedInRevision: integer('added_in_revision').notNull(),
    /** The first revision that no longer shows it; null while it stays. */
    removedInRevision: integer('removed_in_revision'),
    uploaderId: text('uploader_id')
      .notNull()
      .references(() => user.id, { onDelete: 'restrict' }),
    /** The sanitised name shown and offered on download. */
    fileName: text('file_name').notNull(),
    /** Detected from the content, never from the name or the browser. */
    contentType: text('content_type').notNull(),
    size: bigint('size', { mode: 'number' }).notNull(),
    sha256: text('sha256').notNull(),
    storageKey: text('storage_key').notNull(),
    /** A 320 px wide WebP for images; null for other files. */
    thumbnailKey: text('thumbnail_key'),
    caption: text('caption').notNull().default(''),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    removedAt: timestamp('removed_at', { withTimezone: true }),
  },
  (t) => [
    foreignKey({ name: 'attachment_case_fk', columns: [t.caseId, t.firmId], foreignColumns: [caseFile.id, caseFile.firmId] }).onDelete('restrict'),
    index('attachment_case_idx').on(t.caseId, t.createdAt),
    index('attachment_firm_idx').on(t.firmId),
    check('attachment_size_check', sql`${t.size} > 0`),
    check('attachment_revisions_check', sql`${t.removedInRevision} is null or ${t.removedInRevision} >= ${t.addedInRevision}`),
    check('attachment_caption_check', sql`length(${t.caption}) <= 500`),
  ],
);
