/**
 * Metadata contract of the calculation kinds: what `solve(kind, inputs)` reads and returns.
 * The block language and the UI are generated from these descriptions, so names are stable:
 * renaming a field or output is a breaking change (bump SOLVER_VERSION's major).
 *
 * All numeric values crossing `solve` are SI; `quantity` says how to convert them for display.
 */
import type { Quantity } from './quantity';

/** How an input value is written. */
export type InputFieldType = 'number' | 'choice' | 'list' | 'table';

/** A column of a `table` input. */
export interface TableColumnSpec {
  /** Key of the column array in the table value, e.g. `"discharge"`. */
  readonly name: string;
  /** Short label for headers. */
  readonly label: string;
  /** Quantity of every cell. */
  readonly quantity: Quantity;
  /** What the column holds. */
  readonly description: string;
  /** Other header words that name the column (`TW` for a depth), matched without case. */
  readonly aliases?: readonly string[];
  /** The column may be left out (another column stands in for it). */
  readonly optional?: boolean;
}

/** Condition on a `choice` field that makes another field applicable. */
export interface FieldCondition {
  /** Name of the choice field. */
  readonly field: string;
  /** The field applies when the choice has one of these values. */
  readonly oneOf: readonly string[];
}

/** One input of a kind. */
export interface InputFieldSpec {
  /** Stable key in `solve()` inputs (camelCase), e.g. `"y1"`, `"sideSlope"`. */
  readonly name: string;
  /** Short human label, e.g. "Upstream depth". */
  readonly label: string;
  /** Conventional plain-text symbol (a natural alias for the block language), e.g. `"b"`, `"Q"`. */
  readonly symbol: string;
  /** KaTeX form of the symbol, e.g. `"y_1"`. */
  readonly latex: string;
  /** Value shape: number (SI), choice (string), list (SI numbers) or table (named SI columns). */
  readonly type: InputFieldType;
  /** Quantity of a number or list (SI); `text` for choices; for tables see `columns`. */
  readonly quantity: Quantity;
  /** Required whenever applicable (see `when`), unless it belongs to a `group` or has a `default`. */
  readonly required: boolean;
  /** Value used when omitted (SI for numbers). */
  readonly default?: number | string;
  /** Allowed values of a choice. */
  readonly choices?: readonly string[];
  /** Columns of a table. */
  readonly columns?: readonly TableColumnSpec[];
  /** Smallest allowed value (SI), inclusive unless `exclusiveMin`. */
  readonly min?: number;
  /** When true, `min` itself is not allowed. */
  readonly exclusiveMin?: boolean;
  /** Largest allowed value (SI), inclusive. */
  readonly max?: number;
  /** The field only applies under this condition; given otherwise, it is ignored with a warning. */
  readonly when?: FieldCondition;
  /** Id of the {@link InputGroupSpec} the field belongs to. */
  readonly group?: string;
  /** One or two sentences for help text. */
  readonly description: string;
}

/**
 * Alternative ways to give the same information: exactly one option must be complete
 * (every field of it present). Fields of the other options must be absent.
 * Example: `[["y1"], ["y2"]]`, or `[["discharges"], ["dischargeMin", "dischargeMax"]]`.
 */
export interface InputGroupSpec {
  /** Group id referenced by the fields' `group`. */
  readonly id: string;
  /** Alternatives, each a list of field names. */
  readonly options: readonly (readonly string[])[];
  /** Help text, e.g. "Give either the upstream or the downstream depth." */
  readonly description: string;
}

/** One output value (a key of `SolveOutput.values`, or a column of `SolveOutput.rows`). */
export interface OutputFieldSpec {
  /** Stable key, e.g. `"y2"`. */
  readonly name: string;
  /** Short human label. */
  readonly label: string;
  /** Conventional plain-text symbol. */
  readonly symbol: string;
  /** KaTeX form of the symbol. */
  readonly latex: string;
  /** `number` values are SI in `quantity`; `text` values are one of `choices`. */
  readonly type: 'number' | 'text';
  /** Quantity (SI) of a number; `text` for labels. */
  readonly quantity: Quantity;
  /** Possible values of a text output. */
  readonly choices?: readonly string[];
  /** When true the value may be `null` (not defined for this case). */
  readonly nullable?: boolean;
  /** When true a `null` value is left out of the results shown (an element the chosen basin family has none of). */
  readonly omitWhenNull?: boolean;
  /** One or two sentences for help text. */
  readonly description: string;
}

/** Complete description of one calculation kind. */
export interface KindSpec {
  /** Kind id, as used in `solve(kind, …)` and block info strings. */
  readonly kind: string;
  /** Title, e.g. "Stationary hydraulic jump". */
  readonly title: string;
  /** One-sentence summary. */
  readonly summary: string;
  /** Slug of the method note in content/methods (without `.md`). */
  readonly methodNote: string;
  /** A caution shown with every result of the kind, beyond the caution every result carries. */
  readonly caution?: string;
  /** Inputs, in display order. */
  readonly inputs: readonly InputFieldSpec[];
  /** Alternative-input groups. */
  readonly groups: readonly InputGroupSpec[];
  /** Scalar outputs (keys of `values`), in display order. */
  readonly outputs: readonly OutputFieldSpec[];
  /** Tabular output (`rows`), when the kind produces one row per case. */
  readonly table?: { readonly name: 'rows'; readonly label: string; readonly columns: readonly OutputFieldSpec[] };
}

/** A value given to `solve` for one field (SI numbers). */
export type InputValue = number | string | readonly number[] | TableValue;

/** A `table` input: SI columns by name, and where its rows came from (for row-numbered messages). */
export type TableValue = Readonly<Record<string, readonly number[]>> & { readonly source?: string; readonly rowNumbers?: readonly number[] };

/** Validated inputs of one kind: defaults applied, inapplicable fields removed. */
export type InputValues = Readonly<Record<string, InputValue>>;

/** A value returned by `solve` (SI numbers, text labels, or null where undefined). */
export type OutputValue = number | string | null;

/** What `solve` returns on success. */
export interface SolveOutput {
  /** Kind solved. */
  readonly kind: string;
  /** Scalar outputs keyed by {@link OutputFieldSpec.name}. */
  readonly values: Readonly<Record<string, OutputValue>>;
  /** Table rows keyed by column name, for kinds with a `table`. */
  readonly rows?: readonly Readonly<Record<string, OutputValue>>[];
}
