/**
 * Number formatting for result tables: significant figures, plain notation for ordinary
 * magnitudes, exponent notation only outside 10⁻³…10⁷.
 */
import type { Quantity } from './quantity';
import { displayUnit, fromSI, type UnitDefinition, type UnitSystem } from './units';

/** Default significant figures of displayed results. */
export const DEFAULT_SIGNIFICANT = 4;

/**
 * Formats `x` with `significant` figures (1–15): `3.142`, `0.01235`, `12350`, `1.235e+8`.
 * Trailing zeros are kept (they state the precision); non-finite values render as `"—"`.
 */
export function formatNumber(x: number, significant = DEFAULT_SIGNIFICANT): string {
  if (!Number.isInteger(significant) || significant < 1 || significant > 15) {
    throw new RangeError('formatNumber: significant must be an integer from 1 to 15');
  }
  if (!Number.isFinite(x)) return '—';
  if (x === 0) return '0';
  const magnitude = Math.abs(x);
  if (magnitude < 1e-3 || magnitude >= 1e7) return x.toExponential(significant - 1);
  const rounded = Number(x.toPrecision(significant));
  const exponent = Math.floor(Math.log10(Math.abs(rounded)));
  return rounded.toFixed(Math.max(0, significant - 1 - exponent));
}

/**
 * Formats an SI value of `quantity` in a unit system's display unit (or a given unit):
 * `formatQuantity(1.5, 'length', 'US')` → `"4.921 ft"`.
 */
export function formatQuantity(
  valueSI: number,
  quantity: Quantity,
  target: UnitSystem | UnitDefinition,
  significant = DEFAULT_SIGNIFICANT,
): string {
  const unit = typeof target === 'string' ? displayUnit(quantity, target) : target;
  if (unit === undefined) return formatNumber(valueSI, significant);
  const text = formatNumber(fromSI(valueSI, unit), significant);
  return unit.display === '' ? text : `${text} ${unit.display}`;
}
