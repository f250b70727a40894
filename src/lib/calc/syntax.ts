/**
 * The syntax tree of Sequent calculation blocks.
 *
 * A block is a fenced code block whose info string starts with a calculation word, then
 * optionally the block's name:
 *
 *     ```jump basin
 *     # Design flood at the Aldmere weir
 *     shape = rectangular
 *     b = 12 m
 *     Q = 85 m3/s
 *     y1 = toe.y1          # another block's output
 *     ```
 *
 * Line numbers are 1-based and count from the top of the whole case body, so an error
 * points to the line the author sees in the editor.
 */

/** A number as written, with its unit text (empty when none was written). */
export interface NumberLiteral {
  readonly type: 'number';
  readonly value: number;
  readonly unit: string;
}

/** A comma-separated list of numbers; a trailing unit applies to items without one. */
export interface ListLiteral {
  readonly type: 'list';
  readonly items: readonly NumberLiteral[];
}

/** `from to until [unit] step s` or `from to until [unit] count n`. */
export interface RangeLiteral {
  readonly type: 'range';
  readonly from: number;
  readonly to: number;
  readonly unit: string;
  readonly step?: number;
  readonly count?: number;
}

/** `block.output`: the value of another block's output. */
export interface Reference {
  readonly type: 'reference';
  readonly block: string;
  readonly output: string;
}

/** A bare word: a choice such as `trapezoidal` or `upstream`. */
export interface Word {
  readonly type: 'word';
  readonly value: string;
}

/** A table given as `key:` followed by `|`-separated rows; the first row names columns with units. */
export interface TableLiteral {
  readonly type: 'table';
  /** Header cells as written, e.g. `Q m3/s`. */
  readonly header: readonly { readonly name: string; readonly unit: string; readonly line: number }[];
  readonly rows: readonly { readonly cells: readonly number[]; readonly line: number }[];
}

/** `file "name.csv"`: a file attached to the case, read as a table (a tailwater rating). */
export interface FileReference {
  readonly type: 'file';
  /** The attachment's file name as written. */
  readonly name: string;
}

export type ValueNode = NumberLiteral | ListLiteral | RangeLiteral | Reference | Word | TableLiteral | FileReference;

/** `key = value` (or a table under `key:`) on one line of a block. */
export interface Assignment {
  readonly key: string;
  readonly value: ValueNode;
  /** Line of the key. */
  readonly line: number;
}

/** A problem found while reading a block, tied to a line. */
export interface LineIssue {
  readonly line: number;
  readonly message: string;
  /** What to write instead, when there is an obvious fix. */
  readonly hint?: string;
}

/** One calculation block as written in the case body. */
export interface BlockSource {
  /** The calculation word of the info string, e.g. `jump`. */
  readonly word: string;
  /** The block's name, or null when unnamed. Names are unique in a case. */
  readonly name: string | null;
  /** Line of the opening fence. */
  readonly line: number;
  /** Line of the closing fence (or the last line of the body if the fence is never closed). */
  readonly endLine: number;
  /** The body text between the fences. */
  readonly body: string;
  readonly assignments: readonly Assignment[];
  /** Syntax problems; the block cannot run while there are any. */
  readonly issues: readonly LineIssue[];
}
