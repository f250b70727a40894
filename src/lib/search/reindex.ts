/**
 * Rebuilding the search index from PostgreSQL: every published case of every firm goes
 * into a fresh index, which then takes the live index's place in one swap (searches keep
 * answering from the old one until then), and the old one is deleted.
 *
 * The rebuild holds the search-sync advisory lock for its whole run, so no drain writes
 * to the live index meanwhile; changes committed during the rebuild wait in the outbox and
 * are drained into the new index right after the swap. Nothing is missed either way: the
 * documents come from the database, not from the old index.
 */
import { sql } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/node-postgres';
import type pg from 'pg';
import { countPublishedCases, loadSearchDocumentPage } from './load';
import { ensureIndex, upsertDocuments, type SearchService } from './service';
import { SEARCH_SYNC_LOCK } from './sync';

/** Cases sent per request while rebuilding. */
export const REINDEX_BATCH = 500;

/** Progress of a rebuild: cases indexed so far of the total. */
export type ReindexProgress = (done: number, total: number) => void;

/** What a rebuild did. */
export interface ReindexResult {
  indexed: number;
  ms: number;
}

/** Rebuilds the index of `service` from the database behind `pool`; see the module comment. */
export async function reindexAll(pool: pg.Pool, service: SearchService, onProgress: ReindexProgress = () => {}): Promise<ReindexResult> {
  const started = performance.now();
  const connection = await pool.connect();
  const database = drizzle(connection);
  try {
    // Waits for a drain in progress to finish, then keeps the others out.
    await database.execute(sql`select pg_advisory_lock(${SEARCH_SYNC_LOCK})`);
    const total = await countPublishedCases(database);
    const live = service.indexUid;
    const fresh = `${live}-rebuild`;
    await service.client.deleteIndexIfExists(fresh);
    await ensureIndex(service, live);
    await ensureIndex(service, fresh, { force: true });
    onProgress(0, total);
    let done = 0;
    let after: string | null = null;
    for (;;) {
      const page = await loadSearchDocumentPage(database, after, REINDEX_BATCH);
      if (page.length === 0) break;
      await upsertDocuments(service, page, fresh);
      done += page.length;
      after = page[page.length - 1]!.id;
      onProgress(Math.min(done, Math.max(total, done)), Math.max(total, done));
    }
    const swapped = await service.client.swapIndexes([{ indexes: [live, fresh], rename: false }]).waitTask({ timeout: 30_000 });
    if (swapped.status !== 'succeeded') throw new Error(`Swapping in the rebuilt index failed: ${swapped.error?.message ?? swapped.status}`);
    await service.client.deleteIndex(fresh).waitTask({ timeout: 30_000 });
    return { indexed: done, ms: performance.now() - started };
  } finally {
    await database.execute(sql`select pg_advisory_unlock(${SEARCH_SYNC_LOCK})`).catch(() => {});
    connection.release();
  }
}
