/**
 * Figures as the results table prints them: three significant figures, a range as
 * `4.1–6.3`, one value when both ends read the same, `—` when the case has none. Pure and
 * tiny, so the search island does not pull the solver into the browser for it.
 */

/** `value` to three significant figures, without exponent notation for everyday sizes. */
export function figure(value: number): string {
  if (!Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e6 || magnitude < 1e-3) return value.toExponential(2);
  const digits = Math.max(0, 2 - Math.floor(Math.log10(magnitude)));
  return Number(value.toFixed(digits)).toString();
}

/** A figure range; see the module comment. */
export function figureRange(min: number | null, max: number | null): string {
  if (min === null && max === null) return '—';
  const a = figure(min ?? max!);
  const b = figure(max ?? min!);
  return a === b ? a : `${a}–${b}`;
}
