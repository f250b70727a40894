import { describe, expect, it } from 'vitest';
import { formatNumber, formatQuantity } from '@/lib/solver/formatValue';
import { parseUnit } from '@/lib/solver/units';

describe('formatNumber(x, significant)', () => {
  it.each([
    [Number.NaN, '—'],
    [Infinity, '—'],
    [-Infinity, '—'],
    [0, '0'],
    [1e-12, '1.000e-12'],
    [1.23456e12, '1.235e+12'],
    [Math.PI, '3.142'],
    [-Math.PI, '-3.142'],
    [0.0123456, '0.01235'],
    [12345.6, '12350'],
    [9.99961, '10.00'],
    [2, '2.000'],
  ])('formats %f as %s with 4 significant figures', (x, text) => {
    expect(formatNumber(x)).toBe(text);
  });

  it('honours other precisions', () => {
    expect(formatNumber(Math.PI, 3)).toBe('3.14');
    expect(formatNumber(Math.PI, 6)).toBe('3.14159');
  });

  it.each([0, 16, 2.5])('throws RangeError for significant = %f (programmer error)', (s) => {
    expect(() => formatNumber(1, s)).toThrow(RangeError);
  });
});

describe('formatQuantity(valueSI, quantity, target)', () => {
  it('shows a length in SI and US customary', () => {
    expect(formatQuantity(1.5, 'length', 'SI')).toBe('1.500 m');
    expect(formatQuantity(1.5, 'length', 'US')).toBe('4.921 ft');
  });

  it('shows power in kW and hp', () => {
    expect(formatQuantity(745.69987158227, 'power', 'US')).toBe('1.000 hp');
    expect(formatQuantity(122551, 'power', 'SI')).toBe('122.6 kW');
  });

  it('shows discharge in a chosen unit', () => {
    const ls = parseUnit('L/s');
    if (!ls.ok) throw new Error();
    expect(formatQuantity(0.25, 'discharge', ls.value)).toBe('250.0 L/s');
  });

  it('shows dimensionless values without a unit', () => {
    expect(formatQuantity(4.516, 'dimensionless', 'SI')).toBe('4.516');
  });
});
