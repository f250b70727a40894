/**
 * Tailwater check over a range of discharges: the sequent depth needed for a jump at the toe
 * against the tailwater the channel provides, and the apron lowering that would hold the jump.
 * Sources: Peterka, A. J., 1958, USBR Engineering Monograph 25, Section 1 (tailwater and
 * sequent-depth curves, from memory); Chow, V. T., 1959, Open-Channel Hydraulics, §15-6
 * (jump position: repelled / at the toe / drowned).
 */
import { brent } from './brent';
import { STANDARD_GRAVITY } from './constants';
import { criticalDepth, DEPTH_TOLERANCE } from './criticalDepth';
import { froudeNumber } from './froudeNumber';
import { JUMP_TYPE_BOUNDS } from './jumpType';
import { normalDepth } from './normalDepth';
import { fail, type SolverResult, type Warning } from './result';
import { sayIn } from './say';
import { type Section, sectionFullDepth, validateSection } from './section';
import { momentumFunction } from './momentumFunction';
import { sequentOfSupercritical } from './sequentDepth';
import { DEFAULT_CONTRACTION_COEFFICIENT } from './sluiceGate';
import { interpolateRating, type RatingTable, validateRatingTable } from './tailwaterRating';
import type { UnitSystem } from './units';
import { area } from './sectionGeometry';
import { toeDepthCore } from './toeDepth';
import { checkNonNegative, checkPhysics, checkPositive, describeValue } from './validate';

/** Default relative tolerance |TW − y2|/y2 for "at the toe" (common practice). */
export const DEFAULT_TOE_TOLERANCE = 0.05;

/** Largest number of flows in one check. */
export const MAX_FLOWS = 10_000;

/** How the toe depth y1 is found for each flow. */
export type ToeMethod =
  | { readonly method: 'head'; readonly head: number; readonly lossCoefficient?: number }
  | { readonly method: 'depth'; readonly y1: number }
  | { readonly method: 'gate'; readonly opening: number; readonly contractionCoefficient?: number };

/** Where the tailwater depth comes from. */
export type TailwaterSource =
  | ({ readonly method: 'table' } & RatingTable)
  | { readonly method: 'manning'; readonly n: number; readonly slope: number; readonly section?: Section };

/** Input of {@link solveTailwaterCheck}; SI units. */
export interface TailwaterCheckInput {
  /** Section of the apron / basin where the jump forms. */
  readonly section: Section;
  /** Discharges to check, m³/s. */
  readonly discharges: readonly number[];
  /** Toe-depth method. */
  readonly toe: ToeMethod;
  /** Tailwater source. */
  readonly tailwater: TailwaterSource;
  /** Relative tolerance for "at the toe"; default 0.05. */
  readonly tolerance?: number;
  /** Gravity, m/s². */
  readonly g?: number;
  /** Units of the figures in messages (default SI). */
  readonly unitSystem?: UnitSystem;
}

/** Where the jump sits for one flow. */
export type JumpPosition = 'swept-out' | 'at-toe' | 'submerged' | 'no-tailwater' | 'no-jump' | 'surcharged';

/** One flow of the check; `null` where a value does not exist for that flow. */
export interface TailwaterRow {
  /** Discharge Q, m³/s. */
  readonly discharge: number;
  /** Toe depth y1, m. */
  readonly y1: number | null;
  /** Toe Froude number. */
  readonly fr1: number | null;
  /** Sequent depth y2, m. */
  readonly y2: number | null;
  /** Tailwater depth above the apron, m. */
  readonly tailwater: number | null;
  /** Margin TW − y2, m (negative: swept out). */
  readonly margin: number | null;
  /** Submergence (TW − y2)/y2 (negative: deficit). */
  readonly submergence: number | null;
  /** Apron lowering that puts the jump at the toe, m (negative: the apron could be raised). */
  readonly apronLowering: number | null;
  /** Jump position. */
  readonly state: JumpPosition;
}

/** Result of {@link solveTailwaterCheck}. */
export interface TailwaterCheckResult {
  /** One row per discharge, in input order. */
  readonly rows: readonly TailwaterRow[];
  /** Flows whose jump is swept out. */
  readonly sweptOutCount: number;
  /** Smallest margin TW − y2 over all flows, m (`null` if none computed). */
  readonly minMargin: number | null;
  /** Discharge with the smallest margin, m³/s. */
  readonly criticalDischarge: number | null;
  /** Largest apron lowering needed over all flows, m (≤ 0 means none). */
  readonly requiredApronLowering: number | null;
}

/** `steps` evenly spaced discharges from `min` to `max` inclusive (steps ≥ 2). Throws `RangeError` on bad arguments. */
export function dischargeRange(min: number, max: number, steps: number): number[] {
  if (!(min > 0 && max >= min && Number.isInteger(steps) && steps >= 2 && steps <= MAX_FLOWS)) {
    throw new RangeError('dischargeRange: need 0 < min ≤ max and an integer 2 ≤ steps ≤ 10000');
  }
  const out = new Array<number>(steps);
  for (let i = 0; i < steps; i++) out[i] = min + ((max - min) * i) / (steps - 1);
  return out;
}

/** Runs the tailwater check for every discharge. Per-flow problems become row states and warnings. */
export function solveTailwaterCheck(input: TailwaterCheckInput): SolverResult<TailwaterCheckResult> {
  const bad = validate(input);
  if (bad) return bad;
  const { section, discharges, toe, tailwater } = input;
  const g = input.g ?? STANDARD_GRAVITY;
  const tol = input.tolerance ?? DEFAULT_TOE_TOLERANCE;
  const k = toe.method === 'head' ? (toe.lossCoefficient ?? 0) : 0;
  const fixedY1 = toe.method === 'depth' ? toe.y1 : toe.method === 'gate' ? toe.opening * (toe.contractionCoefficient ?? DEFAULT_CONTRACTION_COEFFICIENT) : Number.NaN;
  const twSection = tailwater.method === 'manning' ? (tailwater.section ?? section) : section;

  const rows = new Array<TailwaterRow>(discharges.length);
  let sweptOut = 0;
  let noJump = 0;
  let noTailwater = 0;
  let surcharged = 0;
  let oscillating = 0;
  let noLowering = 0;
  let minMargin = Infinity;
  let criticalQ = Number.NaN;
  let maxLowering = -Infinity;
  for (let i = 0; i < discharges.length; i++) {
    const q = discharges[i] as number;
    const yc = criticalDepth(section, q, g);
    const yMin = toe.method === 'head' && k > 0 ? criticalDepth(section, q * Math.sqrt(1 + k), g) : yc;
    const y1 = toe.method === 'head' ? toeDepthCore(section, q, toe.head, k, g, yMin) : fixedY1;
    const fr1 = y1 > 0 ? froudeNumber(section, q, y1, g) : Number.NaN;
    if (!(fr1 > 1)) {
      noJump++;
      rows[i] = row(q, y1 > 0 ? y1 : null, fr1 > 0 ? fr1 : null, null, null, null, null, null, 'no-jump');
      continue;
    }
    if (fr1 >= JUMP_TYPE_BOUNDS.oscillating && fr1 < JUMP_TYPE_BOUNDS.steady) oscillating++;
    const y2 = sequentOfSupercritical(section, q, y1, yc, g);
    if (!Number.isFinite(y2)) {
      surcharged++;
      rows[i] = row(q, y1, fr1, null, null, null, null, null, 'surcharged');
      continue;
    }
    const tw = tailwater.method === 'table' ? interpolateRating(tailwater, q) : normalDepth(twSection, q, tailwater.n, tailwater.slope);
    if (!Number.isFinite(tw)) {
      noTailwater++;
      rows[i] = row(q, y1, fr1, y2, null, null, null, null, 'no-tailwater');
      continue;
    }
    const margin = tw - y2;
    const ratio = margin / y2;
    const state: JumpPosition = Math.abs(ratio) <= tol ? 'at-toe' : margin < 0 ? 'swept-out' : 'submerged';
    if (state === 'swept-out') sweptOut++;
    const lowering = toe.method === 'head' ? apronLoweringForHead(section, q, toe.head, k, g, y1, yMin, yc, tw, margin) : -margin;
    if (margin < minMargin) {
      minMargin = margin;
      criticalQ = q;
    }
    if (Number.isFinite(lowering) && lowering > maxLowering) maxLowering = lowering;
    if (state === 'swept-out' && !Number.isFinite(lowering)) noLowering++;
    rows[i] = row(q, y1, fr1, y2, tw, margin, ratio, Number.isFinite(lowering) ? lowering : null, state);
  }
  const warnings: Warning[] = [];
  const say = sayIn(input.unitSystem ?? 'SI');
  const n = discharges.length;
  if (sweptOut > 0) {
    const lowering = Number.isFinite(maxLowering) ? ` The largest apron lowering found is ${say(maxLowering, 'length')}.` : '';
    const none = noLowering > 0 ? ` For ${noLowering} of them no apron lowering holds the jump within the section (apronLowering is empty).` : '';
    warnings.push({ code: 'jump-swept-out', message: `At ${sweptOut} of ${n} flows the tailwater is below the sequent depth and the jump is swept out of the basin.${lowering}${none}` });
  }
  if (oscillating > 0) warnings.push({ code: 'oscillating-jump', message: `At ${oscillating} of ${n} flows 2.5 ≤ Fr1 < 4.5 (oscillating jump): waves travel downstream; stilling-basin designs avoid this range or add wave suppression (USBR EM 25).` });
  if (noJump > 0) warnings.push({ code: 'no-jump', message: `At ${noJump} of ${n} flows the toe flow is not supercritical (or the head cannot pass the flow), so no jump forms; see rows marked no-jump.` });
  if (surcharged > 0) warnings.push({ code: 'section-surcharged', message: `At ${surcharged} of ${n} flows the sequent depth would exceed the conduit crown; the open-channel momentum balance does not hold there.` });
  if (noTailwater > 0) {
    warnings.push(tailwater.method === 'table'
      ? { code: 'rating-out-of-range', message: `${noTailwater} of ${n} flows lie outside the tailwater rating (${say(tailwater.discharge[0]!, 'discharge')} to ${say(tailwater.discharge[tailwater.discharge.length - 1]!, 'discharge')}); the rating is not extrapolated, so those rows have no tailwater. Extend the table to cover them.`, field: 'tailwaterRating' }
      : { code: 'no-normal-depth', message: `${noTailwater} of ${n} flows exceed the largest open-channel discharge of the tailwater conduit (it would flow full), so no normal depth exists for them.` });
  }
  return {
    ok: true,
    value: {
      rows,
      sweptOutCount: sweptOut,
      minMargin: Number.isFinite(minMargin) ? minMargin : null,
      criticalDischarge: Number.isFinite(criticalQ) ? criticalQ : null,
      requiredApronLowering: Number.isFinite(maxLowering) ? maxLowering : null,
    },
    warnings,
  };
}

function row(discharge: number, y1: number | null, fr1: number | null, y2: number | null, tailwater: number | null, margin: number | null, submergence: number | null, apronLowering: number | null, state: JumpPosition): TailwaterRow {
  return { discharge, y1, fr1, y2, tailwater, margin, submergence, apronLowering, state };
}

/**
 * Lowering d of the apron that puts the jump at the toe when the toe depth comes from the
 * head: lowering raises the head to H + d and the tailwater depth to TW + d. With the new toe
 * depth y as unknown, energy gives y2 = TW + d = E_k(y) − H + TW in closed form, and the
 * jump needs r(y) = M(y) − M(y2) = 0. r(y1) = M(y2) − M(TW) is bracketed towards shallower
 * toes (swept out) or deeper ones (submerged). `NaN` when no bracket exists or the result
 * is not a subcritical depth below a pipe crown.
 */
function apronLoweringForHead(section: Section, q: number, head: number, k: number, g: number, y1: number, yMin: number, yc: number, tw: number, margin: number): number {
  if (margin === 0) return 0;
  const c = ((1 + k) * q * q) / (2 * g);
  const shift = tw - head;
  const y2Of = (y: number): number => {
    const a = area(section, y);
    return y + c / (a * a) + shift;
  };
  const r = (y: number): number => momentumFunction(section, q, y, g) - momentumFunction(section, q, y2Of(y), g);
  let lo: number;
  let hi: number;
  if (margin < 0) {
    hi = y1;
    lo = 0.5 * y1;
    for (let i = 0; i < 200 && r(lo) >= 0; i++) {
      hi = lo;
      lo *= 0.5;
    }
  } else {
    lo = y1;
    hi = yMin;
  }
  const y = brent(r, lo, hi, DEPTH_TOLERANCE * hi);
  if (Number.isNaN(y)) return Number.NaN;
  const y2 = y2Of(y);
  return y2 > yc && y2 < sectionFullDepth(section) ? y2 - tw : Number.NaN;
}

function validate(input: TailwaterCheckInput) {
  const s = validateSection(input.section) ?? checkPhysics(input.g, undefined);
  if (s) return s;
  if (input.tolerance !== undefined) {
    const t = checkNonNegative(input.tolerance, 'tolerance', 'Tolerance');
    if (t) return t;
  }
  const qs: unknown = input.discharges;
  if (!Array.isArray(qs) || qs.length === 0) return fail('invalid-input', 'Give at least one discharge.', 'discharges');
  if (qs.length > MAX_FLOWS) return fail('invalid-input', `At most ${MAX_FLOWS} discharges can be checked at once.`, 'discharges');
  for (let i = 0; i < qs.length; i++) {
    if (!(typeof qs[i] === 'number' && Number.isFinite(qs[i]) && (qs[i] as number) > 0)) {
      return fail('invalid-input', `Discharge ${i + 1} must be a finite number > 0 (got ${describeValue(qs[i])}).`, 'discharges');
    }
  }
  return validateToe(input.toe) ?? validateTailwater(input.tailwater);
}

function validateToe(value: unknown) {
  const toe = (typeof value === 'object' ? value : null) as Record<string, unknown> | null;
  switch (toe?.['method']) {
    case 'head':
      return checkPositive(toe['head'], 'head', 'Head H above the apron') ?? (toe['lossCoefficient'] === undefined ? null : checkNonNegative(toe['lossCoefficient'], 'lossCoefficient', 'Loss coefficient k'));
    case 'depth':
      return checkPositive(toe['y1'], 'y1', 'Toe depth y1');
    case 'gate':
      return checkPositive(toe['opening'], 'opening', 'Gate opening a') ?? (toe['contractionCoefficient'] === undefined ? null : checkPositive(toe['contractionCoefficient'], 'contractionCoefficient', 'Contraction coefficient Cc'));
    default:
      return fail('invalid-input', 'Toe method must be "head", "depth" or "gate".', 'toeMethod');
  }
}

function validateTailwater(value: unknown) {
  const tw = (typeof value === 'object' ? value : null) as Record<string, unknown> | null;
  switch (tw?.['method']) {
    case 'table':
      return validateRatingTable(tw);
    case 'manning':
      return checkPositive(tw['n'], 'manningN', "Manning's n") ?? checkPositive(tw['slope'], 'bedSlope', 'Bed slope S') ?? (tw['section'] === undefined ? null : validateSection(tw['section']));
    default:
      return fail('invalid-input', 'Tailwater method must be "table" or "manning".', 'tailwaterMethod');
  }
}
