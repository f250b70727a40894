/**
 * The curves of the momentum chart: momentum function M(y) and specific energy E(y) of a
 * block's section and discharge, recomputed with the solver's own functions, and the
 * marked depths (y1, y2, yc). Pure; SI units.
 * Source: Chow, V. T., 1959, Open-Channel Hydraulics, §3-1 and §3-6 (E–y and M–y diagrams).
 */
import type { BlockResult } from '../../lib/calc';
import { criticalDepth, momentumFunction, specificEnergy, STANDARD_GRAVITY, type Section } from '../../lib/solver';
import { blockNumber, blockText } from './chartMath';

/** One sampled depth of the curves. */
export interface CurvePoint {
  readonly y: number;
  readonly value: number;
}

/** Everything the momentum chart draws, SI. */
export interface JumpCurves {
  readonly section: Section;
  readonly discharge: number;
  readonly g: number;
  readonly y1: number;
  readonly y2: number;
  readonly yc: number;
  /** M at y1 (= M at y2). */
  readonly m1: number;
  readonly e1: number;
  readonly e2: number;
  /** Top of the depth axis. */
  readonly yTop: number;
  /** Right end of the M and E axes: the curves stop where they leave the chart. */
  readonly mMax: number;
  readonly eMax: number;
  readonly momentum: readonly CurvePoint[];
  readonly energy: readonly CurvePoint[];
}

/** The section of a block's inputs (`shape`, `width`, `sideSlope`, `diameter`), or null. */
export function sectionOfBlock(block: BlockResult): Section | null {
  const shape = blockText(block, 'shape') ?? 'rectangular';
  const width = blockNumber(block, 'width');
  const z = blockNumber(block, 'sideSlope');
  const d = blockNumber(block, 'diameter');
  if (shape === 'rectangular') return width !== undefined && width > 0 ? { shape, width } : null;
  if (shape === 'trapezoidal') return width !== undefined && z !== undefined && width + z > 0 ? { shape, width, sideSlope: z } : null;
  if (shape === 'triangular') return z !== undefined && z > 0 ? { shape, sideSlope: z } : null;
  if (shape === 'circular') return d !== undefined && d > 0 ? { shape, diameter: d } : null;
  return null;
}

/** Depth in (lo, hi) where a function falling with depth crosses `target` (bisection). */
function depthWhere(f: (y: number) => number, target: number, lo: number, hi: number): number {
  let a = lo;
  let b = hi;
  for (let i = 0; i < 60; i += 1) {
    const mid = 0.5 * (a + b);
    if (f(mid) > target) a = mid;
    else b = mid;
  }
  return 0.5 * (a + b);
}

/** `n` depths from `lo` to `hi`, closer together at shallow depths where the curves bend. */
export function sampleDepths(lo: number, hi: number, n: number): number[] {
  if (!(lo > 0 && hi > lo && n >= 2)) return [];
  const ratio = hi / lo;
  return Array.from({ length: n }, (_, i) => lo * ratio ** (i / (n - 1)));
}

/**
 * The curves of a solved `jump` block, or null when the block has no drawable jump (errors,
 * a missing value, a conduit running full).
 */
export function jumpCurves(block: BlockResult, samples = 120): JumpCurves | null {
  if (block.status !== 'ok') return null;
  const section = sectionOfBlock(block);
  const discharge = blockNumber(block, 'discharge');
  const y1 = blockNumber(block, 'y1');
  const y2 = blockNumber(block, 'y2');
  if (!section || discharge === undefined || y1 === undefined || y2 === undefined || !(discharge > 0 && y2 > y1 && y1 > 0)) return null;
  const g = blockNumber(block, 'g') ?? STANDARD_GRAVITY;
  const yc = blockNumber(block, 'yc') ?? criticalDepth(section, discharge, g);
  if (!(yc > y1 && yc < y2)) return null;
  const full = section.shape === 'circular' ? section.diameter * 0.995 : Infinity;
  if (!(y2 < full)) return null;
  const yTop = Math.min(y2 * 1.3, full);
  const M = (y: number) => momentumFunction(section, discharge, y, g);
  const E = (y: number) => specificEnergy(section, discharge, y, g);
  const m1 = M(y1);
  const e1 = E(y1);
  const e2 = E(y2);
  const mMax = Math.max(m1, M(yTop)) * 1.2;
  const eMax = Math.max(e1, E(yTop)) * 1.15;
  const curve = (f: (y: number) => number, max: number): CurvePoint[] => {
    const lo = depthWhere(f, max, yc * 1e-6, yc);
    return sampleDepths(lo, yTop, samples).map((y) => ({ y, value: f(y) }));
  };
  return { section, discharge, g, y1, y2, yc, m1, e1, e2, yTop, mMax, eMax, momentum: curve(M, mMax), energy: curve(E, eMax) };
}
