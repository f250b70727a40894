/**
 * The series of the tailwater chart, read from a `tailwater` block's rows: sequent depth y2
 * and tailwater TW against discharge Q, and each flow's jump position. Pure; SI units.
 */
import type { BlockResult } from '../../lib/calc';
import { ratingDepths } from '../../lib/solver';

/** One flow of a tailwater check. */
export interface TailwaterPoint {
  readonly q: number;
  readonly y2: number | null;
  readonly tw: number | null;
  /** Jump position: `swept-out`, `at-toe`, `submerged`, `no-jump`, `no-tailwater`, `surcharged`. */
  readonly state: string;
}

/** A point of the tailwater rating the block was given (SI). */
export interface RatingPoint {
  readonly q: number;
  readonly depth: number;
}

/** The points of a tailwater block, in discharge order, and the extent of the values. */
export interface TailwaterSeries {
  readonly points: readonly TailwaterPoint[];
  /** The rating's own points (depth above the apron), when the block was given a table. */
  readonly rating: readonly RatingPoint[];
  /** The attached file the rating came from; null for rows written in the block. */
  readonly ratingSource: string | null;
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
  const { rating, source } = ratingOf(block);
  const depths = [...points.flatMap((p) => [p.y2, p.tw]), ...rating.map((r) => r.depth)].filter((d): d is number => d !== null);
  const qs = [...points.map((p) => p.q), ...rating.map((r) => r.q)];
  return {
    points,
    rating,
    ratingSource: source,
    qMin: qs.reduce((a, b) => Math.min(a, b)),
    qMax: qs.reduce((a, b) => Math.max(a, b)),
    depthMin: depths.length ? depths.reduce((a, b) => Math.min(a, b)) : 0,
    depthMax: depths.length ? depths.reduce((a, b) => Math.max(a, b)) : 0,
    sweptOut: points.filter((p) => p.state === 'swept-out').length,
  };
}

/**
 * The rating points of a block given a table: depth above the apron as the solver used it,
 * so a rating given as stage is shown less the apron level.
 */
function ratingOf(block: BlockResult): { rating: RatingPoint[]; source: string | null } {
  const table = block.tables?.find((t) => t.name === 'tailwaterRating');
  if (!table) return { rating: [], source: null };
  const { discharge = [], depth, stage } = table.columns;
  const apron = block.inputs.find((i) => i.name === 'apronLevel')?.si;
  // The solver's own rule turns stages into depths, so the points are those it used.
  const used = ratingDepths({ discharge, ...(depth ? { depth } : {}), ...(stage ? { stage } : {}) }, typeof apron === 'number' ? apron : undefined);
  if (!used.ok) return { rating: [], source: table.source };
  const rating: RatingPoint[] = [];
  used.value.discharge.forEach((x, i) => {
    const d = finite(used.value.depth[i]);
    if (finite(x) !== null && d !== null) rating.push({ q: x, depth: d });
  });
  return { rating, source: table.source };
}
