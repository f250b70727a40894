/**
 * What evaluating a case body returns: per block either results or line-numbered errors.
 * Plain data (JSON-serialisable): stored as the revision's snapshot and sent to the browser.
 */
import type { LineIssue } from './syntax';

/** A value shown in a results table: SI for machines, formatted in the block's units for people. */
export interface ShownValue {
  /** Stable key (the solver's field or output name). */
  readonly name: string;
  readonly label: string;
  readonly symbol: string;
  readonly latex: string;
  readonly quantity: string;
  /** SI number, text label, list of SI numbers, or null where not defined. */
  readonly si: number | string | readonly number[] | null;
  /** Formatted number(s) or text, without the unit. */
  readonly text: string;
  /** Display unit (e.g. `m³/s`), empty for dimensionless values and text. */
  readonly unit: string;
}

/** One column of a results table of many rows (a tailwater sweep). */
export interface ShownColumn {
  readonly name: string;
  readonly label: string;
  readonly symbol: string;
  readonly latex: string;
  readonly quantity: string;
  readonly unit: string;
}

/** A warning from the solver, tied to the line of the input it concerns when there is one. */
export interface BlockWarning {
  readonly code: string;
  readonly message: string;
  readonly line?: number;
}

/** A table a block was given (a tailwater rating): SI columns, and the file it came from. */
export interface InputTable {
  /** The input's field name (`tailwaterRating`). */
  readonly name: string;
  readonly label: string;
  /** The attached file the rows were read from; null for rows written in the block. */
  readonly source: string | null;
  /** Each row's number in the file (spreadsheet rows, header = 1); absent for rows in the block. */
  readonly rowNumbers?: readonly number[];
  /** SI columns by name, as the solver got them. */
  readonly columns: Readonly<Record<string, readonly number[]>>;
}

/** The outcome of one calculation block. */
export interface BlockResult {
  /** Position of the block in the case, from 0. */
  readonly index: number;
  readonly word: string;
  /** Solver kind id. */
  readonly kind: string;
  readonly title: string;
  readonly name: string | null;
  readonly line: number;
  readonly endLine: number;
  readonly unitSystem: 'SI' | 'US';
  readonly status: 'ok' | 'error';
  readonly inputs: readonly ShownValue[];
  readonly outputs: readonly ShownValue[];
  readonly table?: { readonly columns: readonly ShownColumn[]; readonly rows: readonly (readonly (number | string | null)[])[]; readonly text: readonly (readonly string[])[] };
  /** The tables among the inputs (absent when there are none). */
  readonly tables?: readonly InputTable[];
  readonly warnings: readonly BlockWarning[];
  readonly errors: readonly LineIssue[];
  /** Slug of the method note of the kind (content/methods). */
  readonly methodNote: string;
  /** The kind's own caution (a basin screening's call for model studies), when it has one. */
  readonly caution?: string;
  readonly solverVersion: string;
}

/** The outcome of a whole case body. */
export interface CaseEvaluation {
  readonly blocks: readonly BlockResult[];
  readonly solverVersion: string;
}
