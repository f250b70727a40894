/**
 * Result types shared by every solver function.
 *
 * Domain-invalid input and numerical failure are values, never exceptions:
 * only programmer errors (wrong argument types from typed callers) throw `RangeError`.
 */

/** A non-fatal note about a result: a stable machine `code` and an engineer-readable `message`. */
export interface Warning {
  /** Stable identifier, e.g. `"undular-jump"`; safe to match on in UI code. */
  readonly code: string;
  /** One or two sentences an engineer can act on. */
  readonly message: string;
  /** Input field the warning concerns, when there is one. */
  readonly field?: string;
}

/** Why a calculation could not be done: a stable `code`, a readable `message` and the offending field. */
export interface SolverError {
  /** Stable identifier, e.g. `"no-jump"`, `"invalid-input"`, `"no-convergence"`. */
  readonly code: string;
  /** What is wrong and, where possible, what to change. */
  readonly message: string;
  /** Input field at fault, when one is. */
  readonly field?: string;
}

/** Success: the value and any warnings. */
export interface SolverSuccess<T> {
  readonly ok: true;
  readonly value: T;
  readonly warnings: readonly Warning[];
}

/** Failure: one error, no value. */
export interface SolverFailure {
  readonly ok: false;
  readonly error: SolverError;
}

/** Outcome of every solver function. */
export type SolverResult<T> = SolverSuccess<T> | SolverFailure;

/** Wraps a value (and warnings) as a success. */
export function succeed<T>(value: T, warnings: readonly Warning[] = []): SolverSuccess<T> {
  return { ok: true, value, warnings };
}

/** Builds a failure from a code, message and optional field. */
export function fail(code: string, message: string, field?: string): SolverFailure {
  return { ok: false, error: field === undefined ? { code, message } : { code, message, field } };
}
