/**
 * The delivery worker: one per server process, started on the first request when
 * SEQUENT_SMTP_URL is set (`backgroundWorker`, src/lib/background). It drains the outbox
 * every few seconds, and at once after {@link wakeMailWorker} (call it after committing a
 * change that queued mail). Several app servers may each run one: the drain's row locks
 * keep them from sending a message twice.
 */
import { db } from '../../db/client';
import { backgroundWorker, reasonOf } from '../background';
import { config } from '../config';
import { drainOutbox } from './deliver';
import { createSmtpTransport, type MailTransport } from './transport';

/** How often the worker looks for due mail when nobody wakes it. */
export const POLL_INTERVAL_MS = 2_000;

const worker = backgroundWorker<MailTransport>({
  key: 'sequentMailWorker',
  intervalMs: POLL_INTERVAL_MS,
  // No SMTP server configured: mail stays queued.
  setup: () => {
    const smtpUrl = config().SEQUENT_SMTP_URL;
    return smtpUrl ? createSmtpTransport(smtpUrl) : null;
  },
  turn: async (transport) => {
    await drainOutbox(db(), transport);
    return false;
  },
  // The database being briefly unreachable must not take the server down; the next tick tries again.
  failed: (error) => `Mail delivery: the outbox could not be read (${reasonOf(error)}).`,
  close: (transport) => transport.close?.(),
});

/** Starts the worker once per process; false when no SMTP server is configured. */
export const startMailWorker = (): boolean => worker.start();

/** Asks this process's worker, if it runs, to look at the outbox now. Never starts one; never throws. */
export const wakeMailWorker = (): void => worker.wake();

/** Stops the worker of this process (tests, shutdown). */
export const stopMailWorker = (): void => worker.stop();
