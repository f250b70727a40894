/**
 * `tailwater-check` kind: metadata and adapter for {@link solveTailwaterCheck}.
 */
import { GRAVITY_FIELD, numberOutput, positiveField, sectionFields, sectionFromValues } from './inputFields';
import type { SolveContext } from './kinds';
import type { InputValues, KindSpec, SolveOutput } from './kindSpec';
import type { SolverResult } from './result';
import { SECTION_SHAPES } from './section';
import { CONTRACTION_COEFFICIENT_FIELD } from './sluiceGateKind';
import { DEFAULT_TOE_TOLERANCE, dischargeRange, MAX_FLOWS, solveTailwaterCheck, type TailwaterSource, type ToeMethod } from './tailwaterCheck';
import { LOSS_COEFFICIENT_FIELD } from './toeDepthKind';
import type { RatingTable } from './tailwaterRating';

const onToe = (m: string) => ({ field: 'toeMethod', oneOf: [m] });
const onTw = (m: string) => ({ field: 'tailwaterMethod', oneOf: [m] });

/** Default number of flows for a min/max range. */
export const DEFAULT_DISCHARGE_STEPS = 20;

/** Metadata of the tailwater-check kind. */
export const TAILWATER_CHECK_SPEC: KindSpec = {
  kind: 'tailwater-check',
  title: 'Tailwater check over a discharge range',
  summary: 'Sequent depth against the tailwater for each flow: swept out, at the toe or submerged, with the apron lowering that holds the jump.',
  methodNote: 'tailwater-check',
  inputs: [
    ...sectionFields(),
    { name: 'discharges', label: 'Discharges', symbol: 'Q', latex: 'Q', type: 'list', quantity: 'discharge', required: false, group: 'flows', min: 0, exclusiveMin: true, description: `List of discharges to check (at most ${MAX_FLOWS}).` },
    positiveField('dischargeMin', 'Smallest discharge', 'Qmin', 'Q_{min}', 'discharge', 'Start of an evenly spaced range.', { required: false, group: 'flows' }),
    positiveField('dischargeMax', 'Largest discharge', 'Qmax', 'Q_{max}', 'discharge', 'End of the range (inclusive).', { required: false, group: 'flows' }),
    { name: 'dischargeSteps', label: 'Number of flows', symbol: 'steps', latex: 'n_Q', type: 'number', quantity: 'dimensionless', required: false, default: DEFAULT_DISCHARGE_STEPS, min: 2, max: MAX_FLOWS, description: 'Number of flows in the range, ends included (integer).' },
    { name: 'toeMethod', label: 'Toe depth from', symbol: 'toe', latex: '\\text{toe}', type: 'choice', quantity: 'text', required: false, default: 'head', choices: ['head', 'depth', 'gate'], description: 'head: energy equation from the head above the apron; depth: a fixed y1; gate: y1 = Cc·a below a gate.' },
    positiveField('head', 'Total head above the apron', 'H', 'H', 'length', 'Upstream energy level minus apron level (held constant over the range).', { when: onToe('head') }),
    { ...LOSS_COEFFICIENT_FIELD, when: onToe('head') },
    positiveField('y1', 'Toe depth', 'y1', 'y_1', 'length', 'Fixed supercritical depth at the toe.', { when: onToe('depth') }),
    positiveField('gateOpening', 'Gate opening', 'a', 'a', 'length', 'Opening of the gate upstream of the basin.', { when: onToe('gate') }),
    { ...CONTRACTION_COEFFICIENT_FIELD, when: onToe('gate') },
    { name: 'tailwaterMethod', label: 'Tailwater from', symbol: 'tailwater', latex: '\\text{tailwater}', type: 'choice', quantity: 'text', required: false, default: 'table', choices: ['table', 'manning'], description: 'table: a rating (discharge, depth) interpolated linearly, never extrapolated; manning: normal depth in the section.' },
    { name: 'tailwaterRating', label: 'Tailwater rating', symbol: 'rating', latex: '\\text{rating}', type: 'table', quantity: 'length', required: true, when: onTw('table'), columns: [
      { name: 'discharge', label: 'Discharge', quantity: 'discharge', description: 'Discharge, strictly increasing.', aliases: ['Q', 'flow'] },
      { name: 'depth', label: 'Tailwater depth', quantity: 'length', description: 'Tailwater depth above the apron.', aliases: ['TW', 'tailwater', 'y'], optional: true },
      { name: 'stage', label: 'Stage', quantity: 'length', description: 'Water level above a datum; needs the apron level on the same datum.', aliases: ['level', 'water level', 'WL', 'elevation'], optional: true },
    ], description: 'Tailwater depth above the apron (or stage, with the apron level) against discharge: rows in the block, or an attached CSV file.' },
    { name: 'apronLevel', label: 'Apron level', symbol: 'apron', latex: 'z_{apron}', type: 'number', quantity: 'length', required: false, when: onTw('table'), description: 'Level of the apron on the datum of a rating given as stage: depth = stage − apron level.' },
    { name: 'channelShape', label: 'Tailwater channel shape', symbol: 'channel', latex: '\\text{channel}', type: 'choice', quantity: 'text', required: false, default: 'same', choices: ['same', ...SECTION_SHAPES], when: onTw('manning'), description: 'Section of the downstream channel for the normal depth; "same" uses the basin section.' },
    positiveField('channelWidth', 'Tailwater channel width', 'bc', 'b_c', 'length', 'Bottom width of the downstream channel.', { min: 0, exclusiveMin: false, when: { field: 'channelShape', oneOf: ['rectangular', 'trapezoidal'] } }),
    { name: 'channelSideSlope', label: 'Tailwater channel side slope', symbol: 'zc', latex: 'z_c', type: 'number', quantity: 'dimensionless', required: true, min: 0, when: { field: 'channelShape', oneOf: ['trapezoidal', 'triangular'] }, description: 'Side slope (H:V) of the downstream channel.' },
    positiveField('channelDiameter', 'Tailwater conduit diameter', 'Dc', 'D_c', 'length', 'Diameter of a downstream conduit.', { when: { field: 'channelShape', oneOf: ['circular'] } }),
    positiveField('manningN', "Manning's n", 'n', 'n', 'manningN', 'Roughness of the tailwater channel (the same n in SI and US customary forms).', { when: onTw('manning') }),
    positiveField('bedSlope', 'Bed slope', 'S', 'S', 'slope', 'Bed slope of the tailwater channel (m/m).', { when: onTw('manning') }),
    { name: 'tolerance', label: 'At-the-toe tolerance', symbol: 'tol', latex: '\\varepsilon', type: 'number', quantity: 'dimensionless', required: false, default: DEFAULT_TOE_TOLERANCE, min: 0, description: 'The jump counts as at the toe when |TW − y2| ≤ tol·y2 (default 5 %, common practice).' },
    GRAVITY_FIELD,
  ],
  groups: [{ id: 'flows', options: [['discharges'], ['dischargeMin', 'dischargeMax']], description: 'Give a list of discharges or a range (smallest, largest)' }],
  outputs: [
    numberOutput('sweptOutCount', 'Flows swept out', 'nswept', 'n_{swept}', 'dimensionless', 'Number of flows whose jump is swept out.'),
    numberOutput('minMargin', 'Smallest margin', 'min(TW-y2)', '\\min(TW - y_2)', 'length', 'Smallest tailwater margin over the range.', true),
    numberOutput('criticalDischarge', 'Critical discharge', 'Qcrit', 'Q_{crit}', 'discharge', 'Discharge with the smallest margin.', true),
    numberOutput('requiredApronLowering', 'Required apron lowering', 'dz', '\\Delta z', 'length', 'Largest apron lowering needed over the range (≤ 0: none).', true),
  ],
  table: {
    name: 'rows',
    label: 'Flows',
    columns: [
      numberOutput('discharge', 'Discharge', 'Q', 'Q', 'discharge', 'Discharge.'),
      numberOutput('y1', 'Toe depth', 'y1', 'y_1', 'length', 'Toe depth.', true),
      numberOutput('fr1', 'Froude number', 'Fr1', '\\mathrm{Fr}_1', 'dimensionless', 'Toe Froude number.', true),
      numberOutput('y2', 'Sequent depth', 'y2', 'y_2', 'length', 'Sequent depth needed.', true),
      numberOutput('tailwater', 'Tailwater', 'TW', 'TW', 'length', 'Tailwater depth above the apron.', true),
      numberOutput('margin', 'Margin', 'TW-y2', 'TW - y_2', 'length', 'Negative: swept out.', true),
      numberOutput('submergence', 'Submergence', 's', '(TW - y_2)/y_2', 'dimensionless', '(TW − y2)/y2; negative: deficit.', true),
      numberOutput('apronLowering', 'Apron lowering', 'dz', '\\Delta z', 'length', 'Lowering that puts the jump at the toe; negative: the apron could be raised.', true),
      { name: 'state', label: 'Jump position', symbol: 'state', latex: '\\text{state}', type: 'text', quantity: 'text', choices: ['swept-out', 'at-toe', 'submerged', 'no-tailwater', 'no-jump', 'surcharged'], description: 'Where the jump sits for this flow.' },
    ],
  },
};

function channelSection(v: InputValues) {
  const shape = v['channelShape'];
  if (shape === undefined || shape === 'same') return {};
  return { section: sectionFromValues({ shape, width: v['channelWidth'] as number, sideSlope: v['channelSideSlope'] as number, diameter: v['channelDiameter'] as number }) };
}

/** A rating as the block gives it: depths above the apron, or stages on a datum. */
interface RatingInput {
  readonly discharge: readonly number[];
  readonly depth?: readonly number[];
  readonly stage?: readonly number[];
  readonly source?: string;
  readonly rowNumbers?: readonly number[];
}

/** The rating as depths above the apron: a stage column less the apron level. */
export function ratingDepths(rating: RatingInput, apronLevel: number | undefined): SolverResult<RatingTable> {
  const { discharge, depth, stage, source, rowNumbers } = rating;
  const meta = { ...(source !== undefined ? { source } : {}), ...(rowNumbers !== undefined ? { rowNumbers } : {}) };
  const bad = (message: string) => ({ ok: false as const, error: { code: 'invalid-input' as const, message, field: 'tailwaterRating' } });
  if (depth && stage) return bad('The tailwater rating gives both depth and stage: keep one column.');
  if (depth) {
    if (apronLevel !== undefined) return { ok: false, error: { code: 'invalid-input', message: 'The apron level turns stages into depths, but this rating already gives depths: leave the apron level out.', field: 'apronLevel' } };
    return { ok: true, value: { discharge, depth, ...meta }, warnings: [] };
  }
  if (!stage) return bad('The tailwater rating needs a depth column (above the apron) or a stage column (a level, with the apron level).');
  if (apronLevel === undefined || !Number.isFinite(apronLevel)) {
    return { ok: false, error: { code: 'invalid-input', message: 'The rating gives stages (water levels): give the apron level on the same datum, so that depth = stage − apron level.', field: 'apronLevel' } };
  }
  const label = source ?? 'Rating';
  for (let i = 0; i < stage.length; i++) {
    if (!(stage[i]! > apronLevel)) {
      return bad(`${label} row ${rowNumbers?.[i] ?? i + 1}: stage ${formatLevel(stage[i]!)} m is not above the apron level ${formatLevel(apronLevel)} m, so there is no tailwater depth there.`);
    }
  }
  return { ok: true, value: { discharge, depth: stage.map((s) => s - apronLevel), ...meta }, warnings: [] };
}

const formatLevel = (x: number) => (Math.round(x * 1000) / 1000).toString();

/** Runs the kind on validated values. */
export function runTailwaterCheck(v: InputValues, context: SolveContext): SolverResult<SolveOutput> {
  let discharges = v['discharges'] as readonly number[] | undefined;
  if (discharges === undefined) {
    const min = v['dischargeMin'] as number;
    const max = v['dischargeMax'] as number;
    const steps = v['dischargeSteps'] as number;
    if (!(max >= min)) return { ok: false, error: { code: 'invalid-input', message: 'The largest discharge must not be less than the smallest.', field: 'dischargeMax' } };
    if (!Number.isInteger(steps)) return { ok: false, error: { code: 'invalid-input', message: 'The number of flows must be a whole number.', field: 'dischargeSteps' } };
    discharges = dischargeRange(min, max, steps);
  }
  const toe: ToeMethod =
    v['toeMethod'] === 'depth' ? { method: 'depth', y1: v['y1'] as number }
    : v['toeMethod'] === 'gate' ? { method: 'gate', opening: v['gateOpening'] as number, contractionCoefficient: v['contractionCoefficient'] as number }
    : { method: 'head', head: v['head'] as number, lossCoefficient: v['lossCoefficient'] as number };
  const given = v['tailwaterRating'] as RatingInput | undefined;
  let tailwater: TailwaterSource;
  if (v['tailwaterMethod'] === 'manning' || given === undefined) {
    tailwater = { method: 'manning', n: v['manningN'] as number, slope: v['bedSlope'] as number, ...channelSection(v) };
  } else {
    const rating = ratingDepths(given, v['apronLevel'] as number | undefined);
    if (!rating.ok) return rating;
    tailwater = { method: 'table', ...rating.value };
  }
  const r = solveTailwaterCheck({ section: sectionFromValues(v), discharges, toe, tailwater, tolerance: v['tolerance'] as number, g: v['g'] as number, unitSystem: context.unitSystem });
  if (!r.ok) return r;
  const { rows, ...values } = r.value;
  return { ok: true, value: { kind: TAILWATER_CHECK_SPEC.kind, values, rows: rows as unknown as readonly Readonly<Record<string, number | string | null>>[] }, warnings: r.warnings };
}
