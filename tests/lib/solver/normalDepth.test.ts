/**
 * Manning normal depth. Sources per check:
 * - Q = (1/n)·A·R^(2/3)·S^(1/2) (SI) and the US form with 1.486: Chow, V. T., 1959,
 *   Open-Channel Hydraulics, §5-6.
 * - Wide-channel limit y = (n·q/√S)^(3/5): classical (R → y).
 * - Pipe: largest discharge at y/D ≈ 0.938 (Chow 1959, §6-3, from memory), checked here as the
 *   root of d(A^(5/3)/P^(2/3))/dθ = 0.
 */
import { describe, expect, it } from 'vitest';
import { bisect } from './stripSection';
import { CIRCLE_MAX_CONVEYANCE_ANGLE, CIRCLE_MAX_CONVEYANCE_DEPTH_RATIO, manningDischarge, normalDepth } from '@/lib/solver/normalDepth';
import type { Section } from '@/lib/solver/section';
import { area, hydraulicRadius } from '@/lib/solver/sectionGeometry';

describe('normalDepth(section, Q, n, S)', () => {
  it.each<Section>([
    { shape: 'rectangular', width: 5 },
    { shape: 'trapezoidal', width: 3, sideSlope: 2 },
    { shape: 'triangular', sideSlope: 1 },
    { shape: 'circular', diameter: 1.5 },
  ])('satisfies Manning in %j', (section) => {
    const y = normalDepth(section, 1.2, 0.014, 0.002);
    expect(manningDischarge(section, y, 0.014, 0.002)).toBeCloseTo(1.2, 9);
  });

  it('tends to (n·q/√S)^(3/5) in a very wide rectangle', () => {
    const q = 2;
    const y = normalDepth({ shape: 'rectangular', width: 1e5 }, q * 1e5, 0.03, 0.001);
    expect(y / Math.pow((0.03 * q) / Math.sqrt(0.001), 0.6)).toBeCloseTo(1, 4);
  });

  it('agrees with the US customary form Q = (1.486/n)·A·R^(2/3)·√S in ft and cfs to 0.01 %', () => {
    const section: Section = { shape: 'trapezoidal', width: 10 * 0.3048, sideSlope: 2 };
    const y = normalDepth(section, 300 * 0.3048 ** 3, 0.025, 0.0016);
    const aFt = area(section, y) / 0.3048 ** 2;
    const rFt = hydraulicRadius(section, y) / 0.3048;
    expect(Math.abs(((1.486 / 0.025) * aFt * rFt ** (2 / 3) * Math.sqrt(0.0016)) / 300 - 1)).toBeLessThan(1e-4);
  });

  it('has the pipe conveyance maximum at the root of 3θ − 5θ·cos θ + 2 sin θ = 0 (y/D ≈ 0.938)', () => {
    const root = bisect((t) => 3 * t - 5 * t * Math.cos(t) + 2 * Math.sin(t), 4, 6);
    expect(CIRCLE_MAX_CONVEYANCE_ANGLE).toBeCloseTo(root, 12);
    expect(CIRCLE_MAX_CONVEYANCE_DEPTH_RATIO).toBeCloseTo(0.938, 3);
  });

  it('returns Infinity when Q exceeds the largest open-channel discharge of a pipe', () => {
    const pipe: Section = { shape: 'circular', diameter: 1 };
    const qMax = manningDischarge(pipe, CIRCLE_MAX_CONVEYANCE_DEPTH_RATIO, 0.013, 0.01);
    expect(normalDepth(pipe, qMax * 1.01, 0.013, 0.01)).toBe(Infinity);
  });

  it('returns the lower root between the full-pipe and the largest discharge', () => {
    const pipe: Section = { shape: 'circular', diameter: 1 };
    const qFull = manningDischarge(pipe, 1, 0.013, 0.01);
    const y = normalDepth(pipe, qFull * 1.02, 0.013, 0.01);
    expect(y).toBeLessThan(CIRCLE_MAX_CONVEYANCE_DEPTH_RATIO);
    expect(y).toBeGreaterThan(0.8);
  });

  it('is zero discharge at zero depth', () => {
    expect(manningDischarge({ shape: 'triangular', sideSlope: 1 }, 0, 0.013, 0.01)).toBe(0);
  });
});
