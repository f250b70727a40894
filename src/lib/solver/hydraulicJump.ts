/**
 * Stationary hydraulic jump on a horizontal, frictionless bed in any supported section.
 * Sources: momentum balance M(y1) = M(y2), Chow, V. T., 1959, Open-Channel Hydraulics, §15-2;
 * Bélanger closed form for rectangles (Chow eq. 15-3); head loss ΔE = E1 − E2 (Chow §15-4).
 */
import { sayIn } from './say';
import type { UnitSystem } from './units';
import { STANDARD_GRAVITY, WATER_DENSITY } from './constants';
import { criticalDepth } from './criticalDepth';
import { froudeNumber } from './froudeNumber';
import { jumpLengthUsbr, jumpLengthWarnings, rollerLengthHager } from './jumpLength';
import { jumpType, type JumpType } from './jumpType';
import { momentumFunction } from './momentumFunction';
import { fail, type SolverResult, type Warning } from './result';
import { type Section, validateSection } from './section';
import { area } from './sectionGeometry';
import { sequentOfSubcritical, sequentOfSupercritical } from './sequentDepth';
import { checkPhysics, checkPositive, noConvergence, overflowFailure } from './validate';

/** Fraction of the diameter above which a sequent depth in a pipe gets a near-crown warning (common practice). */
export const PIPE_NEAR_CROWN_RATIO = 0.9;

/** Input of {@link solveHydraulicJump}. Give exactly one of `y1` and `y2`. SI units. */
export interface HydraulicJumpInput {
  /** Channel section, the same on both sides of the jump. */
  readonly section: Section;
  /** Discharge Q, m³/s. */
  readonly discharge: number;
  /** Upstream (supercritical) depth, m. */
  readonly y1?: number;
  /** Downstream (subcritical) depth, m. */
  readonly y2?: number;
  /** Gravity, m/s²; default {@link STANDARD_GRAVITY}. */
  readonly g?: number;
  /** Water density, kg/m³; default {@link WATER_DENSITY}. */
  readonly density?: number;
  /** Units of the figures quoted in messages (default SI). */
  readonly unitSystem?: UnitSystem;
}

/** Result of {@link solveHydraulicJump}; lengths m, velocities m/s, power W. */
export interface HydraulicJumpResult {
  /** Upstream (supercritical) depth. */
  readonly y1: number;
  /** Downstream (subcritical) sequent depth. */
  readonly y2: number;
  /** Critical depth. */
  readonly yc: number;
  /** Upstream Froude number V1/√(g·A1/T1). */
  readonly fr1: number;
  /** Downstream Froude number. */
  readonly fr2: number;
  /** Mean velocity upstream. */
  readonly v1: number;
  /** Mean velocity downstream. */
  readonly v2: number;
  /** Specific energy upstream y1 + V1²/2g. */
  readonly e1: number;
  /** Specific energy downstream. */
  readonly e2: number;
  /** Head loss ΔE = E1 − E2. */
  readonly headLoss: number;
  /** Relative loss ΔE/E1. */
  readonly relativeLoss: number;
  /** Dissipated power ρ·g·Q·ΔE, W. */
  readonly power: number;
  /** Jump height y2 − y1. */
  readonly jumpHeight: number;
  /** Sequent depth ratio y2/y1. */
  readonly sequentRatio: number;
  /** Momentum function M on either side, m³. */
  readonly momentum: number;
  /** Jump type by Fr1. */
  readonly jumpType: JumpType;
  /** Jump length L_j ≈ 6.1·y2 (USBR EM 25). */
  readonly jumpLength: number;
  /** Roller length L_r = 8·y1·(Fr1 − 1.5) (Hager et al. 1990); 0 below Fr1 = 1.5. */
  readonly rollerLength: number;
}

/**
 * Solves a stationary hydraulic jump given the discharge and either depth.
 *
 * Fails with `no-jump` when the given upstream flow is not supercritical, `not-subcritical`
 * when the given downstream depth is below critical, and `section-surcharged` when a circular
 * conduit would have to flow full downstream.
 *
 * @example solveHydraulicJump({ section: { shape: 'rectangular', width: 1 }, discharge: 5, y1: 0.5 })
 */
export function solveHydraulicJump(input: HydraulicJumpInput): SolverResult<HydraulicJumpResult> {
  const { section, discharge } = input;
  const g = input.g ?? STANDARD_GRAVITY;
  const rho = input.density ?? WATER_DENSITY;
  const bad =
    validateSection(section) ??
    checkPositive(discharge, 'discharge', 'Discharge Q') ??
    checkPhysics(g, rho);
  if (bad) return bad;
  const hasY1 = input.y1 !== undefined;
  if (hasY1 === (input.y2 !== undefined)) {
    return fail('conflicting-input', 'Give exactly one of the upstream depth y1 and the downstream depth y2.', hasY1 ? 'y2' : 'y1');
  }
  const field = hasY1 ? 'y1' : 'y2';
  const given = (hasY1 ? input.y1 : input.y2) as number;
  const badDepth = checkPositive(given, field, hasY1 ? 'Upstream depth y1' : 'Downstream depth y2');
  if (badDepth) return badDepth;
  if (section.shape === 'circular' && given >= section.diameter) {
    return fail('invalid-input', `The depth ${field} = ${given} m is at or above the crown (D = ${section.diameter} m): the conduit is not flowing partly full.`, field);
  }

  const yc = criticalDepth(section, discharge, g);
  if (!Number.isFinite(yc)) {
    return Number.isFinite(discharge * discharge) ? noConvergence('the critical depth') : overflowFailure('critical depth');
  }
  const frGiven = froudeNumber(section, discharge, given, g);
  const say = sayIn(input.unitSystem ?? 'SI');
  let y1: number;
  let y2: number;
  if (hasY1) {
    if (!(frGiven > 1)) {
      return fail('no-jump', `Fr1 = ${frGiven.toPrecision(3)} ≤ 1: the upstream flow (y1 = ${say(given, 'length', 4)}, critical depth ${say(yc, 'length', 4)}) is already subcritical, so no hydraulic jump can form. A jump needs supercritical inflow; check y1 and Q, or give the downstream depth y2 instead.`, 'y1');
    }
    y1 = given;
    y2 = sequentOfSupercritical(section, discharge, y1, yc, g);
    if (y2 === Number.POSITIVE_INFINITY && section.shape === 'circular') {
      const mCrown = momentumFunction(section, discharge, section.diameter, g);
      const m1 = momentumFunction(section, discharge, y1, g);
      return fail('section-surcharged', `The sequent depth would be above the crown of the D = ${say(section.diameter, 'length', 4)} conduit: the momentum of the inflow (M1 = ${say(m1, 'volume', 4)}) exceeds the largest open-channel momentum the pipe can carry (M at the crown = ${say(mCrown, 'volume', 4)}). The jump would fill the pipe and pressurise the flow downstream, where the open-channel momentum balance no longer holds. Use a larger conduit or a pressurised-flow analysis.`, 'y1');
    }
  } else {
    if (!(frGiven < 1)) {
      return fail('not-subcritical', `Fr2 = ${frGiven.toPrecision(3)} ≥ 1: the downstream depth y2 = ${say(given, 'length', 4)} is not above critical depth (${say(yc, 'length', 4)}). The flow after a jump must be subcritical; check y2 and Q, or give the upstream depth y1 instead.`, 'y2');
    }
    y2 = given;
    y1 = sequentOfSubcritical(section, discharge, y2, yc, g);
  }
  if (Number.isNaN(y1) || Number.isNaN(y2)) return noConvergence('the sequent depth');

  const a1 = area(section, y1);
  const a2 = area(section, y2);
  const v1 = discharge / a1;
  const v2 = discharge / a2;
  const e1 = y1 + (v1 * v1) / (2 * g);
  const e2 = y2 + (v2 * v2) / (2 * g);
  const fr1 = hasY1 ? frGiven : froudeNumber(section, discharge, y1, g);
  const fr2 = hasY1 ? froudeNumber(section, discharge, y2, g) : frGiven;
  // ΔE from the rectangle's exact form avoids cancellation for weak jumps: (y2 − y1)³/(4 y1 y2).
  const headLoss =
    section.shape === 'rectangular' ? ((y2 - y1) * (y2 - y1) * (y2 - y1)) / (4 * y1 * y2) : Math.max(0, e1 - e2);
  const result: HydraulicJumpResult = {
    y1,
    y2,
    yc,
    fr1,
    fr2,
    v1,
    v2,
    e1,
    e2,
    headLoss,
    relativeLoss: headLoss / e1,
    power: rho * g * discharge * headLoss,
    jumpHeight: y2 - y1,
    sequentRatio: y2 / y1,
    momentum: momentumFunction(section, discharge, y1, g),
    // A y2 barely above yc can give Fr1 = 1 − ε by rounding: that is the undular limit.
    jumpType: fr1 > 1 ? jumpType(fr1) : 'undular',
    jumpLength: jumpLengthUsbr(y2),
    rollerLength: Math.max(0, rollerLengthHager(y1, fr1)),
  };
  if (!allFinite(result)) return overflowFailure('jump');
  return { ok: true, value: result, warnings: jumpWarnings(result, section) };
}

function allFinite(r: HydraulicJumpResult): boolean {
  return (
    Number.isFinite(r.y2 + r.y1 + r.fr1 + r.fr2 + r.e1 + r.e2 + r.power + r.momentum) &&
    r.y1 > 0 &&
    r.e1 > 0
  );
}

function jumpWarnings(r: HydraulicJumpResult, section: Section): Warning[] {
  const warnings: Warning[] = [];
  if (r.jumpType === 'undular') {
    warnings.push({ code: 'undular-jump', message: `Undular jump (Fr1 = ${r.fr1.toPrecision(3)} < 1.7): a train of standing waves with little energy loss instead of a roller; the first crest can rise above the sequent depth, and the momentum balance gives the mean depth only.` });
  } else if (r.jumpType === 'oscillating') {
    warnings.push({ code: 'oscillating-jump', message: `Oscillating jump (2.5 ≤ Fr1 = ${r.fr1.toPrecision(3)} < 4.5): an unsteady jet produces irregular waves that travel far downstream and can erode banks; stilling basins avoid this range where possible (USBR EM 25, Basin IV or wave suppressors).` });
  }
  if (section.shape === 'circular' && r.y2 > PIPE_NEAR_CROWN_RATIO * section.diameter) {
    warnings.push({ code: 'near-crown', message: `The sequent depth is ${(100 * r.y2 / section.diameter).toFixed(0)} % of the diameter: near the crown, air cannot vent freely and the conduit may choke or surcharge intermittently (common practice: keep y2 below about ${PIPE_NEAR_CROWN_RATIO * 100} % of D).` });
  }
  jumpLengthWarnings(r.fr1, section.shape === 'rectangular', warnings);
  return warnings;
}
