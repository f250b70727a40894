/**
 * Tailwater rating table: depth against discharge, interpolated piecewise-linearly in Q and
 * never extrapolated.
 */
import { fail, type SolverFailure } from './result';

/** A rating as two columns: discharges strictly increasing (m³/s) and depths (m). */
export interface RatingTable {
  /** Discharges, m³/s, strictly increasing. */
  readonly discharge: readonly number[];
  /** Tailwater depths above the apron, m, one per discharge. */
  readonly depth: readonly number[];
  /** Where the rows came from (a file name), for messages; default "Rating". */
  readonly source?: string;
  /** The row number of each row in its source (a spreadsheet row), for messages; default 1, 2, … */
  readonly rowNumbers?: readonly number[];
}

/** Checks a rating table; returns a failure naming the field, or `null`. */
export function validateRatingTable(table: unknown, field = 'tailwaterRating'): SolverFailure | null {
  if (typeof table !== 'object' || table === null) return fail('invalid-input', 'A tailwater rating table (discharge, depth) is required.', field);
  const { discharge, depth, source, rowNumbers } = table as Record<string, unknown>;
  const label = typeof source === 'string' && source ? source : 'Rating';
  const rowOf = (i: number) => (Array.isArray(rowNumbers) && typeof rowNumbers[i] === 'number' ? rowNumbers[i] : i + 1);
  if (!Array.isArray(discharge) || !Array.isArray(depth) || discharge.length !== depth.length) {
    return fail('invalid-input', 'The tailwater rating needs two columns, discharge and depth, of equal length.', field);
  }
  if (discharge.length < 2) return fail('invalid-input', 'The tailwater rating needs at least two rows.', field);
  for (let i = 0; i < discharge.length; i++) {
    const q = discharge[i];
    const y = depth[i];
    if (typeof q !== 'number' || !Number.isFinite(q) || q < 0) return fail('invalid-input', `${label} row ${rowOf(i)}: discharge must be a finite number ≥ 0.`, field);
    if (typeof y !== 'number' || !Number.isFinite(y) || y <= 0) return fail('invalid-input', `${label} row ${rowOf(i)}: depth must be a finite number > 0.`, field);
    if (i > 0 && !(q > (discharge[i - 1] as number))) return fail('invalid-input', `${label} row ${rowOf(i)}: discharges must increase strictly from row to row.`, field);
  }
  return null;
}

/** Depth at discharge `q` by linear interpolation; `NaN` outside the table's range (no extrapolation). */
export function interpolateRating(table: RatingTable, q: number): number {
  const xs = table.discharge;
  const n = xs.length;
  if (!(q >= (xs[0] as number) && q <= (xs[n - 1] as number))) return Number.NaN;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if ((xs[mid] as number) <= q) lo = mid;
    else hi = mid;
  }
  const x0 = xs[lo] as number;
  const x1 = xs[hi] as number;
  const y0 = table.depth[lo] as number;
  const y1 = table.depth[hi] as number;
  return x1 === x0 ? y0 : y0 + ((q - x0) / (x1 - x0)) * (y1 - y0);
}
