import { describe, expect, it } from 'vitest';
import { displayNumber, symbolParts } from '@/components/blocks/typeset';

describe('symbolParts', () => {
  it.each([
    ['y_2', [{ type: 'var', text: 'y' }, { type: 'sub', parts: [{ type: 'text', text: '2' }] }]],
    ['\\mathrm{Fr}_1', [{ type: 'text', text: 'Fr' }, { type: 'sub', parts: [{ type: 'text', text: '1' }] }]],
    ['Q_{crit}', [{ type: 'var', text: 'Q' }, { type: 'sub', parts: [{ type: 'var', text: 'crit' }] }]],
    ['\\Delta E', [{ type: 'text', text: 'Δ' }, { type: 'var', text: 'E' }]],
    ['\\rho', [{ type: 'var', text: 'ρ' }]],
    ['TW - y_2', [{ type: 'var', text: 'TW' }, { type: 'text', text: ' − ' }, { type: 'var', text: 'y' }, { type: 'sub', parts: [{ type: 'text', text: '2' }] }]],
  ])('reads %s', (latex, parts) => {
    expect(symbolParts(latex)).toEqual(parts);
  });

  it.each(['', '\\frac{a}{b}', 'y_', 'x}', '{x', '\\text{unclosed'])('gives up on %j (the plain symbol is shown)', (latex) => {
    expect(symbolParts(latex)).toBeNull();
  });
});

describe('displayNumber', () => {
  it.each([
    ['-0.2250', '−0.2250'],
    ['4.118', '4.118'],
    ['1.235e+8', '1.235 × 10⁸'],
    ['-2.500e-4', '−2.500 × 10⁻⁴'],
    ['steady', 'steady'],
    ['—', '—'],
  ])('displayNumber(%j) = %j', (text, shown) => expect(displayNumber(text)).toBe(shown));
});
