/**
 * Uniform entry point: `solve(kind, inputs)` validates untrusted inputs against the kind's
 * metadata, runs the kind and returns its outputs keyed by the stable names of the spec.
 */
import { isSolverKind, KIND_RUNNERS, KIND_SPECS, SOLVER_KINDS } from './kinds';
import type { KindSpec, OutputValue, SolveOutput } from './kindSpec';
import { fail, type SolverResult } from './result';
import type { UnitSystem } from './units';
import { validateInputs } from './validateInputs';

/** How a calculation is asked for beyond its inputs. */
export interface SolveOptions {
  /** Units of the figures quoted in messages (inputs and outputs stay SI); SI by default. */
  readonly unitSystem?: UnitSystem;
}

/**
 * Solves one calculation. Inputs are SI numbers (plus choice strings, lists and tables) keyed
 * by the field names of {@link KIND_SPECS}. Never throws: junk input gives `ok: false`.
 *
 * @example solve('hydraulic-jump', { shape: 'rectangular', width: 3, discharge: 15, y1: 0.5 })
 */
export function solve(kind: string, inputs: unknown, options: SolveOptions = {}): SolverResult<SolveOutput> {
  if (!isSolverKind(kind)) {
    return fail('unknown-kind', `Unknown calculation "${typeof kind === 'string' ? kind : typeof kind}". Kinds: ${SOLVER_KINDS.join(', ')}.`);
  }
  const spec = KIND_SPECS[kind];
  const checked = validateInputs(spec, inputs);
  if (!checked.ok) return checked;
  const r = KIND_RUNNERS[kind](checked.value, { unitSystem: options.unitSystem === 'US' ? 'US' : 'SI' });
  if (!r.ok) return r;
  return { ok: true, value: shape(spec, r.value), warnings: [...checked.warnings, ...r.warnings] };
}

// Keep exactly the spec's outputs, in spec order: the contract, nothing more.
function shape(spec: KindSpec, out: SolveOutput): SolveOutput {
  const values: Record<string, OutputValue> = {};
  for (const o of spec.outputs) values[o.name] = out.values[o.name] ?? null;
  if (spec.table === undefined || out.rows === undefined) return { kind: spec.kind, values };
  const columns = spec.table.columns;
  const rows = out.rows.map((row) => {
    const r: Record<string, OutputValue> = {};
    for (const c of columns) r[c.name] = row[c.name] ?? null;
    return r;
  });
  return { kind: spec.kind, values, rows };
}
