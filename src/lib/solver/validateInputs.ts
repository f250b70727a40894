/**
 * Spec-driven validation of untrusted `solve()` inputs: unknown names, types, bounds,
 * choices, conditional fields and alternative-input groups, with defaults applied.
 * No exceptions: every problem is a failure naming the field.
 */
import type { InputFieldSpec, InputValue, InputValues, KindSpec, TableValue } from './kindSpec';
import { fail, type SolverFailure, type SolverResult, type Warning } from './result';
import { describeValue } from './validate';

/** Validates `inputs` against `spec`; on success the values hold defaults and only applicable fields. */
export function validateInputs(spec: KindSpec, inputs: unknown): SolverResult<InputValues> {
  if (typeof inputs !== 'object' || inputs === null || Array.isArray(inputs)) {
    return fail('invalid-input', `Inputs of "${spec.kind}" must be an object of named values.`);
  }
  const given = inputs as Record<string, unknown>;
  const byName = new Map(spec.inputs.map((f) => [f.name, f]));
  for (const key of Object.keys(given)) {
    if (!byName.has(key)) {
      return fail('unknown-input', `"${key}" is not an input of ${spec.title}. Inputs: ${spec.inputs.map((f) => f.name).join(', ')}.`, key);
    }
  }
  const out: Record<string, InputValue> = {};
  const warnings: Warning[] = [];
  const applicable = new Set<string>();
  // Choices first: they decide which other fields apply.
  const ordered = [...spec.inputs.filter((f) => f.type === 'choice'), ...spec.inputs.filter((f) => f.type !== 'choice')];
  for (const field of ordered) {
    const raw = Object.prototype.hasOwnProperty.call(given, field.name) ? given[field.name] : undefined;
    const applies = field.when === undefined || field.when.oneOf.includes(out[field.when.field] as string);
    if (!applies) {
      if (raw !== undefined) {
        warnings.push({ code: 'unused-input', message: `${field.label} (${field.name}) is not used when ${field.when?.field} is "${String(out[field.when?.field ?? ''])}"; it was ignored.`, field: field.name });
      }
      continue;
    }
    applicable.add(field.name);
    if (raw === undefined) {
      if (field.default !== undefined) out[field.name] = field.default;
      else if (field.required && field.group === undefined) return fail('missing-input', `${field.label} (${field.name}) is required.`, field.name);
      continue;
    }
    const checked = checkValue(field, raw);
    if (typeof checked === 'object' && checked !== null && 'ok' in checked) return checked as SolverFailure;
    out[field.name] = checked as InputValue;
  }
  for (const spec_ of spec.groups) {
    const group = { ...spec_, options: spec_.options.filter((o) => o.every((n) => applicable.has(n))) };
    const complete = group.options.filter((o) => o.every((n) => out[n] !== undefined));
    const touched = group.options.filter((o) => o.some((n) => out[n] !== undefined));
    // Symbols, as blocks write them: `V1 | Q + b | q`.
    const symbol = (n: string) => spec.inputs.find((f) => f.name === n)?.symbol ?? n;
    const list = group.options.map((o) => o.map(symbol).join(' + ')).join(' | ');
    if (complete.length === 0) {
      const partial = touched[0]?.find((n) => out[n] === undefined);
      if (partial !== undefined) {
        const given = touched[0]!.find((n) => out[n] !== undefined)!;
        const field = spec.inputs.find((f) => f.name === partial);
        return fail('missing-input', `${symbol(given)} needs ${symbol(partial)}${field ? ` (${field.label.toLowerCase()})` : ''} too: ${group.description.charAt(0).toLowerCase()}${group.description.slice(1)} (one of: ${list}).`, given);
      }
      return fail('missing-input', `${group.description} (one of: ${list}).`, group.options[0]?.[0]);
    }
    if (touched.length > 1) {
      const extra = touched.find((o) => o !== complete[0]);
      return fail('conflicting-input', `${group.description} — give only one of: ${list}.`, extra?.find((n) => out[n] !== undefined));
    }
  }
  return { ok: true, value: out, warnings };
}

function checkNumber(field: InputFieldSpec, raw: unknown, where: string): number | SolverFailure {
  if (typeof raw !== 'number' || !Number.isFinite(raw)) {
    return fail('invalid-input', `${where} must be a finite number (got ${describeValue(raw)}).`, field.name);
  }
  if (field.min !== undefined && (field.exclusiveMin ? !(raw > field.min) : !(raw >= field.min))) {
    return fail('invalid-input', `${where} must be ${field.exclusiveMin ? 'greater than' : 'at least'} ${field.min} (got ${raw}).`, field.name);
  }
  if (field.max !== undefined && raw > field.max) {
    return fail('invalid-input', `${where} must be at most ${field.max} (got ${raw}).`, field.name);
  }
  return raw;
}

function checkValue(field: InputFieldSpec, raw: unknown): InputValue | SolverFailure {
  const where = `${field.label} (${field.name})`;
  switch (field.type) {
    case 'number':
      return checkNumber(field, raw, where);
    case 'choice':
      return typeof raw === 'string' && (field.choices ?? []).includes(raw)
        ? raw
        : fail('invalid-input', `${where} must be one of: ${(field.choices ?? []).join(', ')} (got ${describeValue(raw)}).`, field.name);
    case 'list': {
      if (!Array.isArray(raw) || raw.length === 0) return fail('invalid-input', `${where} must be a non-empty list of numbers.`, field.name);
      for (let i = 0; i < raw.length; i++) {
        const n = checkNumber(field, raw[i], `${where}, item ${i + 1},`);
        if (typeof n !== 'number') return n;
      }
      return raw as number[];
    }
    case 'table': {
      if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) {
        return fail('invalid-input', `${where} must be a table with columns ${(field.columns ?? []).map((c) => c.name).join(', ')}.`, field.name);
      }
      const t = raw as Record<string, unknown>;
      const out: Record<string, readonly number[]> = {};
      let length = -1;
      for (const col of field.columns ?? []) {
        const values = t[col.name];
        if (values === undefined && col.optional) continue;
        if (!Array.isArray(values) || (length >= 0 && values.length !== length)) {
          return fail('invalid-input', `${where} needs a column "${col.name}" of the same length as the others.`, field.name);
        }
        length = values.length;
        if (values.some((x) => typeof x !== 'number' || !Number.isFinite(x))) {
          return fail('invalid-input', `${where}: every "${col.name}" cell must be a finite number.`, field.name);
        }
        out[col.name] = values as number[];
      }
      // Where the rows came from travels with them, for row-numbered messages.
      const meta: { source?: string; rowNumbers?: readonly number[] } = {};
      if (typeof t['source'] === 'string') meta.source = t['source'];
      if (Array.isArray(t['rowNumbers']) && t['rowNumbers'].length === length && t['rowNumbers'].every((n) => Number.isInteger(n))) meta.rowNumbers = t['rowNumbers'] as number[];
      return { ...out, ...meta } as TableValue;
    }
  }
}
