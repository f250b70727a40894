/**
 * A precedent search for the API: the search service's answer for the caller's firm plus
 * how many of the firm's changes are still on their way into the index.
 */
import type { Database } from '../../db/client';
import type { PrecedentResults } from './results';
import { runSearch, SearchUnavailableError, searchService } from './service';
import { pendingSearchUpdates } from './sync';
import type { ValidPrecedentQuery } from './validation';

/** The outcome of {@link searchPrecedents}: results, or why there are none. */
export type PrecedentSearch =
  | { ok: true; results: PrecedentResults }
  | { ok: false; reason: 'not_configured' | 'unavailable'; message: string; pending: number };

/** How long a firm's count of waiting changes is reused by searches that succeed. */
export const PENDING_COUNT_TTL_MS = 1_000;
const pendingCounts = new Map<string, { at: number; count: Promise<number> }>();

/**
 * The firm's waiting changes, counted at most once a second for searches that succeed (a
 * note on the page, not worth a query per keystroke); `fresh` counts now.
 */
function pendingOf(database: Database, firmId: string, fresh: boolean): Promise<number> {
  const now = Date.now();
  const known = pendingCounts.get(firmId);
  if (!fresh && known && now - known.at < PENDING_COUNT_TTL_MS) return known.count;
  const count = pendingSearchUpdates(database, firmId);
  if (pendingCounts.size > 1_000) pendingCounts.clear();
  pendingCounts.set(firmId, { at: now, count });
  count.catch(() => pendingCounts.delete(firmId));
  return count;
}

/** Searches the published cases of `firmId`; never throws for the search service being down. */
export async function searchPrecedents(database: Database, firmId: string, query: ValidPrecedentQuery): Promise<PrecedentSearch> {
  const started = performance.now();
  const service = searchService();
  if (!service) {
    return { ok: false, reason: 'not_configured', message: 'Precedent search is not set up on this server (SEQUENT_SEARCH_URL is unset). Ask whoever runs Sequent.', pending: await pendingOf(database, firmId, true) };
  }
  const pending = pendingOf(database, firmId, false);
  try {
    const [results, waiting] = await Promise.all([runSearch(service, firmId, query), pending]);
    return { ok: true, results: { ...results, pending: waiting, tookMs: Math.round((performance.now() - started) * 10) / 10 } };
  } catch (error) {
    if (!(error instanceof SearchUnavailableError)) throw error;
    console.error(`Precedent search: ${error.message}`);
    return {
      ok: false,
      reason: 'unavailable',
      message: 'Precedent search is not answering just now. Publishing and everything else still works; try the search again in a minute.',
      pending: await pendingOf(database, firmId, true),
    };
  }
}
