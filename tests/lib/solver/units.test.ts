/**
 * Unit table against the exact definitions of NIST SP 811 (Thompson and Taylor, 2008,
 * Guide for the Use of the International System of Units, App. B.8/B.9).
 */
import { describe, expect, it } from 'vitest';
import { QUANTITIES } from '@/lib/solver/quantity';
import { displayUnit, fromSI, parseUnit, toSI, UNITS, UNIT_SYSTEMS, unitsFor } from '@/lib/solver/units';

function factor(text: string): number {
  const r = parseUnit(text);
  if (!r.ok) throw new Error(r.error.message);
  return r.value.factor;
}

describe('parseUnit(text, quantity?)', () => {
  it('throws RangeError for a non-string (programmer error)', () => {
    expect(() => parseUnit(3 as unknown as string)).toThrow(RangeError);
  });

  it.each(['', '   '])('treats %j as dimensionless', (text) => {
    const r = parseUnit(text);
    expect(r.ok && r.value.quantity).toBe('dimensionless');
  });

  it.each(['furlong', 'm4/s', 'NaN', 'm3/s/s/s'])('rejects unknown unit %j', (text) => {
    const r = parseUnit(text);
    expect(r.ok).toBe(false);
    expect(!r.ok && r.error.code).toBe('unknown-unit');
  });

  it('rejects a unit of the wrong quantity, saying which it is', () => {
    const r = parseUnit('ft', 'discharge');
    expect(!r.ok && r.error.code).toBe('unit-mismatch');
    expect(!r.ok && r.error.message).toMatch(/length/);
  });

  it('is case-sensitive for power prefixes: mW is not MW', () => {
    expect(parseUnit('mW').ok).toBe(false);
    expect(factor('MW')).toBe(1e6);
    expect(factor('kW')).toBe(1e3);
  });

  it('accepts other units case-insensitively', () => {
    expect(factor('CFS')).toBe(factor('cfs'));
    expect(factor('Ft')).toBe(0.3048);
  });

  describe.each([
    // [spelling, exact SI factor] — NIST SP 811 App. B.
    ['m', 1],
    ['mm', 0.001],
    ['cm', 0.01],
    ['ft', 0.3048],
    ['feet', 0.3048],
    ['in', 0.0254],
    ['m3/s', 1],
    ['m³/s', 1],
    ['m^3/s', 1],
    ['cumec', 1],
    ['L/s', 0.001],
    ['l/s', 0.001],
    ['cfs', 0.028316846592],
    ['ft3/s', 0.028316846592],
    ['ft³/s', 0.028316846592],
    ['ft3/sec', 0.028316846592],
    ['m2/s', 1],
    ['m²/s', 1],
    ['ft2/s', 0.09290304],
    ['ft/s', 0.3048],
    ['W', 1],
    ['hp', 745.69987158227],
    ['m/s2', 1],
    ['ft/s²', 0.3048],
    ['kg/m3', 1],
    ['lb/ft3', 16.018463373960138],
    ['%', 0.01],
    ['m/m', 1],
  ])('%j', (text, expected) => {
    it(`converts to SI by ${expected}`, () => {
      expect(factor(text)).toBeCloseTo(expected, 12);
      expect(factor(text) / expected).toBeCloseTo(1, 13);
    });
  });
});

describe('toSI / fromSI', () => {
  it.each(UNITS.map((x) => [x.symbol, x] as const))('round-trips through %s', (_, unit) => {
    expect(fromSI(toSI(123.456, unit), unit)).toBeCloseTo(123.456, 10);
  });

  it('1 cfs = 0.3048³ m³/s exactly (NIST SP 811)', () => {
    const cfs = parseUnit('cfs');
    expect(cfs.ok && toSI(1000, cfs.value)).toBeCloseTo(28.316846592, 10);
  });
});

describe('displayUnit(quantity, system)', () => {
  it.each(UNIT_SYSTEMS.flatMap((s) => QUANTITIES.filter((q) => q !== 'text').map((q) => [s, q] as const)))(
    'has a %s display unit for %s that measures it',
    (system, quantity) => {
      const unit = displayUnit(quantity, system);
      expect(unit?.quantity).toBe(quantity);
    },
  );

  it('has no unit for text', () => {
    expect(displayUnit('text', 'SI')).toBeUndefined();
  });

  it('lists the units of a quantity', () => {
    expect(unitsFor('power').map((x) => x.symbol)).toEqual(['W', 'kW', 'MW', 'hp']);
  });
});
