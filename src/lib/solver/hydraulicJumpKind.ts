/**
 * `hydraulic-jump` kind: metadata and adapter from flat inputs to {@link solveHydraulicJump}.
 */
import { solveHydraulicJump } from './hydraulicJump';
import { DENSITY_FIELD, dischargeFromValues, GRAVITY_FIELD, numberOutput, positiveField, sectionFields, sectionFromValues } from './inputFields';
import { JUMP_TYPES } from './jumpType';
import type { SolveContext } from './kinds';
import type { KindSpec, InputValues, SolveOutput } from './kindSpec';
import type { SolverResult } from './result';

/** Metadata of the stationary-jump kind. */
export const HYDRAULIC_JUMP_SPEC: KindSpec = {
  kind: 'hydraulic-jump',
  title: 'Stationary hydraulic jump',
  summary: 'Sequent depth, Froude numbers, energy loss, dissipated power, jump type and length in a rectangular, trapezoidal, triangular or circular section.',
  methodNote: 'hydraulic-jump',
  inputs: [
    ...sectionFields(),
    positiveField('discharge', 'Discharge', 'Q', 'Q', 'discharge', 'Total discharge Q through the section.', { required: false, group: 'flow' }),
    positiveField('unitDischarge', 'Discharge per unit width', 'q', 'q', 'unitDischarge', 'Discharge per metre of width q (rectangular sections); Q = q·b.', { required: false, group: 'flow', when: { field: 'shape', oneOf: ['rectangular'] } }),
    positiveField('y1', 'Upstream depth', 'y1', 'y_1', 'length', 'Supercritical depth before the jump (at the toe).', { required: false, group: 'depth' }),
    positiveField('y2', 'Downstream depth', 'y2', 'y_2', 'length', 'Subcritical depth after the jump.', { required: false, group: 'depth' }),
    GRAVITY_FIELD,
    DENSITY_FIELD,
  ],
  groups: [
    { id: 'flow', options: [['discharge'], ['unitDischarge']], description: 'Give the discharge Q, or q per unit width in a rectangular channel' },
    { id: 'depth', options: [['y1'], ['y2']], description: 'Give either the upstream depth y1 or the downstream depth y2' },
  ],
  outputs: [
    numberOutput('discharge', 'Discharge', 'Q', 'Q', 'discharge', 'Total discharge used.'),
    numberOutput('y1', 'Upstream depth', 'y1', 'y_1', 'length', 'Supercritical depth before the jump.'),
    numberOutput('y2', 'Sequent depth', 'y2', 'y_2', 'length', 'Subcritical (conjugate) depth after the jump.'),
    numberOutput('yc', 'Critical depth', 'yc', 'y_c', 'length', 'Depth at which Fr = 1 for this discharge.'),
    numberOutput('fr1', 'Upstream Froude number', 'Fr1', '\\mathrm{Fr}_1', 'dimensionless', 'V1/√(g·A1/T1).'),
    numberOutput('fr2', 'Downstream Froude number', 'Fr2', '\\mathrm{Fr}_2', 'dimensionless', 'V2/√(g·A2/T2).'),
    numberOutput('v1', 'Upstream velocity', 'V1', 'V_1', 'velocity', 'Mean velocity before the jump.'),
    numberOutput('v2', 'Downstream velocity', 'V2', 'V_2', 'velocity', 'Mean velocity after the jump.'),
    numberOutput('e1', 'Upstream specific energy', 'E1', 'E_1', 'length', 'y1 + V1²/2g.'),
    numberOutput('e2', 'Downstream specific energy', 'E2', 'E_2', 'length', 'y2 + V2²/2g.'),
    numberOutput('headLoss', 'Head loss', 'dE', '\\Delta E', 'length', 'Energy head dissipated in the jump, E1 − E2.'),
    numberOutput('relativeLoss', 'Relative loss', 'dE/E1', '\\Delta E/E_1', 'dimensionless', 'Fraction of the upstream specific energy dissipated.'),
    numberOutput('power', 'Dissipated power', 'P', 'P', 'power', 'ρ·g·Q·ΔE.'),
    numberOutput('jumpHeight', 'Jump height', 'hj', 'h_j', 'length', 'y2 − y1.'),
    numberOutput('sequentRatio', 'Sequent depth ratio', 'y2/y1', 'y_2/y_1', 'dimensionless', 'y2/y1.'),
    numberOutput('momentum', 'Momentum function', 'M', 'M', 'volume', 'Q²/(gA) + A·ȳ, equal on both sides.'),
    { name: 'jumpType', label: 'Jump type', symbol: 'type', latex: '\\text{type}', type: 'text', quantity: 'text', choices: JUMP_TYPES, description: 'Undular, weak, oscillating, steady or strong, by Fr1 (Chow 1959).' },
    numberOutput('jumpLength', 'Jump length', 'Lj', 'L_j', 'length', 'L_j ≈ 6.1·y2 (USBR EM 25; 4.5 ≤ Fr1 ≤ 13).'),
    numberOutput('rollerLength', 'Roller length', 'Lr', 'L_r', 'length', 'L_r = 8·y1·(Fr1 − 1.5) (Hager et al. 1990; 2.5 ≤ Fr1 ≤ 8).'),
  ],
};

/** Runs the kind on validated values. */
export function runHydraulicJump(v: InputValues, context: SolveContext): SolverResult<SolveOutput> {
  const r = solveHydraulicJump({
    section: sectionFromValues(v),
    discharge: dischargeFromValues(v),
    ...(v['y1'] !== undefined ? { y1: v['y1'] as number } : { y2: v['y2'] as number }),
    g: v['g'] as number,
    density: v['density'] as number,
    unitSystem: context.unitSystem,
  });
  return r.ok ? { ok: true, value: { kind: HYDRAULIC_JUMP_SPEC.kind, values: { discharge: dischargeFromValues(v), ...r.value } }, warnings: r.warnings } : r;
}
