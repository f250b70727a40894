/**
 * The search worker: one per server process, started on the first request when
 * SEQUENT_SEARCH_URL is set (`backgroundWorker`, src/lib/background). It drains the search
 * outbox every few seconds, and at once after {@link wakeSearchWorker} (call it after
 * committing a change that queued a search update). A turn that finds more due rows than
 * one batch goes round again.
 */
import { db } from '../../db/client';
import { backgroundWorker, reasonOf } from '../background';
import { drainSearchOutbox, DRAIN_BATCH } from './sync';
import { searchService, type SearchService } from './service';

/** How often the worker looks for due updates when nobody wakes it. */
export const SEARCH_POLL_INTERVAL_MS = 2_000;

interface SearchWorker {
  service: SearchService;
  /** The last failure logged, so an outage is logged once, not every two seconds. */
  lastError: string | null;
}

const worker = backgroundWorker<SearchWorker>({
  key: 'sequentSearchWorker',
  intervalMs: SEARCH_POLL_INTERVAL_MS,
  setup: () => {
    const service = searchService();
    return service ? { service, lastError: null } : null;
  },
  turn: async (state) => {
    const result = await drainSearchOutbox(db(), state.service);
    if (result.error && result.error !== state.lastError) {
      console.error(`Search index: ${result.failed} update(s) wait for the search service (${result.error}).`);
    } else if (!result.error && state.lastError && result.indexed + result.removed > 0) {
      console.error('Search index: the search service answers again; waiting updates are going in.');
    }
    if (result.ran) state.lastError = result.error ?? null;
    return result.ran && !result.error && result.indexed + result.removed >= DRAIN_BATCH;
  },
  // The database being briefly unreachable must not take the server down.
  failed: (error) => `Search index: the outbox could not be read (${reasonOf(error)}).`,
});

/** Starts the worker once per process; false without a search service. */
export const startSearchWorker = (): boolean => worker.start();

/** Asks this process's worker, if it runs, to drain now. Never starts one; never throws. */
export const wakeSearchWorker = (): void => worker.wake();

/** Stops the worker of this process (tests, shutdown). */
export const stopSearchWorker = (): void => worker.stop();
