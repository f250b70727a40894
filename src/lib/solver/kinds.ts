/**
 * Registry of calculation kinds: ids, metadata and their runners.
 */
import { DAM_BREAK_SPEC, runDamBreak } from './damBreakKind';
import { HYDRAULIC_JUMP_SPEC, runHydraulicJump } from './hydraulicJumpKind';
import type { InputValues, KindSpec, SolveOutput } from './kindSpec';
import type { SolverResult } from './result';
import type { UnitSystem } from './units';

/** What a runner knows besides its inputs: the units its messages quote figures in. */
export interface SolveContext {
  readonly unitSystem: UnitSystem;
}
import { runSluiceGate, SLUICE_GATE_SPEC } from './sluiceGateKind';
import { runStillingBasin, STILLING_BASIN_SPEC } from './stillingBasinKind';
import { runSurge, SURGE_SPEC } from './surgeKind';
import { runTailwaterCheck, TAILWATER_CHECK_SPEC } from './tailwaterCheckKind';
import { runToeDepth, TOE_DEPTH_SPEC } from './toeDepthKind';

/** Ids of every calculation kind, in menu order. */
export const SOLVER_KINDS = ['hydraulic-jump', 'toe-depth', 'sluice-gate', 'tailwater-check', 'stilling-basin', 'surge', 'dam-break'] as const;

/** One of {@link SOLVER_KINDS}. */
export type SolverKind = (typeof SOLVER_KINDS)[number];

/** Metadata of every kind, keyed by id. */
export const KIND_SPECS: Readonly<Record<SolverKind, KindSpec>> = {
  'hydraulic-jump': HYDRAULIC_JUMP_SPEC,
  'toe-depth': TOE_DEPTH_SPEC,
  'sluice-gate': SLUICE_GATE_SPEC,
  'tailwater-check': TAILWATER_CHECK_SPEC,
  'stilling-basin': STILLING_BASIN_SPEC,
  surge: SURGE_SPEC,
  'dam-break': DAM_BREAK_SPEC,
};

/** Runner of each kind on validated inputs (internal to the solver). */
export const KIND_RUNNERS: Readonly<Record<SolverKind, (v: InputValues, context: SolveContext) => SolverResult<SolveOutput>>> = {
  'hydraulic-jump': runHydraulicJump,
  'toe-depth': runToeDepth,
  'sluice-gate': runSluiceGate,
  'tailwater-check': runTailwaterCheck,
  'stilling-basin': runStillingBasin,
  surge: runSurge,
  'dam-break': runDamBreak,
};

/** True when `kind` names a calculation kind. */
export function isSolverKind(kind: unknown): kind is SolverKind {
  return typeof kind === 'string' && (SOLVER_KINDS as readonly string[]).includes(kind);
}

/** Metadata of `kind`, or `undefined` for an unknown id. */
export function getKindSpec(kind: string): KindSpec | undefined {
  return isSolverKind(kind) ? KIND_SPECS[kind] : undefined;
}
