/**
 * The search outbox. A row says "this case's search document may have changed" and is
 * written in the same transaction as the change (publish, supersede, withdraw, an edit of a
 * published case's metadata), so the two commit together. A worker drains it into the
 * search service; the document is rebuilt from PostgreSQL at that moment, so draining is
 * idempotent and a late or repeated row never puts stale data in the index. Search being
 * down never fails a change: rows wait, with backoff, until it is back.
 */
import { sql } from 'drizzle-orm';
import { bigserial, check, index, integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { organization } from './auth';

export const searchOutbox = pgTable(
  'search_outbox',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    firmId: text('firm_id')
      .notNull()
      .references(() => organization.id, { onDelete: 'restrict' }),
    /** The case whose document to rebuild (or remove, when it is no longer published). */
    caseId: text('case_id').notNull(),
    /** Why, for the log: `published`, `superseded`, `withdrawn`, `edited`. */
    reason: text('reason').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    attempts: integer('attempts').notNull().default(0),
    /** When the worker may next try; moves back after each failure. Rows are deleted once indexed. */
    nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
    lastError: text('last_error'),
  },
  (t) => [
    index('search_outbox_due_idx').on(t.nextAttemptAt),
    check('search_outbox_attempts_check', sql`${t.attempts} >= 0`),
  ],
);
