/**
 * The series of the tailwater chart, read from a `tailwater` block's rows: sequent depth y2
 * and tailwater TW against discharge Q, and each flow's jump position. Pure; SI units.
 */
import type { BlockResult } from '../../lib/calc';

/** One flow of a tailwater check. */
export interface TailwaterPoint {
  readonly q: number;
  readonly y2: number | null;
  readonly tw: number | null;
  /** Jump position: `swept-out`, `at-toe`, `submerged`, `no-jump`, `no-tailwater`, `surcharged`. */
  readonly state: string;
}

/** The points of a tailwater block, in discharge order, and the extent of the values. */
export interface TailwaterSeries {
  readonly points: readonly TailwaterPoint[];
  readonly qMin: number;
  readonly qMax: number;
  readonly depthMin: number;
  readonly depthMax: number;
  readonly sweptOut: number;
}

const finite = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);

/** The series of a solved tailwater block; null without rows or a discharge column. */
export function tailwaterSeries(block: BlockResult): TailwaterSeries | null {
  const table = block.table;
  if (block.status !== 'ok' || !table || table.rows.length === 0) return null;
  const col = (name: string) => table.columns.findIndex((c) => c.name === name);
  const [iq, iy2, itw, istate] = [col('discharge'), col('y2'), col('tailwater'), col('state')];
  if (iq < 0) return null;
  const points: TailwaterPoint[] = [];
  for (const row of table.rows) {
    const q = finite(row[iq]);
    if (q === null) continue;
    const state = istate >= 0 ? row[istate] : null;
    points.push({ q, y2: iy2 >= 0 ? finite(row[iy2]) : null, tw: itw >= 0 ? finite(row[itw]) : null, state: typeof state === 'string' ? state : '' });
  }
  if (points.length === 0) return null;
  points.sort((a, b) => a.q - b.q);
  const depths = points.flatMap((p) => [p.y2, p.tw]).filter((d): d is number => d !== null);
  return {
    points,
    qMin: points[0]!.q,
    qMax: points[points.length - 1]!.q,
    depthMin: depths.length ? depths.reduce((a, b) => Math.min(a, b)) : 0,
    depthMax: depths.length ? depths.reduce((a, b) => Math.max(a, b)) : 0,
    sweptOut: points.filter((p) => p.state === 'swept-out').length,
  };
}
