/**
 * The key figures of an evaluated case body: the numbers colleagues search and sort by
 * (Froude range, discharges, depths, losses) and the sections and calculations it uses.
 * Pure; the service stores them as columns of the revision.
 */
import type { BlockResult, CaseEvaluation } from '../calc';
import { formatNumber, KIND_SPECS, isSolverKind } from '../solver';

/** Key figures of one revision; null where no block gives the value. */
export interface KeyFigures {
  /** Smallest inflow Froude number Fr1 (block outputs and tailwater rows). */
  fr1Min: number | null;
  /** Largest inflow Froude number Fr1. */
  fr1Max: number | null;
  /** Smallest discharge, m³/s. */
  dischargeMin: number | null;
  /** Largest discharge, m³/s. */
  dischargeMax: number | null;
  /** Largest inflow velocity V1, m/s. */
  v1: number | null;
  /** Smallest inflow (toe) depth y1, m. */
  y1: number | null;
  /** Largest sequent depth y2, m. */
  y2: number | null;
  /** Largest relative head loss ΔE/E1. */
  relativeLoss: number | null;
  /** Section shapes of the blocks (`shape` input, or the kind's default), sorted. */
  sectionShapes: string[];
  /** Solver kinds of the blocks that solved, sorted. */
  calcKinds: string[];
}

/** Key figures of a body with no block that solved. */
export const NO_KEY_FIGURES: KeyFigures = Object.freeze({
  fr1Min: null,
  fr1Max: null,
  dischargeMin: null,
  dischargeMax: null,
  v1: null,
  y1: null,
  y2: null,
  relativeLoss: null,
  sectionShapes: [],
  calcKinds: [],
}) as KeyFigures;

/** Every finite SI number a block gives under `name`, from its outputs and its table column. */
function valuesOf(block: BlockResult, name: string): number[] {
  const found: number[] = [];
  const add = (value: unknown) => {
    if (typeof value === 'number' && Number.isFinite(value)) found.push(value);
  };
  for (const output of block.outputs) {
    if (output.name !== name) continue;
    if (Array.isArray(output.si)) output.si.forEach(add);
    else add(output.si);
  }
  const column = block.table?.columns.findIndex((c) => c.name === name) ?? -1;
  if (block.table && column >= 0) for (const row of block.table.rows) add(row[column]);
  return found;
}

function shapeOf(block: BlockResult): string | null {
  const input = block.inputs.find((i) => i.name === 'shape');
  if (typeof input?.si === 'string') return input.si;
  // A shape left out takes the kind's default (rectangular), which the inputs do not list.
  const field = isSolverKind(block.kind) ? KIND_SPECS[block.kind].inputs.find((f) => f.name === 'shape') : undefined;
  return typeof field?.default === 'string' ? field.default : null;
}

const least = (values: number[]) => (values.length ? Math.min(...values) : null);
const most = (values: number[]) => (values.length ? Math.max(...values) : null);

/** Collects the key figures over the blocks of `evaluation` that solved; see {@link KeyFigures}. */
export function keyFigures(evaluation: CaseEvaluation): KeyFigures {
  const blocks = (evaluation?.blocks ?? []).filter((b) => b.status === 'ok');
  const all = (name: string) => blocks.flatMap((b) => valuesOf(b, name));
  const fr1 = all('fr1');
  const discharge = all('discharge');
  const shapes = new Set(blocks.map(shapeOf).filter((s): s is string => s !== null));
  return {
    fr1Min: least(fr1),
    fr1Max: most(fr1),
    dischargeMin: least(discharge),
    dischargeMax: most(discharge),
    v1: most(all('v1')),
    y1: least(all('y1')),
    y2: most(all('y2')),
    relativeLoss: most(all('relativeLoss')),
    sectionShapes: [...shapes].sort(),
    calcKinds: [...new Set(blocks.map((b) => b.kind))].sort(),
  };
}

/**
 * A key-figure range for tables and summaries, to 3 significant figures: `5.26–15.4`,
 * one value when both ends read the same, `—` when the case has no such figure.
 */
export function formatRange(min: number | null, max: number | null, unit = ''): string {
  if (min === null || max === null) return '—';
  const a = formatNumber(min, 3);
  const b = formatNumber(max, 3);
  return `${a === b ? a : `${a}–${b}`}${unit ? ` ${unit}` : ''}`;
}
