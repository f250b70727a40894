/**
 * `toe-depth` kind: metadata and adapter for {@link solveToeDepth}.
 */
import { dischargeFromValues, GRAVITY_FIELD, numberOutput, positiveField, sectionFields, sectionFromValues } from './inputFields';
import type { SolveContext } from './kinds';
import type { InputValues, KindSpec, SolveOutput } from './kindSpec';
import type { SolverResult } from './result';
import { solveToeDepth } from './toeDepth';

/** Input field of the loss coefficient k, shared with the tailwater check. */
export const LOSS_COEFFICIENT_FIELD = { name: 'lossCoefficient', label: 'Loss coefficient', symbol: 'k', latex: 'k', type: 'number', quantity: 'dimensionless', required: false, default: 0, min: 0, description: 'Head loss between the reservoir and the toe as h_L = k·V1²/2g (spillway face friction, chute losses); 0 for none.' } as const;

/** Metadata of the toe-depth kind. */
export const TOE_DEPTH_SPEC: KindSpec = {
  kind: 'toe-depth',
  title: 'Inflow (toe) depth from the energy head',
  summary: 'Supercritical depth at the foot of a spillway or chute from the total head above the apron.',
  methodNote: 'toe-depth',
  inputs: [
    ...sectionFields(),
    positiveField('discharge', 'Discharge', 'Q', 'Q', 'discharge', 'Total discharge Q.', { required: false, group: 'flow' }),
    positiveField('unitDischarge', 'Discharge per unit width', 'q', 'q', 'unitDischarge', 'Discharge per metre of width (rectangular); Q = q·b.', { required: false, group: 'flow', when: { field: 'shape', oneOf: ['rectangular'] } }),
    positiveField('head', 'Total head above the apron', 'H', 'H', 'length', 'Upstream energy level (reservoir level plus approach velocity head) minus the apron level at the toe.'),
    LOSS_COEFFICIENT_FIELD,
    GRAVITY_FIELD,
  ],
  groups: [{ id: 'flow', options: [['discharge'], ['unitDischarge']], description: 'Give the discharge Q, or q per unit width in a rectangular channel' }],
  outputs: [
    numberOutput('discharge', 'Discharge', 'Q', 'Q', 'discharge', 'Total discharge used.'),
    numberOutput('y1', 'Toe depth', 'y1', 'y_1', 'length', 'Supercritical depth at the toe.'),
    numberOutput('v1', 'Toe velocity', 'V1', 'V_1', 'velocity', 'Mean velocity at the toe.'),
    numberOutput('fr1', 'Toe Froude number', 'Fr1', '\\mathrm{Fr}_1', 'dimensionless', 'Froude number at the toe.'),
    numberOutput('e1', 'Specific energy at the toe', 'E1', 'E_1', 'length', 'y1 + V1²/2g (= H − k·V1²/2g).'),
    numberOutput('headLoss', 'Head loss to the toe', 'hL', 'h_L', 'length', 'k·V1²/2g.'),
    numberOutput('yc', 'Critical depth', 'yc', 'y_c', 'length', 'Critical depth for Q.'),
    numberOutput('maxDischarge', 'Largest discharge for this head', 'Qmax', 'Q_{max}', 'discharge', 'Discharge at which the toe flow would be critical.'),
  ],
};

/** Runs the kind on validated values. */
export function runToeDepth(v: InputValues, context: SolveContext): SolverResult<SolveOutput> {
  const discharge = dischargeFromValues(v);
  const r = solveToeDepth({ section: sectionFromValues(v), discharge, head: v['head'] as number, lossCoefficient: v['lossCoefficient'] as number, g: v['g'] as number, unitSystem: context.unitSystem });
  return r.ok ? { ok: true, value: { kind: TOE_DEPTH_SPEC.kind, values: { discharge, ...r.value } }, warnings: r.warnings } : r;
}
