/** The first retry waits this long after a failed delivery. */
export const FIRST_RETRY_MS = 1_000;
/** No retry waits longer than this: an SMTP server back after an outage gets its mail within minutes. */
export const MAX_RETRY_MS = 5 * 60_000;

/**
 * How long to wait before the next attempt after `attempts` failed ones: 1 s, 2 s, 4 s, …
 * doubling up to {@link MAX_RETRY_MS}. Attempts below 1 count as 1.
 */
export function retryDelayMs(attempts: number): number {
  const n = Number.isFinite(attempts) ? Math.max(1, Math.floor(attempts)) : 1;
  // 2^20 s is already far past the cap; stop doubling before numbers get silly.
  return Math.min(MAX_RETRY_MS, FIRST_RETRY_MS * 2 ** Math.min(n - 1, 20));
}

/** When the next attempt may run: `now` plus {@link retryDelayMs}. */
export function nextAttemptAt(now: Date, attempts: number): Date {
  return new Date(now.getTime() + retryDelayMs(attempts));
}
