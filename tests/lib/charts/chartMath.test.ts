import { describe, expect, it } from 'vitest';
import { axisTicks, axisTitle, blockNumber, blockText, chartUnit, formatShort, niceScale, siNumber } from '@/components/charts/chartMath';
import { JUMP, US_JUMP } from './fixtures';

describe('niceScale', () => {
  it('falls back to [0, 1] for non-finite ends', () => {
    expect(niceScale(Number.NaN, Number.POSITIVE_INFINITY, [0, 100]).domain()).toEqual([0, 1]);
  });

  it('widens an empty domain around its value instead of dividing by zero', () => {
    const [a, b] = niceScale(5, 5, [0, 100]).domain() as [number, number];
    expect(a).toBeLessThan(5);
    expect(b).toBeGreaterThan(5);
    expect(niceScale(0, 0, [0, 100]).domain()).toEqual([0, 1]);
  });

  it('orders reversed ends and nices them to round ticks', () => {
    const s = niceScale(4.118, 0, [250, 14]);
    expect(s.domain()).toEqual([0, 5]);
    expect(s(0)).toBe(250);
    expect(s(5)).toBe(14);
  });
});

describe('axisTicks', () => {
  it('labels ticks with d3 formats and true minus signs', () => {
    const ticks = axisTicks(niceScale(-0.3, 0.2, [0, 100]), 5);
    expect(ticks.map((t) => t.value)).toEqual([-0.3, -0.2, -0.1, 0, 0.1, 0.2]);
    expect(ticks[0]!.label).toBe('−0.3');
    expect(ticks.every((t) => !t.label.includes('-'))).toBe(true);
  });

  it('uses thousands separators for large values', () => {
    expect(axisTicks(niceScale(0, 8000, [0, 100]), 4).map((t) => t.label)).toContain('2,000');
  });
});

describe('units and labels', () => {
  it.each([
    ['length', 'SI', 'm', 1],
    ['length', 'US', 'ft', 0.3048],
    ['volume', 'US', 'ft³', 0.3048 ** 3],
    ['discharge', 'US', 'ft³/s', 0.3048 ** 3],
    ['dimensionless', 'SI', '', 1],
  ] as const)('chartUnit(%s, %s) is %s', (quantity, system, label, factor) => {
    const u = chartUnit(quantity, system);
    expect(u.label).toBe(label);
    expect(u.factor).toBeCloseTo(factor, 12);
  });

  it('puts the unit of an axis in its title, and none for pure numbers', () => {
    expect(axisTitle('Depth y', chartUnit('length', 'US'))).toBe('Depth y (ft)');
    expect(axisTitle('Froude number', chartUnit('dimensionless', 'SI'))).toBe('Froude number');
  });

  it('formats chart numbers to 3 significant figures', () => {
    expect(formatShort(4.117886)).toBe('4.12');
    expect(formatShort(-0.225)).toBe('−0.225');
  });
});

describe('reading block values', () => {
  it('reads SI numbers of outputs, then inputs, and choices as text', () => {
    expect(blockNumber(JUMP, 'y2')).toBeCloseTo(4.1179, 3);
    expect(blockNumber(JUMP, 'width')).toBe(12);
    expect(siNumber(JUMP.outputs, 'jumpType')).toBeUndefined();
    expect(blockText(US_JUMP, 'shape')).toBe('trapezoidal');
    expect(blockNumber(JUMP, 'nothing')).toBeUndefined();
  });
});
