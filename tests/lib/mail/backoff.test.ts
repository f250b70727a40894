import { describe, expect, it } from 'vitest';
import { FIRST_RETRY_MS, MAX_RETRY_MS, nextAttemptAt, retryDelayMs } from '../../../src/lib/mail/backoff';

describe('retryDelayMs(attempts)', () => {
  it.each([
    [1, 1_000],
    [2, 2_000],
    [3, 4_000],
    [5, 16_000],
    [9, 256_000],
    [10, MAX_RETRY_MS],
    [50, MAX_RETRY_MS],
    [10_000, MAX_RETRY_MS],
  ])('waits %i failed attempts → %i ms', (attempts, expected) => {
    expect(retryDelayMs(attempts)).toBe(expected);
  });

  it('treats zero, negative, fractional and non-finite counts as one attempt or its floor', () => {
    expect(retryDelayMs(0)).toBe(FIRST_RETRY_MS);
    expect(retryDelayMs(-3)).toBe(FIRST_RETRY_MS);
    expect(retryDelayMs(Number.NaN)).toBe(FIRST_RETRY_MS);
    expect(retryDelayMs(Number.POSITIVE_INFINITY)).toBe(FIRST_RETRY_MS);
    expect(retryDelayMs(2.9)).toBe(2_000);
  });

  it('never decreases and never passes the cap', () => {
    let previous = 0;
    for (let n = 1; n <= 40; n++) {
      const delay = retryDelayMs(n);
      expect(delay).toBeGreaterThanOrEqual(previous);
      expect(delay).toBeLessThanOrEqual(MAX_RETRY_MS);
      previous = delay;
    }
  });
});

describe('nextAttemptAt(now, attempts)', () => {
  it('adds the delay to now', () => {
    const now = new Date('2030-01-01T00:00:00Z');
    expect(nextAttemptAt(now, 3).toISOString()).toBe('2030-01-01T00:00:04.000Z');
  });
});
