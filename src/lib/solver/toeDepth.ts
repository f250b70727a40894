/**
 * Inflow (toe) depth at the foot of a spillway or chute from the energy equation
 * H = y1 + (1 + k)·Q²/(2g·A1²), taking the supercritical root.
 * Sources: energy equation with a loss h_L = k·V1²/2g, Chow, V. T., 1959, Open-Channel
 * Hydraulics, §3-1 and §14 (spillway toe); maximum discharge for a given head at
 * H − y = A/(2T) (critical flow), Chow §4-2 and Henderson, F. M., 1966, Open Channel Flow, §2.4.
 */
import { sayIn } from './say';
import type { UnitSystem } from './units';
import { brent } from './brent';
import { STANDARD_GRAVITY } from './constants';
import { criticalDepth, DEPTH_TOLERANCE, rootBelow } from './criticalDepth';
import { froudeNumber } from './froudeNumber';
import { fail, type SolverResult, type Warning } from './result';
import { type Section, validateSection } from './section';
import { area, topWidth } from './sectionGeometry';
import { checkNonNegative, checkPhysics, checkPositive, noConvergence, overflowFailure } from './validate';

/** Input of {@link solveToeDepth}; SI units. */
export interface ToeDepthInput {
  /** Section at the toe. */
  readonly section: Section;
  /** Discharge Q, m³/s. */
  readonly discharge: number;
  /** Total head H above the apron at the toe (upstream energy level − apron level), m. */
  readonly head: number;
  /** Loss coefficient k ≥ 0 of h_L = k·V1²/2g between reservoir and toe; default 0. */
  readonly lossCoefficient?: number;
  /** Gravity, m/s². */
  readonly g?: number;
  /** Units of the figures quoted in messages (default SI). */
  readonly unitSystem?: UnitSystem;
}

/** Result of {@link solveToeDepth}. */
export interface ToeDepthResult {
  /** Toe depth y1, m (supercritical). */
  readonly y1: number;
  /** Velocity at the toe, m/s. */
  readonly v1: number;
  /** Froude number at the toe. */
  readonly fr1: number;
  /** Specific energy at the toe y1 + V1²/2g, m. */
  readonly e1: number;
  /** Head lost upstream of the toe k·V1²/2g, m. */
  readonly headLoss: number;
  /** Critical depth for Q, m. */
  readonly yc: number;
  /** Largest discharge the head H can deliver (critical flow at the toe), m³/s. */
  readonly maxDischarge: number;
}

/** Largest Q with H = y + (1 + k)Q²/(2gA²): at H − y = A/(2T), Q = A·√(2g(H − y)/(1 + k)). `NaN` on failure. */
export function maxDischargeForHead(section: Section, head: number, k: number, g: number): number {
  const f = (y: number): number => {
    const t = topWidth(section, y);
    return t > 0 ? head - y - area(section, y) / (2 * t) : -Infinity;
  };
  const hi = section.shape === 'circular' ? Math.min(head, section.diameter) : head;
  const y = section.shape === 'rectangular' ? (2 * head) / 3 : rootBelow((x) => (x >= hi ? -1 : f(x)), hi);
  return area(section, y) * Math.sqrt((2 * g * (head - y)) / (1 + k));
}

/**
 * Supercritical depth at the toe for discharge Q under total head H.
 * Fails with `discharge-exceeds-maximum` when H is less than the minimum specific energy
 * needed to pass Q (the flow would be critical, and no supercritical root exists).
 */
export function solveToeDepth(input: ToeDepthInput): SolverResult<ToeDepthResult> {
  const { section, discharge, head } = input;
  const k = input.lossCoefficient ?? 0;
  const g = input.g ?? STANDARD_GRAVITY;
  const bad =
    validateSection(section) ??
    checkPositive(discharge, 'discharge', 'Discharge Q') ??
    checkPositive(head, 'head', 'Total head H above the apron') ??
    checkNonNegative(k, 'lossCoefficient', 'Loss coefficient k') ??
    checkPhysics(g, undefined);
  if (bad) return bad;
  if (!Number.isFinite(discharge * discharge * (1 + k))) return overflowFailure('toe depth');
  const r = toeDepthCore(section, discharge, head, k, g, criticalDepth(section, discharge * Math.sqrt(1 + k), g));
  if (r === TOE_TOO_LITTLE_HEAD) {
    const qMax = maxDischargeForHead(section, head, k, g);
    const say = sayIn(input.unitSystem ?? 'SI');
    return fail('discharge-exceeds-maximum', `Q = ${say(discharge, 'discharge', 4)} exceeds the largest discharge the head H = ${say(head, 'length', 4)} can deliver (Q_max = ${say(qMax, 'discharge', 4)}${k > 0 ? `, with k = ${k}` : ''}). At Q_max the flow at the toe is critical; a larger discharge needs more head, so there is no supercritical toe depth.`, 'discharge');
  }
  if (Number.isNaN(r)) return noConvergence('the toe depth');
  const a = area(section, r);
  const v1 = discharge / a;
  const vh = (v1 * v1) / (2 * g);
  const fr1 = froudeNumber(section, discharge, r, g);
  const warnings: Warning[] = [];
  if (!(fr1 > 1)) {
    warnings.push({ code: 'toe-not-supercritical', message: `With the loss coefficient k = ${k}, the shallow root of the energy equation has Fr1 = ${fr1.toPrecision(3)} ≤ 1: the flow at the toe is not supercritical, so no hydraulic jump forms there. Check k and the head.`, field: 'lossCoefficient' });
  }
  return {
    ok: true,
    value: {
      y1: r,
      v1,
      fr1,
      e1: r + vh,
      headLoss: k * vh,
      yc: criticalDepth(section, discharge, g),
      maxDischarge: maxDischargeForHead(section, head, k, g),
    },
    warnings,
  };
}

/** Sentinel of {@link toeDepthCore}: the head cannot pass the discharge. */
export const TOE_TOO_LITTLE_HEAD = -1;

/**
 * Allocation-light core: supercritical root of y + (1 + k)Q²/(2gA²) = H given the
 * minimum-energy depth `yMin` (critical depth of Q·√(1 + k)). Returns
 * {@link TOE_TOO_LITTLE_HEAD} when H is below the minimum energy, `NaN` on failure.
 */
export function toeDepthCore(section: Section, discharge: number, head: number, k: number, g: number, yMin: number): number {
  if (!Number.isFinite(yMin)) return Number.NaN;
  const c = ((1 + k) * discharge * discharge) / (2 * g);
  const f = (y: number): number => {
    const a = area(section, y);
    return y + c / (a * a) - head;
  };
  const fMin = f(yMin);
  if (fMin > 0) return TOE_TOO_LITTLE_HEAD;
  if (fMin === 0) return yMin;
  // Fixed-point brackets from V1² = 2g(H − y1)/(1 + k): y ↦ depth of area √(c/(H − y)) is
  // increasing with fixed point y1, so iterates from 0 stay below y1 and from yMin above it.
  let lo = Number.NaN;
  let hi = yMin;
  if (section.shape !== 'circular') {
    lo = 0;
    for (let i = 0; i < 3; i++) {
      lo = depthForArea(section, Math.sqrt(c / (head - lo)));
      const next = depthForArea(section, Math.sqrt(c / (head - hi)));
      if (next < hi) hi = next;
    }
  }
  if (!(lo > 0 && lo < hi && f(lo) > 0 && f(hi) <= 0)) {
    hi = yMin;
    lo = 0.5 * yMin;
    for (let i = 0; i < 1100 && f(lo) <= 0; i++) {
      hi = lo;
      lo *= 0.5;
    }
  }
  return brent(f, lo, hi, DEPTH_TOLERANCE * hi);
}

/** Depth with flow area `a` for open shapes (closed forms); `NaN` for circles. */
function depthForArea(section: Section, a: number): number {
  switch (section.shape) {
    case 'rectangular':
      return a / section.width;
    case 'triangular':
      return Math.sqrt(a / section.sideSlope);
    case 'trapezoidal':
      // Root of z·y² + b·y − A = 0 in the cancellation-free form 2A/(b + √(b² + 4zA)).
      return (2 * a) / (section.width + Math.sqrt(section.width * section.width + 4 * section.sideSlope * a));
    case 'circular':
      return Number.NaN;
  }
}
