/**
 * The kind metadata is the contract the block language and UI are generated from: check it
 * is internally consistent, and that every kind has its method note.
 */
import { existsSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { getKindSpec, isSolverKind, KIND_SPECS, QUANTITIES, SOLVER_KINDS } from '@/lib/solver';

describe.each(SOLVER_KINDS)('KIND_SPECS[%s]', (kind) => {
  const spec = KIND_SPECS[kind];
  const names = spec.inputs.map((f) => f.name);

  it('is found by id', () => {
    expect(isSolverKind(kind)).toBe(true);
    expect(getKindSpec(kind)).toBe(spec);
    expect(spec.kind).toBe(kind);
  });

  it('has unique, camelCase input and output names', () => {
    expect(new Set(names).size).toBe(names.length);
    const outs = spec.outputs.map((o) => o.name);
    expect(new Set(outs).size).toBe(outs.length);
    for (const n of [...names, ...outs]) expect(n).toMatch(/^[a-z][A-Za-z0-9]*$/);
  });

  it('uses known quantities and describes every field', () => {
    for (const f of [...spec.inputs, ...spec.outputs, ...(spec.table?.columns ?? [])]) {
      expect(QUANTITIES).toContain(f.quantity);
      expect(f.description.length).toBeGreaterThan(2);
      expect(f.label.length).toBeGreaterThan(0);
    }
  });

  it('refers only to existing choice fields in conditions, with valid values', () => {
    for (const f of spec.inputs) {
      if (f.when === undefined) continue;
      const choice = spec.inputs.find((x) => x.name === f.when?.field);
      expect(choice?.type).toBe('choice');
      for (const v of f.when.oneOf) expect(choice?.choices).toContain(v);
    }
  });

  it('has groups whose members are inputs marked with the group, and not required', () => {
    for (const g of spec.groups) {
      for (const n of g.options.flat()) {
        const f = spec.inputs.find((x) => x.name === n);
        expect(f?.group).toBe(g.id);
        expect(f?.required).toBe(false);
      }
    }
    for (const f of spec.inputs) if (f.group !== undefined) expect(spec.groups.map((g) => g.id)).toContain(f.group);
  });

  it('gives defaults that are valid choices or numbers within bounds', () => {
    for (const f of spec.inputs) {
      if (f.default === undefined) continue;
      if (f.type === 'choice') expect(f.choices).toContain(f.default);
      else {
        expect(typeof f.default).toBe('number');
        if (f.min !== undefined) expect(f.default as number).toBeGreaterThanOrEqual(f.min);
      }
    }
  });

  it('has a method note with the frontmatter kind, title, summary and sources', () => {
    const path = `content/methods/${spec.methodNote}.md`;
    expect(existsSync(path)).toBe(true);
    const text = readFileSync(path, 'utf8');
    expect(text).toMatch(new RegExp(`^---\\n[\\s\\S]*kind: ${kind}\\n[\\s\\S]*---`));
    expect(text).toMatch(/\ntitle: /);
    expect(text).toMatch(/\nsummary: /);
    expect(text).toMatch(/\nsources:\n\s+- /);
    expect(text).toMatch(/licensed engineer/);
  });
});
