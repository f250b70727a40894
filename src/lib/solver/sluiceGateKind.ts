/**
 * `sluice-gate` kind: metadata and adapter for {@link solveSluiceGate}.
 */
import { GRAVITY_FIELD, numberOutput, positiveField } from './inputFields';
import type { SolveContext } from './kinds';
import type { InputValues, KindSpec, SolveOutput } from './kindSpec';
import type { SolverResult } from './result';
import { DEFAULT_CONTRACTION_COEFFICIENT, solveSluiceGate } from './sluiceGate';

/** Input field of the contraction coefficient Cc, shared with the tailwater check. */
export const CONTRACTION_COEFFICIENT_FIELD = { name: 'contractionCoefficient', label: 'Contraction coefficient', symbol: 'Cc', latex: 'C_c', type: 'number', quantity: 'dimensionless', required: false, default: DEFAULT_CONTRACTION_COEFFICIENT, min: 0, exclusiveMin: true, max: 1, description: 'y1 = Cc·a; 0.61 for a sharp-edged vertical gate (common practice), warned outside 0.5–0.7.' } as const;

/** Metadata of the sluice-gate kind. */
export const SLUICE_GATE_SPEC: KindSpec = {
  kind: 'sluice-gate',
  title: 'Sluice gate (free flow)',
  summary: 'Contracted depth below a vertical gate, and the discharge from the upstream depth or the upstream depth from the discharge.',
  methodNote: 'sluice-gate',
  inputs: [
    positiveField('width', 'Gate width', 'b', 'b', 'length', 'Width of the gate and of the rectangular channel.'),
    positiveField('opening', 'Gate opening', 'a', 'a', 'length', 'Height of the opening under the gate.'),
    CONTRACTION_COEFFICIENT_FIELD,
    positiveField('upstreamDepth', 'Upstream depth', 'y0', 'y_0', 'length', 'Depth upstream of the gate.', { required: false, group: 'known' }),
    positiveField('discharge', 'Discharge', 'Q', 'Q', 'discharge', 'Discharge through the gate.', { required: false, group: 'known' }),
    positiveField('unitDischarge', 'Discharge per unit width', 'q', 'q', 'unitDischarge', 'Discharge per metre of gate width.', { required: false, group: 'known' }),
    GRAVITY_FIELD,
  ],
  groups: [{ id: 'known', options: [['upstreamDepth'], ['discharge'], ['unitDischarge']], description: 'Give the upstream depth or the discharge' }],
  outputs: [
    numberOutput('y1', 'Contracted depth', 'y1', 'y_1', 'length', 'Depth at the vena contracta, Cc·a: the toe depth of a jump below the gate.'),
    numberOutput('upstreamDepth', 'Upstream depth', 'y0', 'y_0', 'length', 'Depth upstream of the gate.'),
    numberOutput('discharge', 'Discharge', 'Q', 'Q', 'discharge', 'Discharge through the gate.'),
    numberOutput('unitDischarge', 'Discharge per unit width', 'q', 'q', 'unitDischarge', 'Q/b.'),
    numberOutput('v1', 'Jet velocity', 'V1', 'V_1', 'velocity', 'Velocity at the vena contracta.'),
    numberOutput('fr1', 'Jet Froude number', 'Fr1', '\\mathrm{Fr}_1', 'dimensionless', 'Froude number at the vena contracta.'),
    numberOutput('v0', 'Upstream velocity', 'V0', 'V_0', 'velocity', 'Approach velocity.'),
    numberOutput('e0', 'Upstream specific energy', 'E0', 'E_0', 'length', 'y0 + V0²/2g.'),
    numberOutput('dischargeCoefficient', 'Discharge coefficient', 'Cd', 'C_d', 'dimensionless', 'Cd in q = Cd·a·√(2g·y0).'),
  ],
};

/** Runs the kind on validated values. */
export function runSluiceGate(v: InputValues, context: SolveContext): SolverResult<SolveOutput> {
  const b = v['width'] as number;
  const known = v['upstreamDepth'] !== undefined ? { upstreamDepth: v['upstreamDepth'] as number } : { discharge: v['discharge'] !== undefined ? (v['discharge'] as number) : (v['unitDischarge'] as number) * b };
  const r = solveSluiceGate({ width: b, opening: v['opening'] as number, contractionCoefficient: v['contractionCoefficient'] as number, g: v['g'] as number, unitSystem: context.unitSystem, ...known });
  return r.ok ? { ok: true, value: { kind: SLUICE_GATE_SPEC.kind, values: { ...r.value } }, warnings: r.warnings } : r;
}
