import { createElement as h } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { blockHead } from '@/components/blocks/BlockResults';
import { WhatIfBlock } from '@/components/blocks/WhatIfBlock';
import { evaluateWhatIf, siLiteral, typedLiteral, whatIfPlan, whatIfSource } from '@/components/blocks/whatIf';
import { BROKEN, JUMP, sourceOf, TAILWATER, US_JUMP } from './fixtures';

describe('whatIfPlan', () => {
  it('offers the numeric inputs of a block, references included, with their shown values and units', () => {
    const plan = whatIfPlan(JUMP, sourceOf(JUMP));
    expect(plan.fields.map((f) => [f.key, f.initial, f.unit, f.reference, f.offset])).toEqual([
      ['b', '12.00', 'm', true, 1],
      ['Q', '85.00', 'm³/s', false, 2],
      ['y1', '0.5342', 'm', true, 3],
    ]);
  });

  it('leaves lists, ranges, choices and tables out of the form', () => {
    expect(whatIfPlan(TAILWATER, sourceOf(TAILWATER)).fields.map((f) => f.key)).toEqual(['b', 'H']);
    expect(whatIfPlan(US_JUMP, sourceOf(US_JUMP)).fields.map((f) => f.key)).toEqual(['b', 'z', 'Q', 'y1']);
  });

  it('has nothing to offer for a block with errors or a source that is not a block', () => {
    expect(whatIfPlan(BROKEN, sourceOf(BROKEN)).fields).toEqual([]);
    expect(whatIfPlan(JUMP, 'not a block').fields).toEqual([]);
  });
});

describe('whatIfSource', () => {
  const plan = whatIfPlan(JUMP, sourceOf(JUMP));

  it('replaces references by the values they had, at full precision, so the block runs alone', () => {
    const text = whatIfSource(sourceOf(JUMP), plan, {}, 'SI')!;
    expect(text.split('\n')).toEqual(['```jump basin', 'b = 12 m', 'Q = 85 m3/s', `y1 = ${JUMP.inputs[2]!.si} m`, '```']);
    expect(evaluateWhatIf(JUMP, text)!.outputs.find((o) => o.name === 'y2')!.si).toBeCloseTo(JUMP.outputs.find((o) => o.name === 'y2')!.si as number, 9);
  });

  it('writes a changed value in the unit shown, or the unit typed', () => {
    expect(whatIfSource(sourceOf(JUMP), plan, { discharge: '100' }, 'SI')!.split('\n')[2]).toBe('Q = 100 m3/s');
    expect(whatIfSource(sourceOf(JUMP), plan, { discharge: '3000 cfs' }, 'SI')!.split('\n')[2]).toBe('Q = 3000 cfs');
  });

  it('is null while a typed value is not a number', () => {
    expect(whatIfSource(sourceOf(JUMP), plan, { discharge: 'lots' }, 'SI')).toBeNull();
  });

  it('keeps US blocks in their units', () => {
    const us = whatIfPlan(US_JUMP, sourceOf(US_JUMP));
    const text = whatIfSource(sourceOf(US_JUMP), us, { discharge: '1500' }, 'US')!;
    expect(text).toContain('Q = 1500 cfs');
    expect(text).toContain('units = US');
    expect(evaluateWhatIf(US_JUMP, text)!.outputs[0]!.text).toBe('1500');
  });
});

describe('evaluateWhatIf', () => {
  it('reports errors on the lines of the case and keeps the block index', () => {
    const plan = whatIfPlan(JUMP, sourceOf(JUMP));
    const result = evaluateWhatIf(JUMP, whatIfSource(sourceOf(JUMP), plan, { y1: '9' }, 'SI')!)!;
    expect(result.index).toBe(JUMP.index);
    expect(result.line).toBe(JUMP.line);
    expect(result.status).toBe('error');
    expect(result.errors[0]!.line).toBeGreaterThanOrEqual(JUMP.line);
    expect(result.errors[0]!.line).toBeLessThanOrEqual(JUMP.endLine);
  });

  it('gives a larger sequent depth for a larger discharge', () => {
    const plan = whatIfPlan(JUMP, sourceOf(JUMP));
    const more = evaluateWhatIf(JUMP, whatIfSource(sourceOf(JUMP), plan, { discharge: '120' }, 'SI')!)!;
    const y2 = (b: typeof JUMP) => b.outputs.find((o) => o.name === 'y2')!.si as number;
    expect(y2(more)).toBeGreaterThan(y2(JUMP));
  });
});

describe('literals', () => {
  it.each([
    [{ si: 12, quantity: 'length' }, '12 m'],
    [{ si: [20, 40], quantity: 'discharge' }, '20, 40 m3/s'],
    [{ si: 2, quantity: 'dimensionless' }, '2'],
    [{ si: 'trapezoidal', quantity: 'text' }, 'trapezoidal'],
  ] as const)('siLiteral(%j) = %j', (value, text) => expect(siLiteral(value)).toBe(text));

  it('reads typed values with or without a unit', () => {
    expect(typedLiteral(' 1.2e3 ', 'discharge', 'US')).toBe('1200 cfs');
    expect(typedLiteral('12 ft', 'length', 'SI')).toBe('12 ft');
    expect(typedLiteral('', 'length', 'SI')).toBeNull();
    expect(typedLiteral('12,5', 'length', 'SI')).toBeNull();
  });
});

describe('WhatIfBlock (server render)', () => {
  const props = (block: typeof JUMP) => ({ head: blockHead(block), headingId: 'h1', plan: whatIfPlan(block, sourceOf(block)), source: sourceOf(block) });

  it('draws only the header with a What if… button until opened: no live body, badge or form', () => {
    const html = renderToStaticMarkup(h(WhatIfBlock, props(JUMP)));
    expect(html).toMatch(/^<header /);
    expect(html).toContain('id="h1"');
    expect(html).toContain(JUMP.title);
    expect(html).toContain('What if…');
    expect(html).toContain('aria-expanded="false"');
    expect(html).not.toContain('data-what-if-live');
    expect(html).not.toContain('Not saved');
    expect(html).not.toContain('<form');
    // The saved results and charts are the page's static body, not the island's.
    expect(html).not.toContain('<svg ');
  });

  it('offers no button when the plan has no fields', () => {
    const html = renderToStaticMarkup(h(WhatIfBlock, props(BROKEN)));
    expect(html).not.toContain('What if…');
  });
});

describe('what-if of a single-flow basin screening', () => {
  const source = ['```basin pick', 'y1 = 0.5 m', 'V1 = 14 m/s', 'TW = 4.6 m', '```'].join('\n');
  const block = evaluateWhatIf({ line: 1, index: 0 }, source)!;

  it('offers the one-value lists (y1, V1, TW) as numbers', () => {
    expect(whatIfPlan(block, source).fields.map((f) => [f.key, f.initial, f.unit])).toEqual([
      ['y1', '0.5000', 'm'],
      ['V1', '14.00', 'm/s'],
      ['TW', '4.600', 'm'],
    ]);
  });

  it('a lower tailwater sweeps the jump out of the basin', () => {
    const text = whatIfSource(source, whatIfPlan(block, source), { tailwater: '3.9' }, 'SI')!;
    expect(text.split('\n')[3]).toBe('TW = 3.9 m');
    expect(evaluateWhatIf(block, text)!.warnings.map((w) => w.code)).toContain('tailwater-too-low');
  });
});
