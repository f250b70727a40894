/**
 * Draining the search outbox into the index. One drainer at a time across every app
 * server (a transaction-level advisory lock; the others skip their turn), and never while
 * a reindex rebuilds the index (it holds the same lock), so documents always reach the
 * index in the order their changes committed.
 *
 * Each turn takes up to {@link DRAIN_BATCH} due rows, rebuilds the documents of their cases
 * from PostgreSQL, sends the published ones and removes the others, then deletes the rows.
 * When the service fails, the rows stay with `attempts`, `last_error` and a later
 * `next_attempt_at` (1 s doubling to 5 min), and nothing else changes.
 */
import { sql } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { nextAttemptAt } from '../mail';
import { loadSearchDocuments } from './load';
import { describeSearchError, ensureIndex, removeDocuments, upsertDocuments, type SearchService } from './service';

/** Rows handled in one turn. */
export const DRAIN_BATCH = 200;

/** The advisory lock key that serialises drains and reindexing (any constant of our own). */
export const SEARCH_SYNC_LOCK = 0x5e9e_4e01;

/** What one turn did. */
export interface SearchDrainResult {
  /** False when another drainer or a reindex held the lock (nothing was tried). */
  ran: boolean;
  indexed: number;
  removed: number;
  /** Rows left for a later attempt because the service failed. */
  failed: number;
  error?: string;
}

interface DueRow extends Record<string, unknown> {
  id: number;
  case_id: string;
  attempts: number;
}

/** One turn of the drain; see the module comment. Never throws for a search-service failure. */
export async function drainSearchOutbox(database: Database, service: SearchService, now = new Date()): Promise<SearchDrainResult> {
  return database.transaction(async (tx) => {
    const lock = await tx.execute<{ locked: boolean }>(sql`select pg_try_advisory_xact_lock(${SEARCH_SYNC_LOCK}) as locked`);
    if (!lock.rows[0]?.locked) return { ran: false, indexed: 0, removed: 0, failed: 0 };
    const due = await tx.execute<DueRow>(sql`
      select id, case_id, attempts from search_outbox
       where next_attempt_at <= ${now}
       order by id
       limit ${DRAIN_BATCH}
       for update skip locked`);
    if (due.rows.length === 0) return { ran: true, indexed: 0, removed: 0, failed: 0 };
    const ids = due.rows.map((r) => Number(r.id));
    const caseIds = [...new Set(due.rows.map((r) => r.case_id))];
    const documents = await loadSearchDocuments(tx, caseIds);
    const published = new Set(documents.map((d) => d.id));
    const gone = caseIds.filter((id) => !published.has(id));
    try {
      await ensureIndex(service);
      await upsertDocuments(service, documents);
      await removeDocuments(service, gone);
    } catch (error) {
      const message = describeSearchError(error).slice(0, 1000);
      for (const row of due.rows) {
        await tx.execute(sql`
          update search_outbox set attempts = attempts + 1, last_error = ${message},
                 next_attempt_at = ${nextAttemptAt(now, row.attempts + 1)}
           where id = ${row.id}`);
      }
      return { ran: true, indexed: 0, removed: 0, failed: ids.length, error: message };
    }
    await tx.execute(sql`delete from search_outbox where id in (${sql.join(ids.map((id) => sql`${id}`), sql`, `)})`);
    return { ran: true, indexed: documents.length, removed: gone.length, failed: 0 };
  });
}

/** Changes of `firmId` not yet in the index (all firms when null). */
export async function pendingSearchUpdates(database: Pick<Database, 'execute'>, firmId: string | null): Promise<number> {
  const result = await database.execute<{ n: number }>(
    firmId === null
      ? sql`select count(*)::int as n from search_outbox`
      : sql`select count(*)::int as n from search_outbox where firm_id = ${firmId}`,
  );
  return result.rows[0]?.n ?? 0;
}
