/**
 * Defensive checks for typed entry points: each returns a failure naming the field, or `null`.
 */
import { fail, type SolverFailure } from './result';

/** Short, never-throwing description of an untrusted value for messages. */
export function describeValue(value: unknown): string {
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return JSON.stringify(value.length > 40 ? `${value.slice(0, 40)}…` : value);
  if (value === null || value === undefined) return String(value);
  return `a ${Array.isArray(value) ? 'list' : typeof value}`;
}

/** True for a finite number. */
export function isFiniteNumber(value: unknown): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

/** Requires a finite number > 0. */
export function checkPositive(value: unknown, field: string, label: string): SolverFailure | null {
  return isFiniteNumber(value) && value > 0
    ? null
    : fail('invalid-input', `${label} must be a finite number greater than zero (got ${describeValue(value)}).`, field);
}

/** Requires a finite number ≥ 0. */
export function checkNonNegative(value: unknown, field: string, label: string): SolverFailure | null {
  return isFiniteNumber(value) && value >= 0
    ? null
    : fail('invalid-input', `${label} must be a finite number ≥ 0 (got ${describeValue(value)}).`, field);
}

/** Requires a finite number (any sign). */
export function checkFinite(value: unknown, field: string, label: string): SolverFailure | null {
  return isFiniteNumber(value)
    ? null
    : fail('invalid-input', `${label} must be a finite number (got ${describeValue(value)}).`, field);
}

/** Checks the optional gravity and density overrides. */
export function checkPhysics(g: unknown, density: unknown): SolverFailure | null {
  if (g !== undefined) {
    const e = checkPositive(g, 'g', 'Gravity g');
    if (e) return e;
  }
  if (density !== undefined) {
    const e = checkPositive(density, 'density', 'Water density ρ');
    if (e) return e;
  }
  return null;
}

/** Failure used when a computed value overflows or is otherwise not finite. */
export function overflowFailure(what: string): SolverFailure {
  return fail(
    'out-of-range',
    `The computed ${what} is not a finite number; the inputs are outside the range the solver can represent.`,
  );
}

/** Failure used when a bracketed root search does not converge. */
export function noConvergence(what: string): SolverFailure {
  return fail(
    'no-convergence',
    `The root search for ${what} did not converge on a verified bracket; no result is given rather than an uncertain one.`,
  );
}
