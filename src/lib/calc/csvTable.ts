/**
 * Reads a table input (a tailwater rating, say) from CSV text. Pure: no I/O, the same in the
 * browser and on the server; never throws; every refusal is one plain-English message that
 * names the file and the rows at fault.
 *
 * The format:
 * - **Rows.** The header is the first line that is neither blank nor a comment; each later
 *   non-blank line is one data row. A line whose first non-space character is `#` is a comment.
 *   Blank lines, comments and rows whose cells are all empty are skipped. Row numbers in
 *   messages (and `rowNumbers`) count every physical line from 1, as a text editor or a
 *   spreadsheet shows them, so with nothing above the header it is row 1.
 * - **Separators.** Comma, semicolon or tab, detected from the first lines. In a file separated
 *   by semicolons or tabs a decimal comma is read too (`1,25` = 1.25). Cells may be quoted
 *   (`"…"`, RFC 4180). A UTF-8 byte-order mark is ignored; line ends may be LF, CRLF or CR.
 * - **Header cells** name a column (its name, label or an alias, any case; `_` reads as a
 *   space) and its unit, in one of these forms: `Q (m3/s)`, `Q [m³/s]`, `Q m3/s`, `Q_m3/s`,
 *   or the name alone (`Q`), which takes the unit system's display unit (m³/s and m for SI,
 *   cfs and ft for US). Units are those of `parseUnit` (m3/s, m³/s, L/s, cfs, ft3/s, m, mm, ft…).
 *   A length may name its datum after the unit (`stage (m AOD)`, `WL (ft NAVD88)`).
 *   A header cell left empty marks a column to ignore; any other unrecognised cell, a column
 *   named twice, or a unit of the wrong quantity (`Q (m)`) is refused.
 * - **Cells** of the named columns hold one finite number each (`12`, `-0.5`, `1.2e3`; no
 *   thousands separators, no units). Discharges are zero or more, depths (a column named
 *   `depth`) above zero, and the discharge column (the first of `columns` of quantity
 *   discharge) increases strictly from row to row; other columns (a stage above a datum) may
 *   be any number. Every row has as many cells as the header; a table with a discharge column
 *   must have it in the header, and at least two columns in all.
 * - **Size.** At least two data rows; at most `maxRows` (5000 unless given).
 */
import Papa from 'papaparse';
import { displayUnit, parseUnit, toSI, unitsFor, type Quantity, type UnitDefinition, type UnitSystem } from '../solver';

/** A column a table input takes (as in KindSpec's table field `columns`). */
export interface CsvColumn {
  /** Key of the column in `values`, e.g. `"discharge"`; also accepted as a header name. */
  readonly name: string;
  /** Label for people, e.g. `"Tailwater depth"`; also accepted as a header name. */
  readonly label: string;
  /** Quantity of every cell; discharge cells must be ≥ 0, cells of a column named `depth` > 0. */
  readonly quantity: Quantity;
  /** Other header names, e.g. `["TW", "tailwater", "y"]`. */
  readonly aliases?: readonly string[];
}

/** What {@link readCsvTable} reads. */
export interface CsvTableOptions {
  /** Name of the file, used in messages: `aldmere-rating.csv row 8: …`. */
  readonly fileName: string;
  /** Columns the table takes. */
  readonly columns: readonly CsvColumn[];
  /** Unit assumed for a header without a unit: `displayUnit(quantity, unitSystem)`. */
  readonly unitSystem: UnitSystem;
  /** Most data rows accepted; default 5000. */
  readonly maxRows?: number;
}

/** The table in SI with the spreadsheet row number of each data row, or why it was refused. */
export type CsvTableResult =
  | { ok: true; values: Record<string, number[]>; rowNumbers: number[]; headers: { text: string; column: string; unit: string }[] }
  | { ok: false; message: string; hint?: string };

const DEFAULT_MAX_ROWS = 5000;
const SHOWN_BAD_ROWS = 5;
const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^[+-]?(?:\d+,\d*|,\d+)(?:[eE][+-]?\d+)?$/;
const HINT_NUMBER = 'Write plain numbers: a decimal point (1.25), or a decimal comma (1,25) in a file separated by semicolons or tabs; no units or thousands separators in cells.';

type Failure = { ok: false; message: string; hint?: string };
interface Row { readonly cells: string[]; readonly row: number; readonly quoteError: boolean }
interface Used { readonly index: number; readonly text: string; readonly column: CsvColumn; readonly unit: UnitDefinition; readonly unitText: string }
interface Bad { readonly row: number; readonly text: string; readonly hint: string }

const refuse = (message: string, hint?: string): Failure => (hint === undefined ? { ok: false, message } : { ok: false, message, hint });
const key = (name: string): string => name.trim().replace(/[\s_]+/g, ' ').toLowerCase();
const plural = (n: number, word: string): string => `${n} ${word}${n === 1 ? '' : 's'}`;

/**
 * Reads CSV text into SI columns. See the top of this file for the format.
 *
 * @example readCsvTable('Q (cfs),TW (ft)\n100,2\n200,3', { fileName: 'r.csv', columns, unitSystem: 'US' })
 * // { ok: true, values: { discharge: [2.8316846592, 5.6633693184], depth: [0.6096, 0.9144] }, rowNumbers: [2, 3], … }
 */
export function readCsvTable(text: string, options: CsvTableOptions): CsvTableResult {
  const file = typeof options?.fileName === 'string' && options.fileName.trim() !== '' ? options.fileName.trim() : 'The file';
  try {
    return read(text, options, file);
  } catch {
    return refuse(`${file} could not be read as a table.`, 'Save it again as CSV (comma, semicolon or tab separated, UTF-8) and load it once more.');
  }
}

function read(text: string, options: CsvTableOptions, file: string): CsvTableResult {
  if (typeof text !== 'string') return refuse(`${file} is not a text file.`, 'Save the table as CSV and load it again.');
  const columns = options.columns;
  const maxRows = Number.isInteger(options.maxRows) && (options.maxRows as number) > 0 ? (options.maxRows as number) : DEFAULT_MAX_ROWS;
  const example = exampleHeader(columns, options.unitSystem);
  // Comments become blank lines (not removed) so every later line keeps its number.
  const lines = text.replace(/^\uFEFF/, '').replace(/\r\n?/g, '\n').split('\n').map((line) => (/^\s*#/.test(line) ? '' : line));
  const filled = lines.filter((line) => line.trim() !== '');
  if (filled.length === 0) {
    const what = text.trim() === '' ? 'is empty' : 'holds only comment lines (starting with #)';
    return refuse(`${file} ${what}: it has no header row and no data.`, `Start with a header row such as ${example}, then one row per line.`);
  }
  const guessed = Papa.parse<string[]>(filled.slice(0, 10).join('\n'), { delimitersToGuess: [',', ';', '\t'], preview: 10 }).meta.delimiter;
  const delimiter = guessed === ';' || guessed === '\t' ? guessed : ',';

  const starts: number[] = [];
  for (let i = 0, at = 0; i < lines.length; at += (lines[i] as string).length + 1, i++) starts.push(at);
  const lineOf = (offset: number): number => {
    let lo = 0;
    let hi = starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if ((starts[mid] as number) <= offset) lo = mid;
      else hi = mid - 1;
    }
    return lo + 1;
  };
  const rows: Row[] = [];
  let tooMany = false;
  let start = 0;
  Papa.parse<string[]>(lines.join('\n'), {
    delimiter,
    newline: '\n',
    quoteChar: '"',
    skipEmptyLines: false,
    step: (result, parser) => {
      const row = lineOf(start);
      start = result.meta.cursor;
      const cells = Array.isArray(result.data) ? result.data.map(String) : [];
      const quoteError = result.errors.some((e) => e.type === 'Quotes');
      if (!quoteError && cells.every((cell) => cell.trim() === '')) return;
      if (rows.length > maxRows) {
        tooMany = true;
        parser.abort();
        return;
      }
      rows.push({ cells, row, quoteError });
    },
  });

  const header = rows[0];
  if (!header) return refuse(`${file} has no header row: every line is blank, a comment or a row of empty cells.`, `Start with a header row such as ${example}, then one row per line.`);
  if (header.quoteError) return refuse(`${file} row ${header.row}: the header has a quote (") that is not closed.`, `Write the header without quotes, e.g. ${example}.`);
  const used: Used[] = [];
  for (let index = 0; index < header.cells.length; index++) {
    const cell = (header.cells[index] as string).trim();
    if (cell === '') continue;
    const found = headerCell(cell, columns, options.unitSystem);
    if ('message' in found) return refuse(`${file} row ${header.row}: ${found.message}`, found.hint);
    const twin = used.find((u) => u.column.name === found.column.name);
    if (twin) {
      return refuse(`${file} row ${header.row}: header cells ${twin.index + 1} ("${twin.text}") and ${index + 1} ("${cell}") both give the ${found.column.label.toLowerCase()}.`, 'Keep one of the two columns, or clear the header cell of the other to have it ignored.');
    }
    used.push({ index, text: cell, ...found });
  }
  const needed = Math.min(2, columns.length);
  const flowColumn = columns.find((c) => c.quantity === 'discharge');
  const names = used.length === 0 ? 'no column' : used.map((u) => `"${u.text}"`).join(', ');
  if (flowColumn && !used.some((u) => u.column.quantity === 'discharge')) {
    return refuse(`${file} row ${header.row}: the header has no ${flowColumn.label.toLowerCase()} column (it names ${names}).`, `Add one, e.g. "${flowColumn.name} (${defaultSymbol(flowColumn, options.unitSystem)})"; a header row looks like ${example}.`);
  }
  if (used.length < needed) return refuse(`${file} row ${header.row}: the header names ${names}; the table needs at least ${needed} columns.`, `Start with a header row such as ${example}.`);
  if (tooMany) return refuse(`${file} has more than ${maxRows} data rows; a table takes at most ${maxRows}.`, 'Keep the rows that span the flows of interest, or thin the table, and load it again.');

  const flow = used.find((u) => u.column.name === flowColumn?.name);
  const values: Record<string, number[]> = Object.fromEntries(used.map((u) => [u.column.name, [] as number[]]));
  const rowNumbers: number[] = [];
  const bad: Bad[] = [];
  let last: { cell: string; value: number; row: number } | undefined;
  for (const row of rows.slice(1)) {
    const parsed = readRow(row, used, header.cells.length, delimiter);
    if ('text' in parsed) {
      bad.push({ row: row.row, ...parsed });
      continue;
    }
    if (flow) {
      const at = used.indexOf(flow);
      const cell = (row.cells[flow.index] as string).trim();
      const value = parsed[at] as number;
      if (last && !(value > last.value)) {
        const unit = unitLabel(flow);
        bad.push({ row: row.row, text: `${flow.column.label.toLowerCase()} ${cell}${unit} does not increase on row ${last.row} (${last.cell}${unit})`, hint: `List the rows in order of increasing ${flow.column.label.toLowerCase()}, each value once.` });
        continue;
      }
      last = { cell, value, row: row.row };
    }
    used.forEach((u, i) => values[u.column.name]?.push(toSI(parsed[i] as number, u.unit)));
    rowNumbers.push(row.row);
  }

  if (bad.length > 0) {
    const shown = bad.slice(0, SHOWN_BAD_ROWS).map((b) => `row ${b.row}: ${b.text}`).join('; ');
    const more = bad.length > SHOWN_BAD_ROWS ? `; …and ${bad.length - SHOWN_BAD_ROWS} more` : '';
    const message = bad.length === 1 ? `${file} row ${(bad[0] as Bad).row}: ${(bad[0] as Bad).text}.` : `${file} has ${bad.length} bad rows: ${shown}${more}.`;
    return refuse(message, (bad[0] as Bad).hint);
  }
  if (rowNumbers.length === 0) return refuse(`${file} has a header (row ${header.row}) but no data rows.`, 'Add one row per line below the header, at least two.');
  if (rowNumbers.length === 1) return refuse(`${file} has only one data row (row ${rowNumbers[0]}); a table needs at least two.`, 'Add at least one more row.');
  return { ok: true, values, rowNumbers, headers: used.map((u) => ({ text: u.text, column: u.column.name, unit: u.unit.symbol })) };
}

/** The numbers of one data row in the header's units, in the order of `used`, or why the row is bad. */
function readRow(row: Row, used: readonly Used[], width: number, delimiter: string): number[] | { text: string; hint: string } {
  if (row.quoteError) return { text: 'a quote (") in the row is not closed, or is followed by more text in its cell', hint: 'Remove the quotes, or put each quoted cell in a pair of quotes with nothing outside them.' };
  if (row.cells.length !== width) {
    const hint = delimiter === ',' ? 'Give every row one cell per header cell. A decimal comma splits a cell in a comma-separated file: write 1.25, or separate the columns with semicolons.' : 'Give every row one cell per header cell.';
    return { text: `the row has ${plural(row.cells.length, 'cell')}, the header has ${width}`, hint };
  }
  const numbers: number[] = [];
  for (const u of used) {
    const cell = (row.cells[u.index] as string).trim();
    if (cell === '') return { text: `column ${u.text} is empty`, hint: 'Fill in the empty cell, or delete the row.' };
    const written = delimiter !== ',' && DECIMAL_COMMA.test(cell) ? cell.replace(',', '.') : cell;
    if (!NUMBER.test(written)) return { text: `"${cell}" in column ${u.text} is not a number`, hint: HINT_NUMBER };
    const value = Number(written);
    if (!Number.isFinite(value)) return { text: `"${cell}" in column ${u.text} is too large to be a measurement`, hint: HINT_NUMBER };
    const what = u.column.label.toLowerCase();
    if (u.column.quantity === 'discharge' && value < 0) return { text: `${what} ${cell}${unitLabel(u)} in column ${u.text} is negative`, hint: `A ${what} is zero or more.` };
    if (u.column.name === 'depth' && !(value > 0)) return { text: `${what} ${cell}${unitLabel(u)} in column ${u.text} is not above zero`, hint: `A ${what} is more than zero; give levels above a datum in a stage column instead.` };
    numbers.push(value);
  }
  return numbers;
}

/** The column and unit a header cell names, or why it names none. */
function headerCell(cell: string, columns: readonly CsvColumn[], system: UnitSystem): { column: CsvColumn; unit: UnitDefinition; unitText: string } | { message: string; hint?: string } {
  const byName = (name: string): CsvColumn | undefined => columns.find((c) => [c.name, c.label, ...(c.aliases ?? [])].some((n) => key(n) === key(name)));
  const withUnit = (column: CsvColumn, name: string, unitText: string): ReturnType<typeof headerCell> => {
    if (unitText === '') return withDefault(column);
    const unit = parseUnit(unitText, column.quantity);
    if (unit.ok) return { column, unit: unit.value, unitText };
    // A level may name its datum after the unit: `stage (m AOD)`, `WL (ft NAVD88)`.
    const datum = /^(\S+)\s+[A-Za-z][\w.-]*$/.exec(unitText);
    const level = datum && column.quantity === 'length' ? parseUnit(datum[1] as string, column.quantity) : null;
    if (level?.ok) return { column, unit: level.value, unitText: datum![1] as string };
    const other = parseUnit(unitText);
    const hint = `Write the unit as one of ${unitChoices(column.quantity)}, e.g. "${name} (${defaultSymbol(column, system)})".`;
    const needs = `the ${column.label.toLowerCase()} column needs a unit of ${column.quantity}`;
    return other.ok
      ? { message: `the header cell "${cell}" gives the unit ${unitText}, which measures ${other.value.quantity}; ${needs}.`, hint }
      : { message: `the header cell "${cell}" gives the unit "${unitText}", which Sequent does not know; ${needs}.`, hint };
  };
  const withDefault = (column: CsvColumn): ReturnType<typeof headerCell> => {
    const unit = displayUnit(column.quantity, system);
    return unit ? { column, unit, unitText: '' } : { message: `the column "${cell}" cannot be read from a CSV file.` };
  };

  const bracketed = /^(.*?)\s*[([]\s*([^()[\]]*?)\s*[)\]]$/.exec(cell);
  if (bracketed) {
    const column = byName(bracketed[1] as string);
    if (column) return withUnit(column, (bracketed[1] as string).trim(), bracketed[2] as string);
  } else {
    const whole = byName(cell);
    if (whole) return withDefault(whole);
    const split = /^(.*?)[\s_]+([^\s_]+)$/.exec(cell);
    const column = split ? byName(split[1] as string) : undefined;
    if (split && column && parseUnit(split[2] as string).ok) return withUnit(column, (split[1] as string).trim(), split[2] as string);
  }
  const accepted = columns.map((c) => {
    const names = [c.name, c.label, ...(c.aliases ?? [])].filter((n, i, all) => all.findIndex((m) => key(m) === key(n)) === i);
    return names.length > 1 ? `${names[0]} (or ${names.slice(1).join(', ')})` : names[0];
  });
  return {
    message: `the header cell "${cell}" is not a column this table takes. It takes ${accepted.join('; ')}.`,
    hint: `Rename the header cell to one of these, with its unit in brackets, e.g. "${columns[0] ? `${columns[0].name} (${defaultSymbol(columns[0], system)})` : 'Q (m3/s)'}"; or clear the header cell to have its column ignored.`,
  };
}

/** ` m3/s`: the unit as the header wrote it, or the display unit it took. */
function unitLabel(u: Used): string {
  const text = u.unitText || u.unit.display || u.unit.symbol;
  return text === '' || text === '-' ? '' : ` ${text}`;
}

function unitChoices(quantity: Quantity): string {
  const symbols = unitsFor(quantity).map((x) => x.symbol);
  return symbols.length > 1 ? `${symbols.slice(0, -1).join(', ')} or ${symbols[symbols.length - 1]}` : (symbols[0] ?? '');
}

function defaultSymbol(column: CsvColumn, system: UnitSystem): string {
  return displayUnit(column.quantity, system)?.symbol ?? '';
}

function exampleHeader(columns: readonly CsvColumn[], system: UnitSystem): string {
  return `"${columns.slice(0, 2).map((c) => `${c.name} (${defaultSymbol(c, system)})`).join(',')}"`;
}
