/**
 * The search worker: one per server process (a globalThis singleton), started on the first
 * request when SEQUENT_SEARCH_URL is set. It drains the search outbox every few seconds,
 * and at once after {@link wakeSearchWorker} (call it after committing a change that queued
 * a search update). A turn that finds more due rows than one batch goes round again.
 */
import { db } from '../../db/client';
import { drainSearchOutbox, DRAIN_BATCH } from './sync';
import { searchService, type SearchService } from './service';

/** How often the worker looks for due updates when nobody wakes it. */
export const SEARCH_POLL_INTERVAL_MS = 2_000;

interface WorkerState {
  service: SearchService;
  timer: NodeJS.Timeout;
  running: boolean;
  again: boolean;
  /** The last failure logged, so an outage is logged once, not every two seconds. */
  lastError: string | null;
}

const globalForSearch = globalThis as unknown as { sequentSearchWorker?: WorkerState | null };

async function tick(state: WorkerState): Promise<void> {
  if (state.running) {
    state.again = true;
    return;
  }
  state.running = true;
  try {
    do {
      state.again = false;
      const result = await drainSearchOutbox(db(), state.service);
      if (result.error && result.error !== state.lastError) {
        console.error(`Search index: ${result.failed} update(s) wait for the search service (${result.error}).`);
      } else if (!result.error && state.lastError && result.indexed + result.removed > 0) {
        console.error('Search index: the search service answers again; waiting updates are going in.');
      }
      if (result.ran) state.lastError = result.error ?? null;
      if (result.ran && !result.error && result.indexed + result.removed >= DRAIN_BATCH) state.again = true;
    } while (state.again);
  } catch (error) {
    // The database being briefly unreachable must not take the server down.
    console.error(`Search index: the outbox could not be read (${error instanceof Error ? error.message : error}).`);
  } finally {
    state.running = false;
  }
}

/** Starts the worker once per process; does nothing without a search service. */
export function startSearchWorker(): boolean {
  if (globalForSearch.sequentSearchWorker !== undefined) return globalForSearch.sequentSearchWorker !== null;
  const service = searchService();
  if (!service) {
    globalForSearch.sequentSearchWorker = null;
    return false;
  }
  const state: WorkerState = {
    service,
    timer: setInterval(() => void tick(state), SEARCH_POLL_INTERVAL_MS),
    running: false,
    again: false,
    lastError: null,
  };
  state.timer.unref();
  globalForSearch.sequentSearchWorker = state;
  void tick(state);
  return true;
}

/** Asks this process's worker, if it runs, to drain now. Never starts one; never throws. */
export function wakeSearchWorker(): void {
  const state = globalForSearch.sequentSearchWorker;
  if (state) setImmediate(() => void tick(state));
}

/** Stops the worker of this process (tests, shutdown). */
export function stopSearchWorker(): void {
  const state = globalForSearch.sequentSearchWorker;
  if (state) clearInterval(state.timer);
  globalForSearch.sequentSearchWorker = undefined;
}
