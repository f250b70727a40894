/**
 * Moving hydraulic jump (positive surge, bore) in a rectangular channel, by the Galilean
 * transform of the stationary jump: in the frame of the front, mass and momentum give
 * c = √(g·h2·(h + h2)/(2h)) relative to the undisturbed water.
 * Sources: Henderson, F. M., 1966, Open Channel Flow, ch. 9 (surges, §9.4 from memory);
 * Chow, V. T., 1959, Open-Channel Hydraulics, §18-2 (surge equations).
 * Sign convention: x and velocities positive downstream.
 */
import { sayIn, type Say } from './say';
import type { UnitSystem } from './units';
import { brent } from './brent';
import { STANDARD_GRAVITY } from './constants';
import { fail, type SolverResult, type Warning } from './result';
import type { SectionShape } from './section';
import { checkFinite, checkPhysics, checkPositive, noConvergence, overflowFailure } from './validate';

/** Direction the front faces: the side of the undisturbed water it advances into, relative to the water. */
export type SurgeDirection = 'upstream' | 'downstream';

/** Classification of the front. */
export type BoreFront = 'undular' | 'transitional' | 'breaking';

/** Surge Froude number below which the front is undular (Favre 1935; Treske 1994; from memory). */
export const UNDULAR_BORE_LIMIT = 1.3;

/** Surge Froude number above which the front is a breaking roller (Chanson 2009 review; from memory). */
export const BREAKING_BORE_LIMIT = 1.5;

/** Input of {@link solveSurge}; SI units, velocities positive downstream. Give exactly one of the four unknowns. */
export interface SurgeInput {
  /** Section shape; only `rectangular` is supported for moving surges (default). */
  readonly shape?: SectionShape;
  /** Undisturbed depth h ahead of the front, m. */
  readonly depth: number;
  /** Undisturbed velocity u ahead of the front, m/s (positive downstream). Default 0. */
  readonly velocity?: number;
  /** `upstream`: front advances against the flow (e.g. after a downstream gate closes); `downstream`: with it. */
  readonly direction: SurgeDirection;
  /** Depth behind the front h2, m. */
  readonly depthBehind?: number;
  /** Velocity behind the front u2, m/s. */
  readonly velocityBehind?: number;
  /** Absolute front speed w, m/s (positive downstream). */
  readonly surgeSpeed?: number;
  /** Change of discharge per unit width Δq = q2 − q, m²/s (full closure: −u·h). */
  readonly dischargeChange?: number;
  /** Gravity, m/s². */
  readonly g?: number;
  /** Units of the figures quoted in messages (default SI). */
  readonly unitSystem?: UnitSystem;
}

/** Result of {@link solveSurge}. */
export interface SurgeResult {
  /** Absolute front speed w, m/s, positive downstream. */
  readonly surgeSpeed: number;
  /** Front speed relative to the undisturbed water c = |w − u|, m/s. */
  readonly relativeCelerity: number;
  /** Depth behind the front h2, m. */
  readonly depthBehind: number;
  /** Velocity behind the front u2, m/s. */
  readonly velocityBehind: number;
  /** Surge height h2 − h, m. */
  readonly surgeHeight: number;
  /** h2/h. */
  readonly depthRatio: number;
  /** Surge Froude number c/√(g·h). */
  readonly surgeFroude: number;
  /** Linear long-wave speed √(g·h) for comparison, m/s. */
  readonly linearWaveSpeed: number;
  /** Unit discharge ahead u·h, m²/s. */
  readonly unitDischargeAhead: number;
  /** Unit discharge behind u2·h2, m²/s. */
  readonly unitDischargeBehind: number;
  /** Δq = q2 − q, m²/s. */
  readonly dischargeChange: number;
  /** Front type by the surge Froude number. */
  readonly frontType: BoreFront;
}

const KNOWNS = ['depthBehind', 'velocityBehind', 'surgeSpeed', 'dischargeChange'] as const;

/**
 * Solves a positive surge (bore) from the undisturbed state and one property of the surge.
 * A data set that implies a depth decrease fails with `negative-surge`: that is a
 * rarefaction wave which spreads out, not a bore.
 */
export function solveSurge(input: SurgeInput): SolverResult<SurgeResult> {
  if ((input.shape ?? 'rectangular') !== 'rectangular') {
    return fail('unsupported-section', 'Only rectangular sections are supported for moving surges.', 'shape');
  }
  const g = input.g ?? STANDARD_GRAVITY;
  const say = sayIn(input.unitSystem ?? 'SI');
  const h = input.depth;
  const u = input.velocity ?? 0;
  const bad = checkPositive(h, 'depth', 'Undisturbed depth h') ?? checkFinite(u, 'velocity', 'Undisturbed velocity u') ?? checkPhysics(g, undefined);
  if (bad) return bad;
  if (input.direction !== 'upstream' && input.direction !== 'downstream') {
    return fail('invalid-input', 'Direction must be "upstream" or "downstream".', 'direction');
  }
  const given = KNOWNS.filter((k) => input[k] !== undefined);
  if (given.length !== 1) {
    return fail('conflicting-input', `Give exactly one of: ${KNOWNS.join(', ')} (got ${given.length === 0 ? 'none' : given.join(', ')}).`, given[1] ?? 'depthBehind');
  }
  const known = given[0] as (typeof KNOWNS)[number];
  const x = input[known] as number;
  const badKnown = checkFinite(x, known, known);
  if (badKnown) return badKnown;

  const s = input.direction === 'upstream' ? -1 : 1;
  const c0 = Math.sqrt(g * h);
  const celerity = (h2: number): number => Math.sqrt((g * h2 * (h + h2)) / (2 * h));
  let h2: number;
  switch (known) {
    case 'depthBehind':
      if (!(x > h)) return negativeSurge(known, `h2 = ${x} m is not above the undisturbed depth h = ${h} m`);
      h2 = x;
      break;
    case 'velocityBehind': {
      // Upstream front: u − u2 = c(1 − h/h2) > 0; downstream front: u2 − u = c(1 − h/h2) > 0.
      const du = s * (x - u);
      if (!(du > 0)) return negativeSurge(known, `the velocity behind (${x} m/s) implies the flow ${s < 0 ? 'accelerates' : 'decelerates'} across a front moving ${input.direction}`);
      h2 = rootAbove((y) => celerity(y) * (1 - h / y) - du, h);
      break;
    }
    case 'surgeSpeed': {
      const c = s * (x - u);
      if (!(c > c0)) {
        return negativeSurge(known, `a front moving ${input.direction} at w = ${say(x, 'velocity', 4)} travels at ${say(c, 'velocity', 4)} relative to the water, not faster than √(g·h) = ${say(c0, 'velocity', 4)} as every bore does`);
      }
      const fr = c / c0;
      h2 = 0.5 * h * (Math.sqrt(1 + 8 * fr * fr) - 1);
      break;
    }
    case 'dischargeChange': {
      // Δq = w·(h2 − h) with w = u ± c: monotone in h2 only while u ± c keeps the sign of ±.
      if (s * u <= -c0 || (s < 0 && u >= c0)) {
        return fail('unsupported-input', 'With supercritical undisturbed flow the surge from a discharge change is not unique; give the depth behind the front instead.', 'dischargeChange');
      }
      if (!(s * x > 0)) {
        return negativeSurge(known, `Δq = ${x} m²/s ${s < 0 ? 'increases' : 'decreases'} the flow behind a front moving ${input.direction} (a gate opening downstream or closing upstream)`);
      }
      h2 = rootAbove((y) => s * ((u + s * celerity(y)) * (y - h) - x), h);
      break;
    }
  }
  if (Number.isNaN(h2)) return noConvergence('the depth behind the surge');
  const c = celerity(h2);
  const w = u + s * c;
  const u2 = u + s * c * (1 - h / h2);
  const frS = c / c0;
  const result: SurgeResult = {
    surgeSpeed: w,
    relativeCelerity: c,
    depthBehind: h2,
    velocityBehind: u2,
    surgeHeight: h2 - h,
    depthRatio: h2 / h,
    surgeFroude: frS,
    linearWaveSpeed: c0,
    unitDischargeAhead: u * h,
    unitDischargeBehind: u2 * h2,
    dischargeChange: u2 * h2 - u * h,
    frontType: boreFront(frS),
  };
  if (!Number.isFinite(w + u2 + h2 + result.dischargeChange)) return overflowFailure('surge');
  return { ok: true, value: result, warnings: surgeWarnings(result, input.direction, say) };
}

/** Front type: undular below {@link UNDULAR_BORE_LIMIT}, breaking from {@link BREAKING_BORE_LIMIT}. */
export function boreFront(surgeFroude: number): BoreFront {
  if (surgeFroude < UNDULAR_BORE_LIMIT) return 'undular';
  return surgeFroude < BREAKING_BORE_LIMIT ? 'transitional' : 'breaking';
}

/** Appends the front-type warnings shared by surges and dam-break fronts. */
export function boreFrontWarnings(frS: number, into: Warning[]): void {
  const type = boreFront(frS);
  if (type === 'undular') {
    into.push({ code: 'undular-bore', message: `Undular front (surge Froude number ${frS.toPrecision(3)} < ${UNDULAR_BORE_LIMIT}): a train of waves (Favre 1935) whose first crest rises above the mean depth behind; the momentum relations give the mean level only.` });
  } else if (type === 'transitional') {
    into.push({ code: 'transitional-bore', message: `Surge Froude number ${frS.toPrecision(3)} is between ${UNDULAR_BORE_LIMIT} and ${BREAKING_BORE_LIMIT}: the front is undular with breaking crests (transition; Treske 1994, from memory).` });
  }
}

function surgeWarnings(r: SurgeResult, direction: SurgeDirection, say: Say): Warning[] {
  const warnings: Warning[] = [];
  boreFrontWarnings(r.surgeFroude, warnings);
  if (direction === 'upstream' && r.surgeSpeed >= 0) {
    warnings.push({ code: 'swept-downstream', message: `The undisturbed flow is faster than the front's relative celerity, so this upstream-facing front moves downstream (w = ${say(r.surgeSpeed, 'velocity', 4)}): a travelling hydraulic jump in supercritical flow.` });
  }
  return warnings;
}

function negativeSurge(field: string, why: string) {
  return fail('negative-surge', `These data imply a negative surge (depth decrease): ${why}. A negative surge is a rarefaction wave that spreads out as it travels, not a bore, and the bore relations do not apply.`, field);
}

/** Root of an increasing f with f(h) ≤ 0 on (h, ∞): doubles the bracket width above h. */
function rootAbove(f: (y: number) => number, h: number): number {
  let hi = 2 * h;
  for (let i = 0; i < 200 && f(hi) < 0; i++) hi = h + 2 * (hi - h);
  return brent(f, h, hi, 1e-13 * hi);
}
