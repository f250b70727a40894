/**
 * Evaluates every calculation block of a case body in dependency order: blocks can refer
 * to other named blocks' outputs (`y1 = toe.y1`) and read attached CSV files
 * (`rating = file "river-rating.csv"`). Cycles and unknown references become
 * line-numbered errors; a broken block never stops the others. Never throws.
 */
import { isSolverKind, KIND_SPECS, solve, SOLVER_VERSION, type KindSpec, type Quantity, type UnitSystem } from '../solver';
import { solverKindOf } from './blockWords';
import { buildResult } from './buildResult';
import { extractBlocks } from './extractBlocks';
import { NO_FILES, readBlockFile, type BlockFiles } from './files';
import { parseBlock } from './parseBlock';
import { closest, resolveInputs, type ReferenceValue } from './resolveInputs';
import type { BlockResult, CaseEvaluation } from './results';
import type { BlockSource, LineIssue } from './syntax';

interface Node {
  source: BlockSource;
  index: number;
  spec: KindSpec | null;
  references: { block: string; line: number }[];
}

function referencesOf(source: BlockSource): Node['references'] {
  return source.assignments.flatMap((a) => (a.value.type === 'reference' ? [{ block: a.value.block, line: a.line }] : []));
}

function failed(node: Node, errors: LineIssue[], unitSystem: UnitSystem = 'SI'): BlockResult {
  const s = node.source;
  return {
    index: node.index,
    word: s.word,
    kind: node.spec?.kind ?? solverKindOf(s.word),
    title: node.spec?.title ?? s.word,
    name: s.name,
    line: s.line,
    endLine: s.endLine,
    unitSystem,
    status: 'error',
    inputs: [],
    outputs: [],
    warnings: [],
    errors: [...errors].sort((a, b) => a.line - b.line),
    methodNote: node.spec?.methodNote ?? '',
    solverVersion: SOLVER_VERSION,
  };
}

/** A column of a block's results table (a tailwater sweep's TW) as a list, one value per row. */
function tableColumn(blockName: string, output: string, result: BlockResult, at: number): ReferenceValue {
  const table = result.table!;
  const column = table.columns[at]!;
  const values = table.rows.map((r) => r[at]);
  const missing = values.flatMap((v, i) => (typeof v === 'number' ? [] : [i + 1]));
  if (column.quantity === 'text') return { ok: false, message: `${blockName}.${output} is a column of labels, not numbers.` };
  if (missing.length) {
    return { ok: false, message: `${blockName}.${output} has no value in row${missing.length > 1 ? 's' : ''} ${missing.slice(0, 8).join(', ')}${missing.length > 8 ? ', …' : ''} of its results, so it cannot be used as a list. Narrow that block's flows to those with a value.` };
  }
  return { ok: true, value: values as number[], quantity: column.quantity as Quantity };
}

/**
 * Evaluates a whole case body; see the module comment. `files` are the revision's attached
 * files that blocks may read (`rating = file "river-rating.csv"`); without them such a
 * block reports that the file is not attached.
 */
export function evaluateCase(markdown: string, files: BlockFiles = NO_FILES): CaseEvaluation {
  const readFile = (name: string) => readBlockFile(files, name);
  const nodes: Node[] = extractBlocks(typeof markdown === 'string' ? markdown : '').map((raw, index) => {
    const source = parseBlock(raw);
    const kind = solverKindOf(source.word);
    return { source, index, spec: isSolverKind(kind) ? KIND_SPECS[kind] : null, references: referencesOf(source) };
  });

  const byName = new Map<string, Node>();
  const duplicateNames = new Map<Node, LineIssue>();
  for (const node of nodes) {
    const name = node.source.name;
    if (name === null) continue;
    const first = byName.get(name);
    if (first) duplicateNames.set(node, { line: node.source.line, message: `Another block is already named "${name}" (line ${first.source.line}).`, hint: 'Give each block its own name' });
    else byName.set(name, node);
  }

  const results = new Map<Node, BlockResult>();
  const visiting = new Set<Node>();

  const evaluate = (node: Node, chain: Node[]): BlockResult => {
    const done = results.get(node);
    if (done) return done;
    const issues: LineIssue[] = [...node.source.issues];
    const duplicate = duplicateNames.get(node);
    if (duplicate) issues.push(duplicate);
    if (!node.spec) {
      issues.push({ line: node.source.line, message: `Unknown calculation "${node.source.word}".` });
      return finish(node, failed(node, issues));
    }
    const spec = node.spec;
    visiting.add(node);
    const lookup = (blockName: string, output: string): ReferenceValue => {
      const target = byName.get(blockName);
      if (!target) {
        const guess = closest(blockName, [...byName.keys()]);
        return {
          ok: false,
          message: byName.size ? `No block is named "${blockName}" in this case. Named blocks: ${[...byName.keys()].join(', ')}.` : `No block is named "${blockName}" in this case.`,
          hint: guess ? `Did you mean ${guess}.${output}?` : `Name a block in its first line, e.g. \`\`\`toe ${blockName}`,
        };
      }
      if (target === node || visiting.has(target)) {
        const loop = [...chain.slice(chain.indexOf(target)), node].map((n) => n.source.name ?? `line ${n.source.line}`);
        return { ok: false, message: `Blocks refer to each other in a circle: ${[...loop, target.source.name].join(' → ')}.`, hint: 'Give one of them a value instead of a reference' };
      }
      const result = evaluate(target, [...chain, node]);
      if (result.status === 'error') return { ok: false, message: `Block "${blockName}" has errors, so ${blockName}.${output} has no value yet.` };
      const names = (v: { name: string; symbol: string }) => v.name === output || v.symbol === output || v.name.toLowerCase() === output.toLowerCase();
      // An output, then an input (as written, so `check.y1` stays the y1 a block was given),
      // then a column of the results table as a list (`check.TW`).
      const found = result.outputs.find(names) ?? result.inputs.find(names);
      const columnAt = found ? -1 : (result.table?.columns.findIndex(names) ?? -1);
      if (columnAt >= 0) return tableColumn(blockName, output, result, columnAt);
      if (!found || found.si === null) {
        const names = [...result.outputs, ...(result.table?.columns ?? [])].map((o) => o.symbol).filter((x, i, all) => all.indexOf(x) === i);
        const guess = closest(output, [...names, ...result.outputs.map((o) => o.name)]);
        return { ok: false, message: `Block "${blockName}" has no result "${output}". Results: ${names.join(', ')}.`, ...(guess ? { hint: `Did you mean ${blockName}.${guess}?` } : {}) };
      }
      return { ok: true, value: found.si, quantity: found.quantity as Quantity };
    };
    const resolved = resolveInputs(spec, node.source.assignments, lookup, readFile);
    visiting.delete(node);
    issues.push(...resolved.issues);
    if (issues.length) return finish(node, failed(node, issues, resolved.unitSystem));

    const solved = solve(spec.kind, resolved.inputs, { unitSystem: resolved.unitSystem });
    const lineFor = (field?: string) => (field !== undefined ? resolved.lineOf[field] : undefined) ?? node.source.line;
    if (!solved.ok) {
      const error = solved.error;
      return finish(node, failed(node, [{ line: lineFor(error.field), message: error.message }], resolved.unitSystem));
    }
    return finish(
      node,
      buildResult({
        spec,
        solved: solved.value,
        warnings: solved.warnings,
        resolved,
        index: node.index,
        word: node.source.word,
        name: node.source.name,
        line: node.source.line,
        endLine: node.source.endLine,
        solverVersion: SOLVER_VERSION,
      }),
    );
  };

  const finish = (node: Node, result: BlockResult): BlockResult => {
    results.set(node, result);
    return result;
  };

  return { blocks: nodes.map((n) => evaluate(n, [])), solverVersion: SOLVER_VERSION };
}
