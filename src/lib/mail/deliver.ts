/**
 * Draining the outbox: claim due, unsent rows with `FOR UPDATE SKIP LOCKED` (so two app
 * servers, or two drains in one, never take the same row), send each, and mark it sent
 * or postpone it with a growing delay. The claim and the marks share one transaction per
 * batch; a crash between a send and the commit can send a message twice, never lose one.
 */
import { and, asc, inArray, isNull, lte, sql } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { mailOutbox } from '../../db/schema';
import { config } from '../config';
import { nextAttemptAt } from './backoff';
import { describeSendError, isConnectionFailure, type MailTransport } from './transport';

/** Rows claimed per transaction: bounds how long a slow server keeps rows locked. */
const BATCH_SIZE = 20;

/** What one drain did. */
export interface DrainResult {
  sent: number;
  failed: number;
}

/** Optional limits on a drain. */
export interface DrainScope {
  /** Only these outbox rows (tests, which share the database with the test app's worker). */
  ids?: readonly number[];
  /** The sender; defaults to SEQUENT_MAIL_FROM. */
  from?: string;
}

/**
 * Sends every outbox row that is unsent and due at `now` through `transport`, batch by
 * batch, until none is left. Never throws for a failed send: the row keeps `sent_at`
 * null, gets `attempts + 1`, `last_error` and a later `next_attempt_at`.
 */
export async function drainOutbox(database: Database, transport: MailTransport, now: Date = new Date(), scope: DrainScope = {}): Promise<DrainResult> {
  const from = scope.from ?? config().SEQUENT_MAIL_FROM;
  const total: DrainResult = { sent: 0, failed: 0 };
  if (scope.ids && scope.ids.length === 0) return total;
  for (;;) {
    const batch = await drainBatch(database, transport, now, from, scope.ids);
    total.sent += batch.sent;
    total.failed += batch.failed;
    // Stop when nothing was claimed, and after failures (the server is likely down; the
    // postponed rows are not due again at `now` anyway).
    if (batch.sent + batch.failed < BATCH_SIZE || batch.failed > 0) return total;
  }
}

async function drainBatch(database: Database, transport: MailTransport, now: Date, from: string, ids?: readonly number[]): Promise<DrainResult> {
  return database.transaction(async (tx) => {
    const rows = await tx
      .select({ id: mailOutbox.id, to: mailOutbox.toAddress, subject: mailOutbox.subject, text: mailOutbox.textBody, html: mailOutbox.htmlBody, attempts: mailOutbox.attempts })
      .from(mailOutbox)
      .where(and(isNull(mailOutbox.sentAt), lte(mailOutbox.nextAttemptAt, now), ids ? inArray(mailOutbox.id, [...ids]) : undefined))
      .orderBy(asc(mailOutbox.nextAttemptAt), asc(mailOutbox.id))
      .limit(BATCH_SIZE)
      .for('update', { skipLocked: true });

    const result: DrainResult = { sent: 0, failed: 0 };
    let unreachable: string | null = null;
    for (const row of rows) {
      let failure: string | null = unreachable;
      if (failure === null) {
        try {
          await transport.sendMail({ from, to: row.to, subject: row.subject, text: row.text, html: row.html });
        } catch (error) {
          failure = describeSendError(error);
          if (isConnectionFailure(error)) unreachable = failure;
        }
      }
      if (failure === null) {
        await tx.update(mailOutbox).set({ sentAt: now, lastError: null }).where(sql`${mailOutbox.id} = ${row.id}`);
        result.sent += 1;
      } else {
        const attempts = row.attempts + 1;
        await tx
          .update(mailOutbox)
          .set({ attempts, lastError: failure, nextAttemptAt: nextAttemptAt(now, attempts) })
          .where(sql`${mailOutbox.id} = ${row.id}`);
        result.failed += 1;
      }
    }
    return result;
  });
}
