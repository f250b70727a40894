/**
 * One calculation from JSON (the API's and the command line's form), through the same
 * reading, unit conversion and formatting as a calculation block, so that a value means
 * the same thing everywhere. Never throws.
 */
import { getKindSpec, solve, SOLVER_VERSION, type UnitSystem } from '../solver';
import { solverKindOf } from './blockWords';
import { readValue } from './parseBlock';
import { resolveInputs } from './resolveInputs';
import type { BlockResult } from './results';
import type { Assignment, NumberLiteral, ValueNode } from './syntax';
import { buildResult } from './buildResult';

/** One input as JSON: an SI number, a value text ("85 m3/s"), {value, unit}, a list, or a table. */
export type JsonInput =
  | number
  | string
  | { value: number; unit: string }
  | ReadonlyArray<number | string>
  | { header: readonly string[]; rows: readonly (readonly number[])[] };

/** A problem with one input, by the key the caller used. */
export interface InputIssue {
  readonly field: string;
  readonly message: string;
  readonly hint?: string;
}

/** The outcome of {@link solveJson}. */
export type JsonSolveResult = { ok: true; result: BlockResult } | { ok: false; issues: InputIssue[] };

function toNode(input: JsonInput): ValueNode | string {
  if (typeof input === 'number') return Number.isFinite(input) ? { type: 'number', value: input, unit: '' } : 'must be a finite number';
  if (typeof input === 'string') {
    const read = readValue(input.trim());
    return read.ok ? read.value : read.message;
  }
  if (Array.isArray(input)) {
    const items: NumberLiteral[] = [];
    for (const item of input as ReadonlyArray<number | string>) {
      const node = toNode(item);
      if (typeof node === 'string') return node;
      if (node.type !== 'number') return 'list items must be numbers, optionally with a unit ("20 m3/s")';
      items.push(node);
    }
    return { type: 'list', items };
  }
  if ('header' in input) {
    return {
      type: 'table',
      header: input.header.map((h) => {
        const [name = '', ...unit] = h.trim().split(/\s+/);
        return { name, unit: unit.join(' '), line: 0 };
      }),
      rows: input.rows.map((cells, i) => ({ cells: [...cells], line: i + 1 })),
    };
  }
  const { value, unit } = input as { value: number; unit: string };
  return Number.isFinite(value) ? { type: 'number', value, unit } : 'value must be a finite number';
}

/**
 * Solves `kind` with JSON inputs keyed by field name or symbol. Numbers without a unit are
 * in the display units of `unitSystem` (SI: m, m³/s, m/s…).
 */
export function solveJson(kind: string, inputs: Readonly<Record<string, JsonInput>>, unitSystem: UnitSystem = 'SI'): JsonSolveResult {
  const spec = getKindSpec(solverKindOf(kind));
  if (!spec) return { ok: false, issues: [{ field: 'kind', message: `Unknown calculation "${kind}".` }] };
  const keys = Object.keys(inputs);
  const issues: InputIssue[] = [];
  const assignments: Assignment[] = [{ key: 'units', value: { type: 'word', value: unitSystem }, line: 1 }];
  keys.forEach((key, i) => {
    const node = toNode(inputs[key]!);
    if (typeof node === 'string') issues.push({ field: key, message: node });
    else assignments.push({ key, value: node, line: i + 2 });
  });
  const resolved = resolveInputs(spec, assignments, (block) => ({ ok: false, message: `References (${block}.…) only work between blocks of a case.` }));
  const keyOfLine = (line: number) => keys[line - 2] ?? 'inputs';
  for (const issue of resolved.issues) issues.push({ field: keyOfLine(issue.line), message: issue.message, ...(issue.hint ? { hint: issue.hint } : {}) });
  if (issues.length) return { ok: false, issues };
  const solved = solve(spec.kind, resolved.inputs, { unitSystem: resolved.unitSystem });
  if (!solved.ok) {
    const line = solved.error.field !== undefined ? resolved.lineOf[solved.error.field] : undefined;
    return { ok: false, issues: [{ field: line ? keyOfLine(line) : solved.error.field ?? 'inputs', message: solved.error.message }] };
  }
  return { ok: true, result: buildResult({ spec, solved: solved.value, warnings: solved.warnings, resolved, index: 0, word: spec.kind, name: null, line: 0, endLine: 0, solverVersion: SOLVER_VERSION }) };
}
