/**
 * The outgoing mail queue. A message is written in the same transaction as the change it
 * announces, so a transition and its e-mail commit together; a worker sends it later and
 * retries while the SMTP server is unreachable. Sending never blocks or fails a change.
 */
import { sql } from 'drizzle-orm';
import { bigserial, check, index, integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { organization } from './auth';

export const mailOutbox = pgTable(
  'mail_outbox',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    /** The firm the message is about; null for account mail (password reset). */
    firmId: text('firm_id').references(() => organization.id, { onDelete: 'restrict' }),
    /** What the message announces, e.g. `review.requested` (see src/lib/mail). */
    kind: text('kind').notNull(),
    /** One recipient per row, so one bad address does not hold up the others. */
    toAddress: text('to_address').notNull(),
    subject: text('subject').notNull(),
    textBody: text('text_body').notNull(),
    htmlBody: text('html_body').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    attempts: integer('attempts').notNull().default(0),
    /** When the worker may next try; moves back after each failure. */
    nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp('sent_at', { withTimezone: true }),
    lastError: text('last_error'),
  },
  (t) => [
    // The worker's query: unsent messages that are due.
    index('mail_outbox_due_idx').on(t.nextAttemptAt).where(sql`${t.sentAt} is null`),
    check('mail_outbox_attempts_check', sql`${t.attempts} >= 0`),
  ],
);
