/**
 * Critical depth and the open-channel functions. Sources per check:
 * - Closed forms yc = (q²/g)^(1/3) (rectangle) and (2Q²/(g z²))^(1/5) (triangle), and
 *   E_min = 1.5·yc in a rectangle: Chow, V. T., 1959, Open-Channel Hydraulics, §4-2, §4-3.
 * - Other sections: the definition Fr = 1, and an independent strip-integration bisection.
 */
import { describe, expect, it } from 'vitest';
import { criticalDepth } from '@/lib/solver/criticalDepth';
import { froudeNumber } from '@/lib/solver/froudeNumber';
import { momentumFunction } from '@/lib/solver/momentumFunction';
import type { Section } from '@/lib/solver/section';
import { specificEnergy } from '@/lib/solver/specificEnergy';
import { bisect, stripArea, stripMomentum, stripTopWidth } from './stripSection';

const g = 9.80665;

describe('criticalDepth(section, Q, g)', () => {
  it('is (q²/g)^(1/3) in a rectangle, where E is least (E_min = 1.5·yc)', () => {
    const s: Section = { shape: 'rectangular', width: 2 };
    const yc = criticalDepth(s, 6, g);
    expect(yc).toBeCloseTo(Math.cbrt(9 / g), 14);
    expect(specificEnergy(s, 6, yc, g)).toBeCloseTo(1.5 * yc, 12);
    expect(specificEnergy(s, 6, yc * 1.01, g)).toBeGreaterThan(1.5 * yc);
    expect(specificEnergy(s, 6, yc * 0.99, g)).toBeGreaterThan(1.5 * yc);
  });

  it('is (2Q²/(g·z²))^(1/5) in a triangle', () => {
    expect(criticalDepth({ shape: 'triangular', sideSlope: 1.5 }, 3, g)).toBeCloseTo((18 / (g * 2.25)) ** 0.2, 14);
  });

  describe.each<Section>([
    { shape: 'trapezoidal', width: 3, sideSlope: 2 },
    { shape: 'trapezoidal', width: 0.01, sideSlope: 3 },
    { shape: 'trapezoidal', width: 50, sideSlope: 0 },
    { shape: 'circular', diameter: 1 },
    { shape: 'circular', diameter: 5 },
  ])('in %j', (section) => {
    it.each([1e-6, 0.01, 1, 5])('gives Fr = 1 for Q = %f, matching a strip-integration bisection', (q) => {
      const yc = criticalDepth(section, q, g);
      expect(froudeNumber(section, q, yc, g)).toBeCloseTo(1, 9);
      const hi = section.shape === 'circular' ? section.diameter * (1 - 1e-9) : 100;
      const strip = bisect((y) => (q * q * stripTopWidth(section, y)) / (g * stripArea(section, y) ** 3) - 1, 1e-9, hi);
      expect(yc / strip).toBeCloseTo(1, 4);
    });

    it('makes M(y) least at yc (dM/dy = A(1 − Fr²))', () => {
      const yc = criticalDepth(section, 1, g);
      const m = momentumFunction(section, 1, yc, g);
      expect(momentumFunction(section, 1, yc * 1.01, g)).toBeGreaterThan(m);
      expect(momentumFunction(section, 1, yc * 0.99, g)).toBeGreaterThan(m);
      expect(m / stripMomentum(section, 1, yc, g)).toBeCloseTo(1, 5);
    });
  });

  it('stays below the crown of a pipe even for a huge discharge', () => {
    const yc = criticalDepth({ shape: 'circular', diameter: 1 }, 1e3, g);
    expect(yc).toBeLessThan(1);
    expect(yc).toBeGreaterThan(0.99);
  });
});
