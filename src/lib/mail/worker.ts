/**
 * The delivery worker: one per server process (a globalThis singleton), started on the
 * first request when SEQUENT_SMTP_URL is set. It drains the outbox every few seconds, and
 * at once after {@link wakeMailWorker} (call it after committing a change that queued mail).
 * Several app servers may each run one: the drain's row locks keep them from sending a
 * message twice.
 */
import { db } from '../../db/client';
import { config } from '../config';
import { drainOutbox } from './deliver';
import { createSmtpTransport, type MailTransport } from './transport';

/** How often the worker looks for due mail when nobody wakes it. */
export const POLL_INTERVAL_MS = 2_000;

interface WorkerState {
  transport: MailTransport;
  timer: NodeJS.Timeout;
  running: boolean;
  again: boolean;
}

const globalForMail = globalThis as unknown as { sequentMailWorker?: WorkerState | null };

async function tick(state: WorkerState): Promise<void> {
  if (state.running) {
    state.again = true;
    return;
  }
  state.running = true;
  try {
    do {
      state.again = false;
      await drainOutbox(db(), state.transport);
    } while (state.again);
  } catch (error) {
    // The database being briefly unreachable must not take the server down; the next
    // tick tries again.
    console.error(`Mail delivery: the outbox could not be read (${error instanceof Error ? error.message : error}).`);
  } finally {
    state.running = false;
  }
}

/**
 * Starts the worker once per process; does nothing when it already runs or when no SMTP
 * server is configured (mail then stays queued). Returns whether a worker is running.
 */
export function startMailWorker(): boolean {
  if (globalForMail.sequentMailWorker !== undefined) return globalForMail.sequentMailWorker !== null;
  const smtpUrl = config().SEQUENT_SMTP_URL;
  if (!smtpUrl) {
    globalForMail.sequentMailWorker = null;
    return false;
  }
  const state: WorkerState = {
    transport: createSmtpTransport(smtpUrl),
    timer: setInterval(() => void tick(state), POLL_INTERVAL_MS),
    running: false,
    again: false,
  };
  state.timer.unref();
  globalForMail.sequentMailWorker = state;
  void tick(state);
  return true;
}

/**
 * Asks this process's worker, if it runs, to look at the outbox now (after a commit that
 * queued mail). Never starts one: scripts (the seed) and test processes that queue mail
 * must be able to exit; the server's worker picks their messages up. Never throws.
 */
export function wakeMailWorker(): void {
  const state = globalForMail.sequentMailWorker;
  if (state) setImmediate(() => void tick(state));
}

/** Stops the worker of this process (tests, shutdown). */
export function stopMailWorker(): void {
  const state = globalForMail.sequentMailWorker;
  if (state) {
    clearInterval(state.timer);
    state.transport.close?.();
  }
  globalForMail.sequentMailWorker = undefined;
}
