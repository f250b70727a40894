/**
 * Turns a solver answer into the display form of a block result: values in the block's
 * unit system with sensible significant figures, warnings on the lines they concern.
 */
import {
  displayUnit,
  formatNumber,
  type KindSpec,
  type OutputFieldSpec,
  type Quantity,
  type SolveOutput,
  type UnitSystem,
  type Warning,
} from '../solver';
import type { ResolvedInputs } from './resolveInputs';
import type { BlockResult, BlockWarning, InputTable, ShownColumn, ShownValue } from './results';

function unitText(quantity: string, system: UnitSystem): { factor: number; unit: string } {
  const unit = quantity === 'text' ? undefined : displayUnit(quantity as Quantity, system);
  if (!unit || unit.symbol === '-') return { factor: 1, unit: '' };
  return { factor: unit.factor, unit: unit.display };
}

/** A value in display form. */
export function show(
  field: { name: string; label: string; symbol: string; latex: string; quantity: string },
  si: ShownValue['si'],
  system: UnitSystem,
): ShownValue {
  const { factor, unit } = unitText(field.quantity, system);
  let text: string;
  if (si === null || si === undefined) text = '—';
  else if (typeof si === 'string') text = si;
  // Counts (`sweptOutCount`) read as whole numbers, not 5.000.
  else if (typeof si === 'number') text = /Count$/.test(field.name) && Number.isInteger(si) ? String(si) : formatNumber(si / factor);
  else text = si.map((x) => formatNumber(x / factor)).join(', ');
  return { name: field.name, label: field.label, symbol: field.symbol, latex: field.latex, quantity: field.quantity, si, text, unit: typeof si === 'string' ? '' : unit };
}

function column(c: OutputFieldSpec, system: UnitSystem): ShownColumn {
  return { name: c.name, label: c.label, symbol: c.symbol, latex: c.latex, quantity: c.quantity, unit: unitText(c.quantity, system).unit };
}

/** Everything a successful block result is built from. */
export interface ResultParts {
  spec: KindSpec;
  solved: SolveOutput;
  warnings: readonly Warning[];
  resolved: ResolvedInputs;
  index: number;
  word: string;
  name: string | null;
  line: number;
  endLine: number;
  solverVersion: string;
}

/** The result of a block (or a JSON request) that solved. */
export function buildResult(p: ResultParts): BlockResult {
  const { spec, solved, resolved } = p;
  const system = resolved.unitSystem;
  const inputs: ShownValue[] = [];
  const tables: InputTable[] = [];
  for (const f of spec.inputs) {
    const given = resolved.inputs[f.name];
    if (given === undefined) continue;
    if (f.type !== 'table') {
      inputs.push(show(f, given as ShownValue['si'], system));
      continue;
    }
    const t = given as Record<string, unknown>;
    const columns: Record<string, readonly number[]> = {};
    for (const c of f.columns ?? []) if (Array.isArray(t[c.name])) columns[c.name] = t[c.name] as number[];
    const source = typeof t['source'] === 'string' ? t['source'] : null;
    const rowNumbers = Array.isArray(t['rowNumbers']) ? (t['rowNumbers'] as number[]) : undefined;
    tables.push({ name: f.name, label: f.label, source, ...(rowNumbers ? { rowNumbers } : {}), columns });
    if (source !== null) {
      const rows = Object.values(columns)[0]?.length ?? 0;
      inputs.push(show({ ...f, quantity: 'text' }, `file ${source}, ${rows} rows`, system));
    }
  }
  const outputs = spec.outputs.flatMap((o) => {
    const si = solved.values[o.name] ?? null;
    return o.omitWhenNull && si === null ? [] : [show(o, si, system)];
  });
  const warnings: BlockWarning[] = p.warnings.map((w) => {
    const line = w.field !== undefined ? resolved.lineOf[w.field] : undefined;
    return line === undefined ? { code: w.code, message: w.message } : { code: w.code, message: w.message, line };
  });
  let table: BlockResult['table'];
  if (spec.table && solved.rows) {
    const specColumns = spec.table.columns;
    const rows = solved.rows.map((r) => specColumns.map((c) => r[c.name] ?? null));
    table = {
      columns: specColumns.map((c) => column(c, system)),
      rows,
      text: rows.map((r) => r.map((cell, k) => show(specColumns[k]!, cell, system).text)),
    };
  }
  return {
    index: p.index,
    word: p.word,
    kind: spec.kind,
    title: spec.title,
    name: p.name,
    line: p.line,
    endLine: p.endLine,
    unitSystem: system,
    status: 'ok',
    inputs,
    outputs,
    ...(table ? { table } : {}),
    ...(tables.length ? { tables } : {}),
    warnings,
    errors: [],
    methodNote: spec.methodNote,
    ...(spec.caution ? { caution: spec.caution } : {}),
    solverVersion: p.solverVersion,
  };
}
