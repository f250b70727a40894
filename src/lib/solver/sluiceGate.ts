/**
 * Free (unsubmerged) flow under a vertical sluice gate in a rectangular channel: the jet
 * contracts to y1 = Cc·a, and energy is conserved from upstream to the vena contracta,
 * y0 + q²/(2g·y0²) = y1 + q²/(2g·y1²), so q = y0·y1·√(2g/(y0 + y1)).
 * Sources: Henderson, F. M., 1966, Open Channel Flow, ch. 6 (sluice gates; from memory);
 * Chow, V. T., 1959, Open-Channel Hydraulics, §17 (from memory). Cc ≈ 0.61: common practice.
 */
import { sayIn } from './say';
import type { UnitSystem } from './units';
import { STANDARD_GRAVITY } from './constants';
import { fail, type SolverResult, type Warning } from './result';
import { checkPhysics, checkPositive } from './validate';

/** Default contraction coefficient of a sharp-edged vertical gate (common practice). */
export const DEFAULT_CONTRACTION_COEFFICIENT = 0.61;

/** Range of Cc outside which a warning is given (common practice). */
export const CONTRACTION_COEFFICIENT_RANGE = { min: 0.5, max: 0.7 } as const;

/** Ratio a/y0 above which the free-flow gate relation is flagged (common practice). */
export const LARGE_OPENING_RATIO = 0.5;

/** Input of {@link solveSluiceGate}; SI units. Give exactly one of `upstreamDepth` and `discharge`. */
export interface SluiceGateInput {
  /** Channel (and gate) width b, m. */
  readonly width: number;
  /** Gate opening a, m. */
  readonly opening: number;
  /** Contraction coefficient Cc; default 0.61. */
  readonly contractionCoefficient?: number;
  /** Upstream depth y0, m. */
  readonly upstreamDepth?: number;
  /** Discharge Q, m³/s. */
  readonly discharge?: number;
  /** Gravity, m/s². */
  readonly g?: number;
  /** Units of the figures quoted in messages (default SI). */
  readonly unitSystem?: UnitSystem;
}

/** Result of {@link solveSluiceGate}. */
export interface SluiceGateResult {
  /** Depth at the vena contracta y1 = Cc·a, m: the toe depth of a jump below the gate. */
  readonly y1: number;
  /** Upstream depth y0, m. */
  readonly upstreamDepth: number;
  /** Discharge Q, m³/s. */
  readonly discharge: number;
  /** Discharge per unit width q, m²/s. */
  readonly unitDischarge: number;
  /** Velocity at the vena contracta, m/s. */
  readonly v1: number;
  /** Froude number at the vena contracta. */
  readonly fr1: number;
  /** Upstream velocity, m/s. */
  readonly v0: number;
  /** Upstream specific energy y0 + V0²/2g, m. */
  readonly e0: number;
  /** Discharge coefficient Cd in q = Cd·a·√(2g·y0). */
  readonly dischargeCoefficient: number;
}

/** Solves a free-flowing sluice gate for the discharge (from y0) or the upstream depth (from Q). */
export function solveSluiceGate(input: SluiceGateInput): SolverResult<SluiceGateResult> {
  const { width: b, opening: a } = input;
  const cc = input.contractionCoefficient ?? DEFAULT_CONTRACTION_COEFFICIENT;
  const g = input.g ?? STANDARD_GRAVITY;
  const bad =
    checkPositive(b, 'width', 'Width b') ??
    checkPositive(a, 'opening', 'Gate opening a') ??
    checkPositive(cc, 'contractionCoefficient', 'Contraction coefficient Cc') ??
    checkPhysics(g, undefined);
  if (bad) return bad;
  if (cc > 1) return fail('invalid-input', `Contraction coefficient Cc = ${cc} must not exceed 1.`, 'contractionCoefficient');
  const hasY0 = input.upstreamDepth !== undefined;
  if (hasY0 === (input.discharge !== undefined)) {
    return fail('conflicting-input', 'Give exactly one of the upstream depth y0 and the discharge Q.', hasY0 ? 'discharge' : 'upstreamDepth');
  }
  const y1 = cc * a;
  let y0: number;
  let q: number;
  if (hasY0) {
    const badY0 = checkPositive(input.upstreamDepth, 'upstreamDepth', 'Upstream depth y0');
    if (badY0) return badY0;
    y0 = input.upstreamDepth as number;
    q = y0 * y1 * Math.sqrt((2 * g) / (y0 + y1));
  } else {
    const badQ = checkPositive(input.discharge, 'discharge', 'Discharge Q');
    if (badQ) return badQ;
    q = (input.discharge as number) / b;
    // 2g·y1²·y0² − q²·y0 − q²·y1 = 0, positive root.
    y0 = (q * q + Math.sqrt(q ** 4 + 8 * g * y1 ** 3 * q * q)) / (4 * g * y1 * y1);
  }
  if (!(y0 > a)) {
    const say = sayIn(input.unitSystem ?? 'SI');
    return fail('gate-not-submerged', `The upstream depth y0 = ${say(y0, 'length', 4)} is not above the gate lip (a = ${say(a, 'length', 4)}): the water does not touch the gate, so the flow is weir or open-channel flow and the sluice-gate relation does not apply.`, hasY0 ? 'upstreamDepth' : 'discharge');
  }
  if (!Number.isFinite(q * q * y0)) return fail('out-of-range', 'The gate discharge is not a finite number; the inputs are out of range.');
  const v1 = q / y1;
  const v0 = q / y0;
  const warnings: Warning[] = [];
  if (cc < CONTRACTION_COEFFICIENT_RANGE.min || cc > CONTRACTION_COEFFICIENT_RANGE.max) {
    warnings.push({ code: 'contraction-coefficient-range', message: `Cc = ${cc} is outside the usual ${CONTRACTION_COEFFICIENT_RANGE.min}–${CONTRACTION_COEFFICIENT_RANGE.max} for vertical sluice gates (common practice, 0.61 for a sharp-edged gate); check the value for this gate shape.`, field: 'contractionCoefficient' });
  }
  if (a / y0 > LARGE_OPENING_RATIO) {
    warnings.push({ code: 'large-gate-opening', message: `a/y0 = ${(a / y0).toFixed(2)} is large: Cc varies with the opening ratio and the jet approaches weir flow, so treat the result as approximate (common practice: a/y0 below about ${LARGE_OPENING_RATIO}).`, field: 'opening' });
  }
  return {
    ok: true,
    value: {
      y1,
      upstreamDepth: y0,
      discharge: q * b,
      unitDischarge: q,
      v1,
      fr1: v1 / Math.sqrt(g * y1),
      v0,
      e0: y0 + (v0 * v0) / (2 * g),
      dischargeCoefficient: q / (a * Math.sqrt(2 * g * y0)),
    },
    warnings,
  };
}
