/**
 * Section geometry checked against the closed forms of Chow, V. T., 1959, Open-Channel
 * Hydraulics, Table 2-1, and against an independent strip integration of the top width
 * T(η) done here: A = ∫₀ʸ T dη, A·ȳ = ∫₀ʸ (y − η) T dη.
 */
import { describe, expect, it } from 'vitest';
import {
  area,
  centroidDepth,
  firstMoment,
  hydraulicDepth,
  hydraulicRadius,
  sectionProperties,
  topWidth,
  wettedPerimeter,
} from '@/lib/solver/sectionGeometry';
import { type Section, validateSection } from '@/lib/solver/section';
import { stripArea, stripFirstMoment, stripTopWidth } from './stripSection';

const sections: readonly Section[] = [
  { shape: 'rectangular', width: 3 },
  { shape: 'trapezoidal', width: 2, sideSlope: 1.5 },
  { shape: 'trapezoidal', width: 0, sideSlope: 2 },
  { shape: 'triangular', sideSlope: 0.75 },
  { shape: 'circular', diameter: 1.2 },
];

describe('validateSection(section)', () => {
  it.each([
    [null, 'shape'],
    [{ shape: 'oval', width: 1 }, 'shape'],
    [{ shape: 'rectangular', width: Number.NaN }, 'width'],
    [{ shape: 'rectangular', width: Infinity }, 'width'],
    [{ shape: 'rectangular', width: 0 }, 'width'],
    [{ shape: 'rectangular', width: -1 }, 'width'],
    [{ shape: 'trapezoidal', width: 1, sideSlope: -0.5 }, 'sideSlope'],
    [{ shape: 'trapezoidal', width: 0, sideSlope: 0 }, 'width'],
    [{ shape: 'triangular', sideSlope: 0 }, 'sideSlope'],
    [{ shape: 'circular', diameter: '1' }, 'diameter'],
  ])('rejects %j naming field %s', (section, field) => {
    const r = validateSection(section);
    expect(r?.ok).toBe(false);
    expect(r?.error.field).toBe(field);
  });

  it.each(sections)('accepts %j', (section) => {
    expect(validateSection(section)).toBeNull();
  });
});

describe.each(sections)('geometry of %j', (section) => {
  const full = section.shape === 'circular' ? section.diameter : 4;
  const depths = [0.01, 0.1, 0.37, 0.5, 0.8, 0.99].map((f) => f * full);

  it.each(depths)('matches strip integration of T(η) at y = %f', (y) => {
    expect(topWidth(section, y)).toBeCloseTo(stripTopWidth(section, y), 10);
    expect(area(section, y) / stripArea(section, y)).toBeCloseTo(1, 5);
    expect(firstMoment(section, y) / stripFirstMoment(section, y)).toBeCloseTo(1, 5);
  });

  it('is consistent: ȳ = (A·ȳ)/A, A/T and A/P', () => {
    const p = sectionProperties(section, depths[2] as number);
    expect(p.centroidDepth).toBeCloseTo(centroidDepth(section, p.depth), 12);
    expect(p.hydraulicDepth).toBeCloseTo(hydraulicDepth(section, p.depth), 12);
    expect(p.hydraulicRadius).toBeCloseTo(hydraulicRadius(section, p.depth), 12);
    expect(p.wettedPerimeter).toBeCloseTo(wettedPerimeter(section, p.depth), 12);
    expect(p.centroidDepth).toBeGreaterThan(0);
    expect(p.centroidDepth).toBeLessThan(p.depth);
  });

  it('has dA/dy = T and d(A·ȳ)/dy = A (central differences)', () => {
    const y = depths[3] as number;
    const h = 1e-6 * full;
    expect((area(section, y + h) - area(section, y - h)) / (2 * h)).toBeCloseTo(topWidth(section, y), 5);
    expect((firstMoment(section, y + h) - firstMoment(section, y - h)) / (2 * h) / area(section, y)).toBeCloseTo(1, 6);
  });
});

describe('circular section', () => {
  const d = 2;
  const pipe: Section = { shape: 'circular', diameter: d };

  it('is half full at y = D/2: A = πD²/8, T = D, P = πD/2, ȳ = 2D/(3π)', () => {
    expect(area(pipe, 1)).toBeCloseTo((Math.PI * d * d) / 8, 14);
    expect(topWidth(pipe, 1)).toBeCloseTo(d, 14);
    expect(wettedPerimeter(pipe, 1)).toBeCloseTo((Math.PI * d) / 2, 14);
    // Semicircle centroid 4r/(3π) below the diameter (classical).
    expect(centroidDepth(pipe, 1)).toBeCloseTo((4 * 1) / (3 * Math.PI), 14);
  });

  it('is full at y = D: A = πD²/4, T = 0, ȳ = D/2', () => {
    expect(area(pipe, d)).toBeCloseTo(Math.PI, 14);
    expect(topWidth(pipe, d)).toBe(0);
    expect(centroidDepth(pipe, d)).toBeCloseTo(1, 14);
  });

  it.each([1e-9, 1e-6, 1e-3])('tends to the parabolic segment at tiny depth y/D = %f (A → (4/3)·y·T/2·…)', (ratio) => {
    // Near the invert the circle is a parabola: A ≈ (2/3)·T·y and ȳ ≈ (2/5)·y.
    const y = ratio * d;
    expect(area(pipe, y) / ((2 / 3) * topWidth(pipe, y) * y)).toBeCloseTo(1, 2);
    expect(centroidDepth(pipe, y) / (0.4 * y)).toBeCloseTo(1, 2);
    expect(firstMoment(pipe, y) / stripFirstMoment(pipe, y)).toBeCloseTo(1, 4);
  });

  it('is smooth across the series/closed-form switch at α = 0.5', () => {
    const y = (d * (1 - Math.cos(0.5))) / 2;
    for (const f of [area, firstMoment]) {
      const below = f(pipe, y * (1 - 1e-9));
      const above = f(pipe, y * (1 + 1e-9));
      expect(Math.abs(above - below) / below).toBeLessThan(1e-8);
    }
  });
});
