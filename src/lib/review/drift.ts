/**
 * Drift: how today's results of a case differ from the snapshot its reviewer approved.
 * Pure (no I/O): compares two `CaseEvaluation`s block by block (matched by position, as
 * the body of a published revision never changes), output by output (matched by name)
 * and, for sweeps, cell by cell.
 *
 * Numbers are compared in SI against the approved value: a figure drifts when
 * `|now − approved| > max(relative × |approved|, absolute)`. Text values (a jump type)
 * compare exactly; a value that became or stopped being defined drifts.
 */
import type { BlockResult, CaseEvaluation, ShownValue } from '../calc/results';

/** When two numbers count as the same result. */
export interface DriftTolerance {
  /** Relative to the approved value. */
  readonly relative: number;
  /** Floor in SI units, for values at or near zero (where a relative test means nothing). */
  readonly absolute: number;
}

/**
 * The default tolerance: results are printed to 4 significant figures, so a relative change
 * of 1e-3 is about one unit in the last printed figure, which is what an engineer reading
 * the page would notice. Smaller differences (root-finder stopping rules, floating-point
 * order) are noise. The 1e-9 SI floor keeps values that are zero in both from drifting on
 * rounding dust.
 */
export const DRIFT_TOLERANCE: DriftTolerance = { relative: 1e-3, absolute: 1e-9 };

/** At most this many sweep cells are listed per block; the rest are counted. */
export const MAX_TABLE_CELLS_LISTED = 20;

/** One side of a figure: the stored value and how it was printed. */
export interface FigureSide {
  readonly value: number | string | readonly number[] | null;
  readonly text: string;
}

/** One figure whose value moved beyond the tolerance. */
export interface FigureDrift {
  /** The output's stable key, or the sweep column's. */
  readonly name: string;
  readonly label: string;
  readonly symbol: string;
  /** Display unit, empty for dimensionless values and text. */
  readonly unit: string;
  /** Null when the figure did not exist on that side. */
  readonly approved: FigureSide | null;
  readonly current: FigureSide | null;
  /** (now − approved) / |approved| for numbers with a non-zero approved value; null otherwise. */
  readonly relativeDifference: number | null;
  /** For a sweep cell: the row (from 0) and what identifies it, e.g. `Q = 85.00 m³/s`. */
  readonly row?: number;
  readonly rowLabel?: string;
}

/** How a block's results changed. */
export type BlockChange = 'figures' | 'status' | 'appeared' | 'disappeared';

/** A block whose results differ from the approved snapshot. */
export interface BlockDrift {
  readonly index: number;
  readonly title: string;
  readonly name: string | null;
  readonly change: BlockChange;
  /** `ok` or `error` on each side; null where the block does not exist. */
  readonly approvedStatus: BlockResult['status'] | null;
  readonly currentStatus: BlockResult['status'] | null;
  readonly figures: readonly FigureDrift[];
  /** Sweep cells that drift beyond the {@link MAX_TABLE_CELLS_LISTED} listed. */
  readonly moreTableCells: number;
}

/** True when two SI numbers are the same result within `tolerance`. */
export function withinTolerance(approved: number, current: number, tolerance: DriftTolerance = DRIFT_TOLERANCE): boolean {
  if (Number.isNaN(approved) || Number.isNaN(current)) return Number.isNaN(approved) && Number.isNaN(current);
  if (approved === current) return true;
  if (!Number.isFinite(approved) || !Number.isFinite(current)) return false;
  return Math.abs(current - approved) <= Math.max(tolerance.relative * Math.abs(approved), tolerance.absolute);
}

type Value = ShownValue['si'];

function sameValue(a: Value | undefined, b: Value | undefined, tolerance: DriftTolerance): boolean {
  if (a === undefined || a === null || b === undefined || b === null) return (a ?? null) === (b ?? null);
  if (typeof a === 'number' && typeof b === 'number') return withinTolerance(a, b, tolerance);
  if (typeof a === 'string' || typeof b === 'string') return a === b;
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((x, i) => withinTolerance(x, b[i]!, tolerance));
  return false;
}

function relativeDifference(a: Value | undefined, b: Value | undefined): number | null {
  if (typeof a !== 'number' || typeof b !== 'number' || a === 0 || !Number.isFinite(a) || !Number.isFinite(b)) return null;
  return (b - a) / Math.abs(a);
}

function compareOutputs(approved: readonly ShownValue[], current: readonly ShownValue[], tolerance: DriftTolerance): FigureDrift[] {
  const now = new Map(current.map((v) => [v.name, v]));
  const then = new Map(approved.map((v) => [v.name, v]));
  const names = [...then.keys(), ...current.filter((v) => !then.has(v.name)).map((v) => v.name)];
  const out: FigureDrift[] = [];
  for (const name of names) {
    const a = then.get(name);
    const b = now.get(name);
    if (a && b && sameValue(a.si, b.si, tolerance)) continue;
    const shown = (b ?? a)!;
    out.push({
      name,
      label: shown.label,
      symbol: shown.symbol,
      unit: shown.unit,
      approved: a ? { value: a.si, text: a.text } : null,
      current: b ? { value: b.si, text: b.text } : null,
      relativeDifference: relativeDifference(a?.si, b?.si),
    });
  }
  return out;
}

function compareTables(approved: BlockResult, current: BlockResult, tolerance: DriftTolerance): { cells: FigureDrift[]; more: number } {
  const a = approved.table;
  const b = current.table;
  const cells: FigureDrift[] = [];
  let more = 0;
  if (!a && !b) return { cells, more };
  const columns = (b ?? a)!.columns;
  const rowCount = Math.max(a?.rows.length ?? 0, b?.rows.length ?? 0);
  const first = columns[0];
  for (let r = 0; r < rowCount; r++) {
    const rowA = a?.rows[r];
    const rowB = b?.rows[r];
    const key = (b && rowB ? b.text[r]?.[0] : a?.text[r]?.[0]) ?? '';
    const rowLabel = first ? `${first.symbol} = ${key}${first.unit ? ` ${first.unit}` : ''}` : `row ${r + 1}`;
    columns.forEach((column, c) => {
      const va = rowA ? (rowA[c] ?? null) : undefined;
      const vb = rowB ? (rowB[c] ?? null) : undefined;
      if (rowA && rowB && sameValue(va, vb, tolerance)) return;
      if (cells.length >= MAX_TABLE_CELLS_LISTED) {
        more++;
        return;
      }
      cells.push({
        name: column.name,
        label: column.label,
        symbol: column.symbol,
        unit: column.unit,
        approved: rowA ? { value: va ?? null, text: a!.text[r]?.[c] ?? '' } : null,
        current: rowB ? { value: vb ?? null, text: b!.text[r]?.[c] ?? '' } : null,
        relativeDifference: relativeDifference(va, vb),
        row: r,
        rowLabel,
      });
    });
  }
  return { cells, more };
}

function compareBlock(approved: BlockResult | undefined, current: BlockResult | undefined, tolerance: DriftTolerance): BlockDrift | null {
  const shown = (current ?? approved)!;
  const base = { index: shown.index, title: shown.title, name: shown.name, approvedStatus: approved?.status ?? null, currentStatus: current?.status ?? null };
  if (!approved) return { ...base, change: 'appeared', figures: [], moreTableCells: 0 };
  if (!current) return { ...base, change: 'disappeared', figures: [], moreTableCells: 0 };
  if (approved.status !== current.status) return { ...base, change: 'status', figures: [], moreTableCells: 0 };
  // Two blocks in error have no figures to compare; their messages are not results.
  if (current.status === 'error') return null;
  const figures = compareOutputs(approved.outputs, current.outputs, tolerance);
  const table = compareTables(approved, current, tolerance);
  if (figures.length === 0 && table.cells.length === 0) return null;
  return { ...base, change: 'figures', figures: [...figures, ...table.cells], moreTableCells: table.more };
}

/**
 * The blocks whose results differ between the approved snapshot and today's evaluation,
 * in block order; empty when nothing drifts.
 */
export function compareEvaluations(approved: CaseEvaluation, current: CaseEvaluation, tolerance: DriftTolerance = DRIFT_TOLERANCE): BlockDrift[] {
  const count = Math.max(approved.blocks.length, current.blocks.length);
  const out: BlockDrift[] = [];
  for (let i = 0; i < count; i++) {
    const found = compareBlock(approved.blocks[i], current.blocks[i], tolerance);
    if (found) out.push(found);
  }
  return out;
}
