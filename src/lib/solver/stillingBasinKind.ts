/**
 * `stilling-basin` kind: metadata and adapter for {@link screenStillingBasins}.
 */
import { BASIN_FAMILIES, FAMILIES } from './basinFamilies';
import { GRAVITY_FIELD, numberOutput, positiveField } from './inputFields';
import type { InputFieldSpec, InputValues, KindSpec, OutputFieldSpec, SolveOutput } from './kindSpec';
import type { SolveContext } from './kinds';
import type { Quantity } from './quantity';
import { fail, type SolverResult } from './result';
import { DEFAULT_MAX_SUBMERGENCE, MAX_BASIN_FLOWS, screenStillingBasins, type StillingBasinInput } from './stillingBasin';

const list = (name: string, label: string, symbol: string, latex: string, quantity: Quantity, description: string, extra: Partial<InputFieldSpec> = {}): InputFieldSpec => ({
  name, label, symbol, latex, type: 'list', quantity, required: false, min: 0, exclusiveMin: true, description, ...extra,
});

const text = (name: string, label: string, description: string): OutputFieldSpec => ({ name, label, symbol: name, latex: `\\text{${name}}`, type: 'text', quantity: 'text', description });
/** An output that is null when the family sized has no such element (or none is sized): left out of the results shown. */
const optional = (o: OutputFieldSpec): OutputFieldSpec => ({ ...o, omitWhenNull: true });
const size = (name: string, label: string, symbol: string, latex: string, description: string) => optional(numberOutput(name, label, symbol, latex, 'length', description, true));

/** Choices of the `family` input: the monograph's own selection, or one family by id. */
export const FAMILY_CHOICES = ['auto', ...BASIN_FAMILIES] as const;

/** Metadata of the stilling-basin kind. */
export const STILLING_BASIN_SPEC: KindSpec = {
  kind: 'stilling-basin',
  title: 'Stilling-basin screening',
  summary: 'Which published basin families fit the inflow, how long the chosen basin is, its blocks and sill, and the tailwater margin over the flows.',
  methodNote: 'stilling-basin',
  caution: 'Screening and first sizing only. The relations are empirical and hold inside their stated ranges; a basin for a major structure needs a physical model study, and every design must be checked by a licensed engineer under the codes that apply locally.',
  inputs: [
    list('y1', 'Toe depth', 'y1', 'y_1', 'length', `Depth at the toe for each flow: one value, a list (at most ${MAX_BASIN_FLOWS}) or a reference such as check.y1.`, { required: true }),
    list('velocities', 'Inflow velocity', 'V1', 'V_1', 'velocity', 'Velocity at the toe for each flow.', { group: 'inflow' }),
    list('discharges', 'Discharge', 'Q', 'Q', 'discharge', 'Discharge for each flow (with the basin width).', { group: 'inflow' }),
    positiveField('width', 'Basin width', 'b', 'b', 'length', 'Width of the rectangular basin.', { required: false, group: 'inflow' }),
    list('unitDischarges', 'Discharge per unit width', 'q', 'q', 'unitDischarge', 'Discharge per metre of basin width for each flow.', { group: 'inflow' }),
    list('tailwater', 'Tailwater depth', 'TW', 'TW', 'length', 'Tailwater depth above the apron for each flow: a value, a list, or the tailwater of a tailwater block (check.TW).'),
    { name: 'family', label: 'Basin family', symbol: 'family', latex: '\\text{family}', type: 'choice', quantity: 'text', required: false, default: 'auto', choices: FAMILY_CHOICES, description: 'Family to size: auto takes the USBR monograph\'s own choice (III, else II, else IV, else the natural jump) among those that fit every flow; natural, usbr2, usbr3, usbr4 or saf sizes that one.' },
    { name: 'maxSubmergence', label: 'Submergence limit', symbol: 'smax', latex: 's_{max}', type: 'number', quantity: 'dimensionless', required: false, default: DEFAULT_MAX_SUBMERGENCE, min: 0, description: 'Warn when (TW − y2)/y2 exceeds this (default 0.2, common practice): the jump is drowned.' },
    GRAVITY_FIELD,
  ],
  groups: [{ id: 'inflow', options: [['velocities'], ['discharges', 'width'], ['unitDischarges']], description: 'Give the inflow as the velocity at the toe, the discharge with the basin width, or the discharge per unit width' }],
  outputs: [
    { ...text('family', 'Basin family', 'The family sized: the one asked for, or the monograph\'s choice among those that fit (none when none fits).'), choices: [...BASIN_FAMILIES.map((id) => FAMILIES[id].label), 'none'] },
    optional(numberOutput('designDischarge', 'Design discharge', 'Qd', 'Q_d', 'discharge', 'Discharge of the flow that needs the longest basin.', true)),
    numberOutput('y1', 'Toe depth', 'y1', 'y_1', 'length', 'Toe depth of the design flow.'),
    numberOutput('v1', 'Inflow velocity', 'V1', 'V_1', 'velocity', 'Velocity at the toe of the design flow.'),
    numberOutput('fr1', 'Froude number', 'Fr1', '\\mathrm{Fr}_1', 'dimensionless', 'Toe Froude number of the design flow.'),
    numberOutput('q', 'Discharge per unit width', 'q', 'q', 'unitDischarge', 'q = V1·y1 of the design flow.'),
    numberOutput('y2', 'Sequent depth', 'y2', 'y_2', 'length', 'Bélanger sequent depth of the design flow.'),
    size('basinLength', 'Basin length', 'LB', 'L_B', 'Length of the basin floor from the toe to the end sill.'),
    optional(numberOutput('tailwaterFactor', 'Tailwater factor', 'TW/y2', 'TW/y_2', 'dimensionless', 'Required tailwater as a multiple of y2, at the governing flow.', true)),
    optional(numberOutput('governingDischarge', 'Governing discharge', 'Qg', 'Q_g', 'discharge', 'Discharge with the smallest tailwater margin.', true)),
    optional(numberOutput('governingY1', 'Governing toe depth', 'y1g', 'y_{1,g}', 'length', 'Toe depth of the governing flow.', true)),
    optional(numberOutput('governingY2', 'Governing sequent depth', 'y2g', 'y_{2,g}', 'length', 'Sequent depth of the governing flow.', true)),
    size('requiredTailwater', 'Required tailwater', 'TWreq', 'TW_{req}', 'Tailwater the family needs at the governing flow.'),
    optional(numberOutput('tailwater', 'Tailwater', 'TW', 'TW', 'length', 'Available tailwater at the governing flow.', true)),
    size('margin', 'Tailwater margin', 'TW-TWreq', 'TW - TW_{req}', 'Smallest margin over the flows; negative: the jump sweeps out.'),
    optional(numberOutput('sweptOutCount', 'Flows swept out', 'nswept', 'n_{swept}', 'dimensionless', 'Flows whose tailwater is below the requirement.', true)),
    size('chuteBlockHeight', 'Chute block height', 'h1', 'h_1', 'Height of the chute blocks at the toe.'),
    size('chuteBlockWidth', 'Chute block width', 'w1', 'w_1', 'Width of a chute block.'),
    size('chuteBlockSpacing', 'Chute block spacing', 's1', 's_1', 'Clear space between chute blocks.'),
    size('baffleHeight', 'Baffle height', 'h3', 'h_3', 'Height of the baffle piers (USBR III) or floor blocks (SAF).'),
    size('baffleWidth', 'Baffle width', 'w3', 'w_3', 'Width of a baffle pier or floor block.'),
    size('baffleSpacing', 'Baffle spacing', 's3', 's_3', 'Clear space between baffle piers or floor blocks.'),
    size('baffleDistance', 'Baffle distance', 'x3', 'x_3', 'From the toe to the upstream face of the baffles.'),
    size('endSillHeight', 'End sill height', 'h4', 'h_4', 'Height of the end sill.'),
    size('sillToothWidth', 'Sill tooth width', 'w4', 'w_4', 'Width of a tooth of the dentated sill (USBR II).'),
    size('sillToothSpacing', 'Sill tooth spacing', 's4', 's_4', 'Space between the teeth of the dentated sill.'),
  ],
  table: {
    name: 'rows',
    label: 'Basin families',
    columns: [
      text('family', 'Family', 'Basin family.'),
      { ...text('fits', 'Fits', 'Whether every flow is inside the family\'s stated range.'), choices: ['yes', 'no'] },
      numberOutput('basinLength', 'Length', 'LB', 'L_B', 'length', 'Basin length for the design flow.'),
      numberOutput('tailwaterFactor', 'TW/y2', 'TW/y2', 'TW/y_2', 'dimensionless', 'Required tailwater over y2, at the flow with the smallest margin.'),
      numberOutput('minMargin', 'Smallest margin', 'min(TW-TWreq)', '\\min(TW - TW_{req})', 'length', 'Smallest tailwater margin over the flows.'),
      numberOutput('criticalDischarge', 'At discharge', 'Qcrit', 'Q_{crit}', 'discharge', 'Discharge with the smallest margin.', true),
      text('why', 'Why', 'The first flow outside the range, or the range the flows span.'),
      text('range', 'Stated range', 'The range the source gives.'),
      text('relations', 'Relations', 'The relations used for length, tailwater and elements.'),
    ],
  },
};

/** The velocities at the toe from whichever inflow the block gives. */
function velocities(v: InputValues, y1: readonly number[]): SolverResult<readonly number[]> {
  const given = v['velocities'] as readonly number[] | undefined;
  if (given) return { ok: true, value: given, warnings: [] };
  const unit = (v['unitDischarges'] as readonly number[] | undefined) ?? (v['discharges'] as readonly number[]).map((Q) => Q / (v['width'] as number));
  const n = Math.max(unit.length, y1.length);
  if ((unit.length !== 1 && unit.length !== n) || (y1.length !== 1 && y1.length !== n)) {
    return fail('invalid-input', `The flows do not line up: y1 has ${y1.length} values and the discharge ${unit.length}. Give one value per flow, or one for all.`, v['unitDischarges'] ? 'unitDischarges' : 'discharges');
  }
  return { ok: true, value: Array.from({ length: n }, (_, i) => (unit.length === 1 ? unit[0]! : unit[i]!) / (y1.length === 1 ? y1[0]! : y1[i]!)), warnings: [] };
}

/** Runs the kind on validated values. */
export function runStillingBasin(v: InputValues, context: SolveContext): SolverResult<SolveOutput> {
  const tailwater = v['tailwater'] as readonly number[] | undefined;
  if (tailwater === undefined) {
    return fail('missing-input', 'A basin is screened against the tailwater it will have: give TW (one depth above the apron, a list with one per flow, or a tailwater block\'s check.TW).', 'tailwater');
  }
  const y1 = v['y1'] as readonly number[];
  const v1 = velocities(v, y1);
  if (!v1.ok) return v1;
  const discharges = v['discharges'] as readonly number[] | undefined;
  const input: StillingBasinInput = { y1, v1: v1.value, tailwater, ...(discharges ? { discharges } : {}), family: v['family'] as StillingBasinInput['family'], maxSubmergence: v['maxSubmergence'] as number, g: v['g'] as number, unitSystem: context.unitSystem, inflowField: v['velocities'] ? 'velocities' : v['unitDischarges'] ? 'unitDischarges' : 'discharges' };
  const r = screenStillingBasins(input);
  if (!r.ok) return r;
  const { rows, ...values } = r.value;
  return { ok: true, value: { kind: STILLING_BASIN_SPEC.kind, values, rows: rows as unknown as readonly Readonly<Record<string, number | string | null>>[] }, warnings: r.warnings };
}
