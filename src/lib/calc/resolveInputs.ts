/**
 * Turns a block's assignments into the SI inputs of its solver kind: finds the field each
 * key names (by its name or symbol), converts units, expands ranges, reads tables and
 * looks up references. Every problem becomes a line-numbered message.
 */
import { displayUnit, parseUnit, toSI, type InputFieldSpec, type KindSpec, type Quantity, type UnitSystem } from '../solver';
import { readCsvTable } from './csvTable';
import type { Assignment, LineIssue, NumberLiteral, ValueNode } from './syntax';

/** The most values a list or range may expand to. */
export const MAX_LIST_LENGTH = 2000;

/** A value looked up from another block: an SI number, list or text, with its quantity. */
export type ReferenceValue =
  | { ok: true; value: number | string | readonly number[]; quantity: Quantity }
  | { ok: false; message: string; hint?: string };

/** Looks up `block.output` for a reference. */
export type ReferenceLookup = (block: string, output: string) => ReferenceValue;

/** Reads an attached file a block names (`file "name.csv"`): its text, or why not. */
export type FileLookup = (name: string) => { ok: true; fileName: string; text: string } | { ok: false; message: string; hint?: string };

/** A lookup for a body evaluated without its files. */
export const NO_FILE_LOOKUP: FileLookup = (name) => ({ ok: false, message: `No file named "${name}" is attached to this revision.` });

/** Inputs ready for `solve`, the line that gave each field, and the problems found. */
export interface ResolvedInputs {
  readonly inputs: Record<string, unknown>;
  readonly lineOf: Record<string, number>;
  readonly issues: LineIssue[];
  readonly unitSystem: UnitSystem;
}

const kebab = (name: string) => name.replace(/([a-z0-9])([A-Z])/g, '$1-$2').toLowerCase();

/** Finds the field a key names: exact symbol, then name in any case, kebab or snake form. */
export function findField(spec: KindSpec, key: string): InputFieldSpec | undefined {
  const bySymbol = spec.inputs.find((f) => f.symbol === key);
  if (bySymbol) return bySymbol;
  const folded = key.toLowerCase().replace(/_/g, '-');
  return spec.inputs.find((f) => f.name.toLowerCase() === folded || kebab(f.name) === folded);
}

function levenshtein(a: string, b: string): number {
  const row = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i += 1) {
    let previous = row[0]!;
    row[0] = i;
    for (let j = 1; j <= b.length; j += 1) {
      const current = row[j]!;
      row[j] = Math.min(row[j]! + 1, row[j - 1]! + 1, previous + (a[i - 1] === b[j - 1] ? 0 : 1));
      previous = current;
    }
  }
  return row[b.length]!;
}

/** The closest of `candidates` to `word`, if it is close enough to be a likely typo. */
export function closest(word: string, candidates: readonly string[]): string | undefined {
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const c of candidates) {
    const d = levenshtein(word.toLowerCase(), c.toLowerCase());
    if (d < bestDistance) [best, bestDistance] = [c, d];
  }
  return bestDistance <= Math.max(1, Math.floor(word.length / 3)) ? best : undefined;
}

type Converted = { ok: true; value: unknown } | { ok: false; message: string; hint?: string };

function numberToSI(n: NumberLiteral, field: { quantity: Quantity; label: string }, system: UnitSystem): Converted {
  if (n.unit === '') {
    const unit = displayUnit(field.quantity, system);
    return { ok: true, value: unit ? toSI(n.value, unit) : n.value };
  }
  const unit = parseUnit(n.unit, field.quantity);
  if (!unit.ok) return { ok: false, message: `${field.label}: ${unit.error.message}` };
  return { ok: true, value: toSI(n.value, unit.value) };
}

function expandRange(value: Extract<ValueNode, { type: 'range' }>): number[] | string {
  const { from, to } = value;
  if (value.count !== undefined) {
    if (value.count > MAX_LIST_LENGTH) return `A range may have at most ${MAX_LIST_LENGTH} values.`;
    return Array.from({ length: value.count }, (_, i) => from + ((to - from) * i) / (value.count! - 1));
  }
  const step = value.step!;
  const n = Math.floor(Math.abs(to - from) / step + 1e-9) + 1;
  if (n > MAX_LIST_LENGTH) return `This range would have ${n} values; at most ${MAX_LIST_LENGTH} are allowed. Use a larger step.`;
  const sign = to >= from ? 1 : -1;
  return Array.from({ length: n }, (_, i) => from + sign * step * i);
}

function convert(field: InputFieldSpec, value: ValueNode, system: UnitSystem, lookup: ReferenceLookup, files: FileLookup): Converted {
  if (value.type === 'file') {
    if (field.type !== 'table') return { ok: false, message: `${field.label} is not a table, so it cannot be read from a file; only a table input (such as a tailwater rating) can.` };
    const file = files(value.name);
    if (!file.ok) return file;
    const read = readCsvTable(file.text, { fileName: file.fileName, columns: field.columns ?? [], unitSystem: system });
    if (!read.ok) return read;
    return { ok: true, value: { ...read.values, source: file.fileName, rowNumbers: read.rowNumbers } };
  }
  if (value.type === 'reference') {
    const found = lookup(value.block, value.output);
    if (!found.ok) return found;
    if (field.type === 'list' && typeof found.value === 'number' && found.quantity === field.quantity) return { ok: true, value: [found.value] };
    if (field.type === 'list' && Array.isArray(found.value)) {
      if (found.quantity !== field.quantity) return { ok: false, message: `${value.block}.${value.output} is a list of ${found.quantity} values, but ${field.label} is a ${field.quantity}.` };
      return { ok: true, value: found.value };
    }
    if (field.type === 'choice' && typeof found.value === 'string') return convert(field, { type: 'word', value: found.value }, system, lookup, files);
    if (typeof found.value === 'number' && found.quantity !== field.quantity) {
      return { ok: false, message: `${value.block}.${value.output} is a ${found.quantity}, but ${field.label} is a ${field.quantity}.` };
    }
    return { ok: true, value: found.value };
  }
  switch (field.type) {
    case 'number':
      if (value.type === 'number') return numberToSI(value, field, system);
      return { ok: false, message: `${field.label} takes one number with a unit.`, hint: `${field.symbol} = ${field.default ?? 1} ${displayUnit(field.quantity, system)?.symbol ?? ''}`.trim() };
    case 'choice': {
      if (value.type !== 'word') return { ok: false, message: `${field.label} is one of: ${field.choices?.join(', ')}.` };
      const choice = field.choices?.find((c) => c.toLowerCase() === value.value.toLowerCase());
      if (choice) return { ok: true, value: choice };
      const guess = closest(value.value, field.choices ?? []);
      return {
        ok: false,
        message: `"${value.value}" is not a ${field.label.toLowerCase()}; choose one of: ${field.choices?.join(', ')}.`,
        ...(guess ? { hint: `${field.symbol} = ${guess}` } : {}),
      };
    }
    case 'list': {
      const items = value.type === 'list' ? value.items : value.type === 'number' ? [value] : null;
      if (items) {
        const out: number[] = [];
        for (const item of items) {
          const c = numberToSI(item, field, system);
          if (!c.ok) return c;
          out.push(c.value as number);
        }
        if (out.length > MAX_LIST_LENGTH) return { ok: false, message: `A list may have at most ${MAX_LIST_LENGTH} values.` };
        return { ok: true, value: out };
      }
      if (value.type === 'range') {
        const expanded = expandRange(value);
        if (typeof expanded === 'string') return { ok: false, message: expanded };
        const unit = numberToSI({ type: 'number', value: 1, unit: value.unit }, field, system);
        if (!unit.ok) return unit;
        return { ok: true, value: expanded.map((x) => x * (unit.value as number)) };
      }
      return { ok: false, message: `${field.label} takes a list (10, 20, 30 m3/s) or a range (10 to 90 m3/s step 10).` };
    }
    case 'table': {
      if (value.type !== 'table') return { ok: false, message: `${field.label} is a table: write "${field.symbol}:" and rows of ${field.columns?.map((c) => c.label).join(' | ')} under it.` };
      const columns = field.columns ?? [];
      const out: Record<string, number[]> = {};
      for (const [index, head] of value.header.entries()) {
        // A header names its column by name or label, or is matched by the quantity of its unit.
        const byName = columns.find((c) => [c.name, c.label, ...(c.aliases ?? [])].some((n) => n.toLowerCase() === head.name.toLowerCase()));
        const unit = head.unit ? parseUnit(head.unit) : null;
        if (unit && !unit.ok) return { ok: false, message: `Column ${head.name}: ${unit.error.message}` };
        const column = byName ?? (unit?.ok ? columns.find((c) => c.quantity === unit.value.quantity) : undefined);
        if (!column) return { ok: false, message: `Column "${head.name}" is not one of ${columns.map((c) => `${c.label} (${c.quantity})`).join(', ')}.`, hint: 'Give each column a unit, e.g. Q m3/s | TW m' };
        const factor = unit?.ok ? (unit.value.quantity === column.quantity ? unit.value.factor : NaN) : (displayUnit(column.quantity, system)?.factor ?? 1);
        if (Number.isNaN(factor)) return { ok: false, message: `Column ${head.name} is in ${head.unit}, but ${column.label} is a ${column.quantity}.` };
        out[column.name] = value.rows.map((r) => r.cells[index]! * factor);
      }
      return { ok: true, value: out };
    }
  }
}

/**
 * Resolves the assignments of one block against its kind. `units = SI|US` sets the block's
 * unit system: numbers written without a unit are in its display units, and so are results.
 */
export function resolveInputs(spec: KindSpec, assignments: readonly Assignment[], lookup: ReferenceLookup, files: FileLookup = NO_FILE_LOOKUP): ResolvedInputs {
  const issues: LineIssue[] = [];
  const inputs: Record<string, unknown> = {};
  const lineOf: Record<string, number> = {};
  let unitSystem: UnitSystem = 'SI';
  const unitsLine = assignments.find((a) => a.key.toLowerCase() === 'units');
  if (unitsLine) {
    const v = unitsLine.value;
    const word = v.type === 'word' ? v.value.toUpperCase() : '';
    if (word === 'SI' || word === 'US') unitSystem = word;
    else issues.push({ line: unitsLine.line, message: 'units is SI or US.', hint: 'units = US' });
  }
  for (const a of assignments) {
    if (a === unitsLine) continue;
    const field = findField(spec, a.key);
    if (!field) {
      const names = spec.inputs.map((f) => f.symbol);
      const guess = closest(a.key, [...names, ...spec.inputs.map((f) => f.name)]);
      issues.push({
        line: a.line,
        message: `A ${spec.title.toLowerCase()} block has no input "${a.key}". Inputs: ${names.join(', ')}.`,
        ...(guess ? { hint: `Did you mean ${guess}?` } : {}),
      });
      continue;
    }
    if (lineOf[field.name] !== undefined) {
      issues.push({ line: a.line, message: `${field.label} is already given on line ${lineOf[field.name]}.` });
      continue;
    }
    lineOf[field.name] = a.line;
    const converted = convert(field, a.value, unitSystem, lookup, files);
    if (converted.ok) inputs[field.name] = converted.value;
    else issues.push({ line: a.line, message: converted.message, ...(converted.hint ? { hint: converted.hint } : {}) });
  }
  return { inputs, lineOf, issues, unitSystem };
}
