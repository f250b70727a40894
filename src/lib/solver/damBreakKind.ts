/**
 * `dam-break` kind: metadata and adapter for {@link solveDamBreak}.
 */
import { solveDamBreak } from './damBreak';
import { GRAVITY_FIELD, numberOutput, positiveField } from './inputFields';
import type { InputValues, KindSpec, SolveOutput } from './kindSpec';
import type { SolverResult } from './result';

/** Metadata of the wet-bed dam-break kind. */
export const DAM_BREAK_SPEC: KindSpec = {
  kind: 'dam-break',
  title: 'Dam-break wave on a wet bed',
  summary: "Stoker's solution for an instantaneous dam break onto still water: front speed and height, the flow behind the front and at the dam.",
  methodNote: 'dam-break',
  inputs: [
    positiveField('upstreamDepth', 'Upstream depth', 'h0', 'h_0', 'length', 'Still-water depth behind the dam.'),
    positiveField('downstreamDepth', 'Downstream depth', 'h1', 'h_1', 'length', 'Still-water depth below the dam (0 < h1 < h0; small for a nearly dry bed).'),
    positiveField('time', 'Time after the break', 't', 't', 'time', 'Optional: gives the positions of the front and of the negative wave.', { required: false }),
    GRAVITY_FIELD,
  ],
  groups: [],
  outputs: [
    numberOutput('frontSpeed', 'Front speed', 's', 's', 'velocity', 'Speed of the bore running downstream.'),
    numberOutput('depthBehind', 'Depth behind the front', 'h2', 'h_2', 'length', 'Uniform depth between the fan and the front.'),
    numberOutput('velocityBehind', 'Velocity behind the front', 'u2', 'u_2', 'velocity', 'Uniform velocity between the fan and the front.'),
    numberOutput('frontHeight', 'Front height', 'dh', '\\Delta h', 'length', 'h2 − h1.'),
    numberOutput('frontFroude', 'Front Froude number', 'Frs', '\\mathrm{Fr}_s', 'dimensionless', 's/√(g·h1).'),
    { name: 'frontType', label: 'Front', symbol: 'front', latex: '\\text{front}', type: 'text', quantity: 'text', choices: ['undular', 'transitional', 'breaking'], description: 'By the front Froude number, as for bores.' },
    numberOutput('fanHeadSpeed', 'Negative wave speed', 'c0', '-\\sqrt{g h_0}', 'velocity', 'Speed of the head of the rarefaction running upstream (negative).'),
    numberOutput('fanTailSpeed', 'Fan tail speed', 'u2-c2', 'u_2 - c_2', 'velocity', 'Speed of the tail of the rarefaction; positive when the fan covers the dam site.'),
    numberOutput('depthAtDam', 'Depth at the dam', 'hd', 'h_d', 'length', '4h0/9 when the fan covers the dam site (h1/h0 < 0.138), else h2.'),
    numberOutput('velocityAtDam', 'Velocity at the dam', 'ud', 'u_d', 'velocity', 'Velocity at the dam site.'),
    numberOutput('unitDischargeAtDam', 'Unit discharge at the dam', 'qd', 'q_d', 'unitDischarge', 'Outflow per unit width.'),
    numberOutput('ritterFrontSpeed', 'Dry-bed front speed', '2c0', '2\\sqrt{g h_0}', 'velocity', "Ritter's dry-bed front speed, the limit as h1 → 0."),
    numberOutput('frontPosition', 'Front position', 'xf', 'x_f', 'length', 'Distance of the front below the dam at time t.', true),
    numberOutput('fanHeadPosition', 'Negative wave position', 'xn', 'x_n', 'length', 'Position of the negative wave at time t (negative: upstream).', true),
  ],
};

/** Runs the kind on validated values. */
export function runDamBreak(v: InputValues): SolverResult<SolveOutput> {
  const r = solveDamBreak({
    upstreamDepth: v['upstreamDepth'] as number,
    downstreamDepth: v['downstreamDepth'] as number,
    g: v['g'] as number,
    ...(v['time'] !== undefined ? { time: v['time'] as number } : {}),
  });
  return r.ok ? { ok: true, value: { kind: DAM_BREAK_SPEC.kind, values: { ...r.value } }, warnings: r.warnings } : r;
}
