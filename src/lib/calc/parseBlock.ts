/**
 * Reads the body of one calculation block into assignments, with a line-numbered message
 * for every line it cannot read. Never throws.
 */
import type { RawBlock } from './extractBlocks';
import type { Assignment, BlockSource, LineIssue, ListLiteral, NumberLiteral, TableLiteral, ValueNode } from './syntax';

const NUMBER = String.raw`[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?`;
const NUMBER_WITH_UNIT = new RegExp(String.raw`^(${NUMBER})\s*([^\s\d.,+\-][^\s,]*)?$`);
const RANGE = new RegExp(String.raw`^(${NUMBER})\s+to\s+(${NUMBER})\s*([^\s\d.,+\-][^\s,]*)?\s+(step|count)\s+(${NUMBER})$`, 'i');
const REFERENCE = /^([A-Za-z][\w-]*)\.([A-Za-z][\w/]*)$/;
const WORD = /^[A-Za-z][\w-]*$/;
/** `file "name with spaces.csv"` or `file name.csv`. */
const FILE = /^file\s+(?:"([^"]*)"|([^\s"]+))$/i;
const KEY = /^[A-Za-z][\w-]*$/;
const NAME = /^[a-z][a-z0-9_-]*$/i;
const THOUSANDS = /^\d{1,3}(,\d{3})+(\.\d+)?(\s|$)/;

/** Parses a `number unit` text; null when it is not one. */
export function parseNumber(text: string): NumberLiteral | null {
  const m = NUMBER_WITH_UNIT.exec(text.trim());
  if (!m) return null;
  const value = Number(m[1]);
  if (!Number.isFinite(value)) return null;
  return { type: 'number', value, unit: m[2] ?? '' };
}

/** The outcome of reading one value. */
export type Read = { ok: true; value: ValueNode } | { ok: false; message: string; hint?: string };

/** Reads the text right of `=`: a number with unit, list, range, reference, attached file or word. */
export function readValue(text: string): Read {
  if (text === '') return { ok: false, message: 'The value is missing after "=".', hint: 'Write for example b = 12 m' };
  if (THOUSANDS.test(text)) {
    const plain = text.replace(/,(?=\d{3})/g, '');
    return { ok: false, message: 'Commas separate list items, so thousands cannot be written with commas.', hint: `Write ${plain}` };
  }
  const file = FILE.exec(text);
  if (file) {
    const name = (file[1] ?? file[2] ?? '').trim();
    if (!name) return { ok: false, message: 'Name the attached file in quotes after "file".', hint: 'rating = file "river-rating.csv"' };
    return { ok: true, value: { type: 'file', name } };
  }
  const reference = REFERENCE.exec(text);
  if (reference) return { ok: true, value: { type: 'reference', block: reference[1]!, output: reference[2]! } };
  const range = RANGE.exec(text);
  if (range) {
    const [from, to, by] = [Number(range[1]), Number(range[2]), Number(range[5])];
    const unit = range[3] ?? '';
    if (range[4]!.toLowerCase() === 'count') {
      if (!Number.isInteger(by) || by < 2) return { ok: false, message: 'A range needs a whole count of at least 2 values.', hint: `${from} to ${to} ${unit} count 10`.replace(/\s+/g, ' ') };
      return { ok: true, value: { type: 'range', from, to, unit, count: by } };
    }
    if (!(by > 0)) return { ok: false, message: 'The step of a range must be a positive number.' };
    return { ok: true, value: { type: 'range', from, to, unit, step: by } };
  }
  if (text.includes(',')) {
    const parts = text.split(',').map((p) => p.trim());
    const items: NumberLiteral[] = [];
    for (const [index, part] of parts.entries()) {
      const n = parseNumber(part);
      if (!n) return { ok: false, message: `Item ${index + 1} of the list, "${part}", is not a number with an optional unit.` };
      items.push(n);
    }
    // A unit written once, on the last item, applies to the items written without one.
    const trailing = items[items.length - 1]!.unit;
    const list: ListLiteral = { type: 'list', items: items.map((n) => (n.unit || !trailing ? n : { ...n, unit: trailing })) };
    return { ok: true, value: list };
  }
  const number = parseNumber(text);
  if (number) return { ok: true, value: number };
  if (WORD.test(text)) return { ok: true, value: { type: 'word', value: text } };
  if (/^\d/.test(text) && /\s\S+\s/.test(text)) {
    return { ok: false, message: `"${text}" is not one number with a unit.`, hint: 'Separate list items with commas: 10, 20, 30 m3/s' };
  }
  return { ok: false, message: `"${text}" is not a value Sequent can read.`, hint: 'Write a number with a unit (12 m), a list (10, 20 m3/s), a range (10 to 90 m3/s step 10), a word (trapezoidal) or another block\'s output (toe.y1)' };
}

function readTable(
  lines: RawBlock['lines'],
  start: number,
  issues: LineIssue[],
): { table: TableLiteral; next: number } {
  const header: { name: string; unit: string; line: number }[] = [];
  const rows: { cells: number[]; line: number }[] = [];
  let i = start;
  for (; i < lines.length; i += 1) {
    const { text, line } = lines[i]!;
    const content = text.replace(/#.*$/, '').trim();
    if (content === '') continue;
    if (!content.includes('|')) break;
    const cells = content.replace(/^\||\|$/g, '').split('|').map((c) => c.trim());
    if (header.length === 0) {
      for (const cell of cells) {
        const [name = '', ...unit] = cell.split(/\s+/);
        header.push({ name, unit: unit.join(' '), line });
      }
      continue;
    }
    if (cells.length !== header.length) {
      issues.push({ line, message: `This row has ${cells.length} cells but the header has ${header.length}.` });
      continue;
    }
    const values = cells.map(Number);
    const bad = cells.findIndex((c, k) => c === '' || !Number.isFinite(values[k]));
    if (bad >= 0) {
      issues.push({ line, message: `"${cells[bad]}" in column ${header[bad]!.name} is not a number.` });
      continue;
    }
    rows.push({ cells: values, line });
  }
  return { table: { type: 'table', header, rows }, next: i };
}

/** Parses a raw block into its name, assignments and line issues. */
export function parseBlock(raw: RawBlock): BlockSource {
  const issues: LineIssue[] = [];
  const assignments: Assignment[] = [];
  const [name = null, ...extra] = raw.rest ? raw.rest.split(/\s+/) : [];
  if (name !== null && !NAME.test(name)) {
    issues.push({
      line: raw.line,
      message: `"${name}" cannot be a block name: use letters, digits, - and _, starting with a letter.`,
      hint: `\`\`\`${raw.word} ${name.replace(/[^a-z0-9_-]/gi, '-').replace(/^[^a-z]+/i, '') || 'basin'}`,
    });
  }
  if (extra.length) issues.push({ line: raw.line, message: `Only a block name may follow "${raw.word}"; "${extra.join(' ')}" is extra.` });
  if (!raw.closed) issues.push({ line: raw.line, message: 'This block is never closed.', hint: 'End it with a line of ``` (three backticks)' });

  const seen = new Map<string, number>();
  const lines = raw.lines;
  for (let i = 0; i < lines.length; i += 1) {
    const { text, line } = lines[i]!;
    const content = text.replace(/#.*$/, '').trim();
    if (content === '') continue;
    const tableStart = /^([A-Za-z][\w-]*)\s*:$/.exec(content);
    const eq = content.indexOf('=');
    if (!tableStart && eq < 0) {
      issues.push({ line, message: `Cannot read "${content}": each line is name = value.`, hint: 'For example: Q = 85 m3/s' });
      continue;
    }
    const key = tableStart ? tableStart[1]! : content.slice(0, eq).trim();
    if (!KEY.test(key)) {
      issues.push({ line, message: `"${key}" is not a name: use letters, digits, - and _, starting with a letter.` });
      continue;
    }
    const earlier = seen.get(key);
    if (earlier !== undefined) {
      issues.push({ line, message: `${key} is already given on line ${earlier}.`, hint: 'Keep one of the two lines' });
      continue;
    }
    seen.set(key, line);
    if (tableStart) {
      const { table, next } = readTable(lines, i + 1, issues);
      if (table.header.length === 0) issues.push({ line, message: `The table ${key} has no rows.`, hint: 'Put rows like  Q m3/s | TW m  under it' });
      else assignments.push({ key, value: table, line });
      i = next - 1;
      continue;
    }
    const read = readValue(content.slice(eq + 1).trim());
    if (read.ok) assignments.push({ key, value: read.value, line });
    else issues.push({ line, message: read.message, ...(read.hint ? { hint: read.hint } : {}) });
  }
  return {
    word: raw.word,
    name,
    line: raw.line,
    endLine: raw.endLine,
    body: raw.lines.map((l) => l.text).join('\n'),
    assignments,
    issues,
  };
}
