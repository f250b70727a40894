/**
 * `surge` kind: metadata and adapter for {@link solveSurge}.
 */
import { GRAVITY_FIELD, numberOutput, positiveField } from './inputFields';
import type { SolveContext } from './kinds';
import type { InputValues, KindSpec, SolveOutput } from './kindSpec';
import type { SolverResult } from './result';
import { SECTION_SHAPES } from './section';
import { solveSurge, type SurgeDirection, type SurgeInput } from './surge';

const known = (name: string, label: string, symbol: string, latex: string, quantity: 'length' | 'velocity' | 'unitDischarge', description: string) =>
  ({ name, label, symbol, latex, type: 'number', quantity, required: false, group: 'surge', description }) as const;

/** Metadata of the moving-surge (bore) kind. */
export const SURGE_SPEC: KindSpec = {
  kind: 'surge',
  title: 'Moving surge (bore)',
  summary: 'A positive surge or bore travelling up- or downstream in a rectangular channel, from one property of the surge.',
  methodNote: 'surge',
  inputs: [
    { name: 'shape', label: 'Section shape', symbol: 'shape', latex: '\\text{shape}', type: 'choice', quantity: 'text', required: false, default: 'rectangular', choices: SECTION_SHAPES, description: 'Only rectangular sections are supported for moving surges.' },
    positiveField('depth', 'Undisturbed depth', 'h', 'h', 'length', 'Depth of the water the front advances into.'),
    { name: 'velocity', label: 'Undisturbed velocity', symbol: 'u', latex: 'u', type: 'number', quantity: 'velocity', required: false, default: 0, description: 'Velocity of the water ahead of the front, positive downstream.' },
    { name: 'direction', label: 'Direction of travel', symbol: 'direction', latex: '\\text{direction}', type: 'choice', quantity: 'text', required: true, choices: ['upstream', 'downstream'], description: 'upstream: the front advances against the flow (e.g. a downstream gate closing); downstream: with it (e.g. an upstream gate opening).' },
    known('depthBehind', 'Depth behind the front', 'h2', 'h_2', 'length', 'Depth after the surge has passed.'),
    known('velocityBehind', 'Velocity behind the front', 'u2', 'u_2', 'velocity', 'Velocity after the surge has passed, positive downstream.'),
    known('surgeSpeed', 'Absolute surge speed', 'w', 'w', 'velocity', 'Speed of the front relative to the bed, positive downstream.'),
    known('dischargeChange', 'Change of unit discharge', 'dq', '\\Delta q', 'unitDischarge', 'q behind − q ahead: −u·h for a full closure at a downstream gate.'),
    GRAVITY_FIELD,
  ],
  groups: [{ id: 'surge', options: [['depthBehind'], ['velocityBehind'], ['surgeSpeed'], ['dischargeChange']], description: 'Give one property of the surge' }],
  outputs: [
    numberOutput('surgeSpeed', 'Absolute surge speed', 'w', 'w', 'velocity', 'Front speed relative to the bed, positive downstream.'),
    numberOutput('relativeCelerity', 'Celerity relative to the water', 'c', 'c', 'velocity', '√(g·h2·(h + h2)/(2h)).'),
    numberOutput('depthBehind', 'Depth behind', 'h2', 'h_2', 'length', 'Depth after the front.'),
    numberOutput('velocityBehind', 'Velocity behind', 'u2', 'u_2', 'velocity', 'Velocity after the front.'),
    numberOutput('surgeHeight', 'Surge height', 'dh', '\\Delta h', 'length', 'h2 − h.'),
    numberOutput('depthRatio', 'Depth ratio', 'h2/h', 'h_2/h', 'dimensionless', 'h2/h.'),
    numberOutput('surgeFroude', 'Surge Froude number', 'Frs', '\\mathrm{Fr}_s', 'dimensionless', 'c/√(g·h).'),
    numberOutput('linearWaveSpeed', 'Linear wave speed', 'c0', '\\sqrt{g h}', 'velocity', '√(g·h), which every bore outruns.'),
    numberOutput('unitDischargeAhead', 'Unit discharge ahead', 'q', 'q', 'unitDischarge', 'u·h.'),
    numberOutput('unitDischargeBehind', 'Unit discharge behind', 'q2', 'q_2', 'unitDischarge', 'u2·h2.'),
    numberOutput('dischargeChange', 'Change of unit discharge', 'dq', '\\Delta q', 'unitDischarge', 'q2 − q.'),
    { name: 'frontType', label: 'Front', symbol: 'front', latex: '\\text{front}', type: 'text', quantity: 'text', choices: ['undular', 'transitional', 'breaking'], description: 'Undular below Fr_s ≈ 1.3, breaking above ≈ 1.5 (Favre 1935; Treske 1994; from memory).' },
  ],
};

/** Runs the kind on validated values. */
export function runSurge(v: InputValues, context: SolveContext): SolverResult<SolveOutput> {
  const input: SurgeInput = {
    shape: v['shape'] as SurgeInput['shape'],
    depth: v['depth'] as number,
    velocity: v['velocity'] as number,
    direction: v['direction'] as SurgeDirection,
    g: v['g'] as number,
    unitSystem: context.unitSystem,
    ...Object.fromEntries(['depthBehind', 'velocityBehind', 'surgeSpeed', 'dischargeChange'].filter((k) => v[k] !== undefined).map((k) => [k, v[k] as number])),
  };
  const r = solveSurge(input);
  return r.ok ? { ok: true, value: { kind: SURGE_SPEC.kind, values: { ...r.value } }, warnings: r.warnings } : r;
}
