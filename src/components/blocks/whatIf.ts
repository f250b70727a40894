/**
 * The pure side of the what-if island: which inputs of a block can be changed, and the
 * block text to evaluate with changed values. Works on the block's own source text (opening
 * fence to closing fence) so that every line not changed keeps its exact value and unit.
 * References to other blocks are replaced by the values they had (`block.inputs`, SI), so
 * the block runs on its own.
 */
import type { BlockResult, ShownValue } from '../../lib/calc';
// Deliberate exception to "import from the barrel": the calc barrel also exports the zod
// request schemas (requests.ts), whose module-level z.object() calls no bundler can drop,
// and zod is ~450 kB minified: 3/4 of this island. These three modules need only the solver.
import { evaluateCase } from '../../lib/calc/evaluateCase';
import { NO_FILES, type BlockFiles } from '../../lib/calc/files';
import { extractBlocks } from '../../lib/calc/extractBlocks';
import { parseBlock, parseNumber } from '../../lib/calc/parseBlock';
import { displayUnit, getKindSpec, type KindSpec, type Quantity, type UnitSystem } from '../../lib/solver';

/** One input of the what-if form. */
export interface WhatIfField {
  /** Solver field name (`width`). */
  readonly name: string;
  /** Key as written in the block (`b`). */
  readonly key: string;
  readonly label: string;
  readonly symbol: string;
  readonly latex: string;
  readonly quantity: string;
  /** Line of the assignment, counted from the opening fence (0). */
  readonly offset: number;
  /** The value as shown in the results (block units), without the unit. */
  readonly initial: string;
  /** Display unit (`m³/s`), empty for dimensionless values. */
  readonly unit: string;
  /** SI value the block used. */
  readonly si: number;
  /** True when the block took this value from another block. */
  readonly reference: boolean;
}

/** A line the what-if source must rewrite whatever the form says: a reference, with its value. */
interface Substitution {
  readonly offset: number;
  readonly key: string;
  readonly value: Pick<ShownValue, 'si' | 'quantity'>;
}

/** The form and the fixed substitutions of a block. */
export interface WhatIfPlan {
  readonly fields: readonly WhatIfField[];
  readonly substitutions: readonly Substitution[];
}

const kebab = (name: string) => name.replace(/([a-z0-9])([A-Z])/g, '$1-$2').toLowerCase();

/** The field a key names, by the block language's rule: exact symbol, then name in any case, kebab or snake form. */
function fieldOf(spec: KindSpec, key: string) {
  const bySymbol = spec.inputs.find((f) => f.symbol === key);
  if (bySymbol) return bySymbol;
  const folded = key.toLowerCase().replace(/_/g, '-');
  return spec.inputs.find((f) => f.name.toLowerCase() === folded || kebab(f.name) === folded);
}

/** The what-if plan of `block` written as `source`; no fields for blocks with errors. */
export function whatIfPlan(block: BlockResult, source: string): WhatIfPlan {
  const spec = getKindSpec(block.kind);
  const raw = extractBlocks(typeof source === 'string' ? source : '')[0];
  if (!spec || !raw || block.status !== 'ok') return { fields: [], substitutions: [] };
  const parsed = parseBlock(raw);
  const fields: WhatIfField[] = [];
  const substitutions: Substitution[] = [];
  for (const a of parsed.assignments) {
    const field = fieldOf(spec, a.key);
    const value = field && block.inputs.find((v) => v.name === field.name);
    if (!field || !value) continue;
    const offset = a.line - raw.line;
    const reference = a.value.type === 'reference';
    // A number, or a list of one value written as a number (a basin's `TW = 4.2 m`), is changed like a number.
    const si =
      field.type === 'number' && typeof value.si === 'number' && (a.value.type === 'number' || reference) ? value.si
      : field.type === 'list' && Array.isArray(value.si) && value.si.length === 1 && a.value.type === 'number' ? (value.si[0] as number)
      : undefined;
    if (si !== undefined) {
      fields.push({ name: field.name, key: a.key, label: field.label, symbol: field.symbol, latex: field.latex, quantity: field.quantity, offset, initial: value.text, unit: value.unit, si, reference });
    } else if (reference) {
      substitutions.push({ offset, key: a.key, value });
    }
  }
  return { fields, substitutions };
}

/** An SI value written back as block text with an explicit SI unit: `b = 12 m`, `Q = 20, 40 m3/s`. */
export function siLiteral(value: Pick<ShownValue, 'si' | 'quantity'>): string {
  if (typeof value.si === 'string') return value.si;
  const unit = value.quantity === 'text' ? undefined : displayUnit(value.quantity as Quantity, 'SI');
  const suffix = unit && unit.symbol !== '-' ? ` ${unit.symbol}` : '';
  if (typeof value.si === 'number') return `${value.si}${suffix}`;
  if (Array.isArray(value.si)) return `${value.si.join(', ')}${suffix}`;
  return '';
}

/** The value typed in a what-if field as block text; null when it is not a number (with an optional unit). */
export function typedLiteral(text: string, quantity: string, system: UnitSystem): string | null {
  const n = parseNumber(text.trim());
  if (!n) return null;
  if (n.unit) return `${n.value} ${n.unit}`;
  const unit = quantity === 'text' ? undefined : displayUnit(quantity as Quantity, system);
  return unit && unit.symbol !== '-' ? `${n.value} ${unit.symbol}` : `${n.value}`;
}

/**
 * The block text with `values` (field name → typed text) put in; fields whose text equals
 * their initial value keep their line as written, except references, which are always
 * replaced by their values. Null when a typed value is not a number.
 */
export function whatIfSource(source: string, plan: WhatIfPlan, values: Readonly<Record<string, string>>, system: UnitSystem): string | null {
  const lines = source.split(/\r\n|\r|\n/);
  for (const f of plan.fields) {
    const text = values[f.name] ?? f.initial;
    if (text === f.initial && !f.reference) continue;
    // An unchanged reference keeps the full-precision value it had, not the rounded display.
    const literal = text === f.initial ? siLiteral({ si: f.si, quantity: f.quantity }) : typedLiteral(text, f.quantity, system);
    if (literal === null) return null;
    lines[f.offset] = `${f.key} = ${literal}`;
  }
  for (const s of plan.substitutions) lines[s.offset] = `${s.key} = ${siLiteral(s.value)}`;
  return lines.join('\n');
}

/**
 * Evaluates the block text alone, on the same line numbers as in the case (blank lines are
 * put in front), with the attached files it reads, and keeps the block's index in the case.
 */
export function evaluateWhatIf(block: Pick<BlockResult, 'line' | 'index'>, text: string, files: BlockFiles = NO_FILES): BlockResult | null {
  const result = evaluateCase('\n'.repeat(Math.max(0, block.line - 1)) + text, files).blocks[0];
  return result ? { ...result, index: block.index } : null;
}
