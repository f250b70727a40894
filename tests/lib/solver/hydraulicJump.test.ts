/**
 * Stationary jump. Sources named per check:
 * - Bélanger closed form and the loss ΔE = (y2 − y1)³/(4·y1·y2): Chow, V. T., 1959,
 *   Open-Channel Hydraulics, §15-2 and §15-4 (eqs. 15-3, 15-4).
 * - Jump types and their relative losses: Chow 1959, ch. 15, types of jump (from memory).
 * - Non-rectangular sections: an independent strip integration and bisection in this file.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { criticalDepth } from '@/lib/solver/criticalDepth';
import { solveHydraulicJump, type HydraulicJumpInput } from '@/lib/solver/hydraulicJump';
import { momentumFunction } from '@/lib/solver/momentumFunction';
import type { Section } from '@/lib/solver/section';
import { bisect, stripMomentum } from './stripSection';

const g = 9.80665;
const rect: Section = { shape: 'rectangular', width: 1 };

function value(input: HydraulicJumpInput) {
  const r = solveHydraulicJump(input);
  if (!r.ok) throw new Error(`expected success, got ${r.error.code}: ${r.error.message}`);
  return r;
}

function errorOf(input: unknown) {
  const r = solveHydraulicJump(input as HydraulicJumpInput);
  if (r.ok) throw new Error('expected failure');
  return r.error;
}

describe('solveHydraulicJump(input) rejects invalid input', () => {
  it.each([
    ['NaN discharge', { section: rect, discharge: Number.NaN, y1: 0.5 }, 'discharge'],
    ['infinite discharge', { section: rect, discharge: Infinity, y1: 0.5 }, 'discharge'],
    ['negative discharge', { section: rect, discharge: -1, y1: 0.5 }, 'discharge'],
    ['zero discharge', { section: rect, discharge: 0, y1: 0.5 }, 'discharge'],
    ['zero width', { section: { shape: 'rectangular', width: 0 }, discharge: 1, y1: 0.5 }, 'width'],
    ['negative depth', { section: rect, discharge: 1, y1: -0.5 }, 'y1'],
    ['NaN depth', { section: rect, discharge: 1, y2: Number.NaN }, 'y2'],
    ['zero gravity', { section: rect, discharge: 1, y1: 0.1, g: 0 }, 'g'],
    ['negative density', { section: rect, discharge: 1, y1: 0.1, density: -1000 }, 'density'],
    ['a depth at the pipe crown', { section: { shape: 'circular', diameter: 1 }, discharge: 1, y1: 1 }, 'y1'],
  ])('%s → invalid-input naming the field', (_, input, field) => {
    const e = errorOf(input);
    expect(e.code).toBe('invalid-input');
    expect(e.field).toBe(field);
  });

  it('needs exactly one of y1 and y2', () => {
    expect(errorOf({ section: rect, discharge: 1 }).code).toBe('conflicting-input');
    expect(errorOf({ section: rect, discharge: 1, y1: 0.1, y2: 1 }).code).toBe('conflicting-input');
  });

  it('fails with no-jump when the given upstream flow is subcritical (Fr1 ≤ 1), explaining why', () => {
    const e = errorOf({ section: rect, discharge: 1, y1: 1 });
    expect(e.code).toBe('no-jump');
    expect(e.message).toMatch(/already subcritical/);
    expect(e.field).toBe('y1');
  });

  it('fails with no-jump at exactly critical depth', () => {
    const yc = Math.cbrt(1 / g);
    expect(errorOf({ section: rect, discharge: 1, y1: yc }).code).toBe('no-jump');
  });

  it('fails with not-subcritical when the given downstream depth is supercritical', () => {
    const e = errorOf({ section: rect, discharge: 1, y2: 0.1 });
    expect(e.code).toBe('not-subcritical');
    expect(e.field).toBe('y2');
  });

  it('fails with section-surcharged when the sequent depth would be above a pipe crown', () => {
    const e = errorOf({ section: { shape: 'circular', diameter: 1 }, discharge: 3, y1: 0.3 });
    expect(e.code).toBe('section-surcharged');
    expect(e.message).toMatch(/crown/);
  });

  it('reports overflow for huge values instead of returning Infinity', () => {
    expect(errorOf({ section: rect, discharge: 1e200, y1: 1e-100 }).code).toBe('out-of-range');
  });
});

describe('rectangular jump: Bélanger closed form (Chow 1959, §15-2)', () => {
  // Exact values of y2/y1 = ½(√(1+8Fr²) − 1) and ΔE/E1 with E1/y1 = 1 + Fr²/2, compared with
  // the relative losses recalled from Chow 1959, ch. 15 (from memory):
  // ≈ 5 % at 1.7, ≈ 18 % at 2.5, ≈ 45 % at 4.5, ≈ 70 % at 9.
  describe.each([
    { fr1: 1.7, ratio: 1.955606, recalledLoss: 0.05 },
    { fr1: 2.5, ratio: 3.070714, recalledLoss: 0.18 },
    { fr1: 4.5, ratio: 5.883573, recalledLoss: 0.45 },
    { fr1: 9, ratio: 12.237739, recalledLoss: 0.7 },
  ])('at the type boundary Fr1 = $fr1', ({ fr1, ratio, recalledLoss }) => {
    const y1 = 0.2;
    const discharge = fr1 * Math.sqrt(g * y1) * y1; // b = 1 m
    const r = value({ section: rect, discharge, y1 });

    it('gives y2/y1 = ½(√(1 + 8 Fr1²) − 1)', () => {
      expect(r.value.fr1).toBeCloseTo(fr1, 10);
      expect(r.value.sequentRatio).toBeCloseTo(0.5 * (Math.sqrt(1 + 8 * fr1 * fr1) - 1), 10);
      expect(r.value.sequentRatio).toBeCloseTo(ratio, 5);
    });

    it('loses ΔE = (y2 − y1)³/(4 y1 y2) = E1 − E2', () => {
      const { y2, e1, e2, headLoss } = r.value;
      expect(headLoss).toBeCloseTo((y2 - y1) ** 3 / (4 * y1 * y2), 12);
      expect(headLoss).toBeCloseTo(e1 - e2, 10);
    });

    it('matches the recalled relative loss within 2 percentage points', () => {
      expect(Math.abs(r.value.relativeLoss - recalledLoss)).toBeLessThan(0.02);
    });

    it('has Fr2 = Fr1 / (y2/y1)^(3/2) (continuity)', () => {
      expect(r.value.fr2).toBeCloseTo(fr1 / r.value.sequentRatio ** 1.5, 10);
    });
  });

  it.each([
    [1.2, 'undular'],
    [1.7, 'weak'],
    [2.49, 'weak'],
    [2.5, 'oscillating'],
    [4.5, 'steady'],
    [8.99, 'steady'],
    [9, 'strong'],
    [15, 'strong'],
  ])('classifies Fr1 = %f as %s (Chow 1959, ch. 15)', (fr1, type) => {
    const y1 = 0.1;
    expect(value({ section: rect, discharge: fr1 * Math.sqrt(g * y1) * y1, y1 }).value.jumpType).toBe(type);
  });

  it('gives power ρgQΔE, honouring density and gravity overrides', () => {
    const r = value({ section: rect, discharge: 5, y1: 0.5, density: 1025, g: 9.81 });
    expect(r.value.power).toBeCloseTo(1025 * 9.81 * 5 * r.value.headLoss, 6);
    const base = value({ section: rect, discharge: 5, y1: 0.5 });
    expect(r.value.y2).not.toBe(base.value.y2);
  });

  it('gives L_j = 6.1·y2 (USBR EM 25) and L_r = 8·y1·(Fr1 − 1.5) (Hager et al. 1990), both from memory', () => {
    const r = value({ section: rect, discharge: 5, y1: 0.5 });
    expect(r.value.jumpLength).toBeCloseTo(6.1 * r.value.y2, 12);
    expect(r.value.rollerLength).toBeCloseTo(8 * 0.5 * (r.value.fr1 - 1.5), 12);
    expect(r.warnings.map((w) => w.code)).toEqual([]);
  });

  it.each([
    [1.4, 'undular-jump'],
    [3, 'oscillating-jump'],
    [3, 'jump-length-out-of-range'],
    [15, 'roller-length-out-of-range'],
  ])('warns at Fr1 = %f with %s', (fr1, code) => {
    const y1 = 0.3;
    const r = value({ section: rect, discharge: fr1 * Math.sqrt(g * y1) * y1 * 1, y1 });
    expect(r.warnings.map((w) => w.code)).toContain(code);
  });

  it('solves from the downstream depth with the inverse Bélanger form', () => {
    const r = value({ section: rect, discharge: 5, y2: 2.9530707344327074 });
    expect(r.value.y1).toBeCloseTo(0.5, 10);
  });

  it.each([
    ['tiny', 1e-6, 1e-9],
    ['huge', 1e5, 1e2],
  ])('stays accurate at %s scale', (_, discharge, y1) => {
    const r = value({ section: rect, discharge, y1 });
    expect(r.value.y2 / y1).toBeCloseTo(r.value.sequentRatio, 12);
    expect(Number.isFinite(r.value.power)).toBe(true);
  });
});

const other: readonly { name: string; section: Section; discharge: number; y1: number }[] = [
  { name: 'trapezoid b = 2 m, z = 1.5', section: { shape: 'trapezoidal', width: 2, sideSlope: 1.5 }, discharge: 12, y1: 0.4 },
  { name: 'trapezoid b = 6 m, z = 0.5', section: { shape: 'trapezoidal', width: 6, sideSlope: 0.5 }, discharge: 40, y1: 0.6 },
  { name: 'triangle z = 1', section: { shape: 'triangular', sideSlope: 1 }, discharge: 2, y1: 0.4 },
  { name: 'pipe D = 2 m', section: { shape: 'circular', diameter: 2 }, discharge: 2.5, y1: 0.3 },
  { name: 'pipe D = 1.5 m, deep inflow', section: { shape: 'circular', diameter: 1.5 }, discharge: 1.2, y1: 0.35 },
];

describe.each(other)('non-rectangular jump, $name', ({ section, discharge, y1 }) => {
  const r = value({ section, discharge, y1 });

  it('matches an independent strip-integration momentum balance solved by bisection', () => {
    const m1 = stripMomentum(section, discharge, y1, g);
    const yc = criticalDepth(section, discharge, g);
    const hi = section.shape === 'circular' ? section.diameter * (1 - 1e-9) : 20 * yc;
    const y2 = bisect((y) => stripMomentum(section, discharge, y, g) - m1, yc, hi);
    expect(r.value.y2 / y2).toBeCloseTo(1, 4);
  });

  it('conserves the momentum function and loses energy', () => {
    const { y2, momentum, headLoss } = r.value;
    expect(momentumFunction(section, discharge, y2, g) / momentum).toBeCloseTo(1, 10);
    expect(headLoss).toBeGreaterThan(0);
    expect(r.value.fr1).toBeGreaterThan(1);
    expect(r.value.fr2).toBeLessThan(1);
  });

  it('round-trips y1 → y2 → y1', () => {
    const back = value({ section, discharge, y2: r.value.y2 });
    expect(back.value.y1 / y1).toBeCloseTo(1, 9);
  });

  it('warns that the length relations come from rectangular data', () => {
    expect(r.warnings.map((w) => w.code)).toContain('jump-length-rectangular-data');
  });
});

describe('limits between sections', () => {
  it('a trapezoid with z = 0 is the rectangle', () => {
    const a = value({ section: { shape: 'trapezoidal', width: 2.5, sideSlope: 0 }, discharge: 7, y1: 0.3 });
    const b = value({ section: { shape: 'rectangular', width: 2.5 }, discharge: 7, y1: 0.3 });
    expect(a.value.y2).toBeCloseTo(b.value.y2, 9);
    expect(a.value.headLoss).toBeCloseTo(b.value.headLoss, 8);
  });

  it('a trapezoid with b = 0 is the triangle', () => {
    const a = value({ section: { shape: 'trapezoidal', width: 0, sideSlope: 1.25 }, discharge: 3, y1: 0.4 });
    const b = value({ section: { shape: 'triangular', sideSlope: 1.25 }, discharge: 3, y1: 0.4 });
    expect(a.value.y2).toBeCloseTo(b.value.y2, 10);
  });

  it('a wide shallow trapezoid tends to the rectangle of the same bottom width', () => {
    const a = value({ section: { shape: 'trapezoidal', width: 500, sideSlope: 2 }, discharge: 500, y1: 0.1 });
    const b = value({ section: { shape: 'rectangular', width: 500 }, discharge: 500, y1: 0.1 });
    expect(a.value.y2 / b.value.y2).toBeCloseTo(1, 2);
  });

  it('a pipe at small depth tends to the parabolic section T = 2√(D·η) (analytic limit)', () => {
    const d = 1000;
    const discharge = 1e-2;
    const y1 = 0.005;
    const r = value({ section: { shape: 'circular', diameter: d }, discharge, y1 });
    // Parabola: A = (4/3)√D·y^(3/2), A·ȳ = (8/15)√D·y^(5/2).
    const m = (y: number) => (discharge * discharge) / (g * (4 / 3) * Math.sqrt(d) * y ** 1.5) + (8 / 15) * Math.sqrt(d) * y ** 2.5;
    const y2 = bisect((y) => m(y) - m(y1), r.value.yc, 10); // the bracket only uses yc
    expect(r.value.y2 / y2).toBeCloseTo(1, 3);
  });

  it('warns near the crown of a pipe', () => {
    const r = value({ section: { shape: 'circular', diameter: 2 }, discharge: 3, y1: 0.3 });
    expect(r.warnings.map((w) => w.code)).toContain('near-crown');
  });
});

const sectionArb: fc.Arbitrary<Section> = fc.oneof(
  fc.record({ shape: fc.constant('rectangular' as const), width: fc.double({ min: 0.1, max: 50, noNaN: true }) }),
  fc.record({
    shape: fc.constant('trapezoidal' as const),
    width: fc.double({ min: 0.1, max: 50, noNaN: true }),
    sideSlope: fc.double({ min: 0, max: 4, noNaN: true }),
  }),
  fc.record({ shape: fc.constant('triangular' as const), sideSlope: fc.double({ min: 0.1, max: 4, noNaN: true }) }),
  fc.record({ shape: fc.constant('circular' as const), diameter: fc.double({ min: 0.2, max: 10, noNaN: true }) }),
);

describe('properties (fast-check)', () => {
  it('for random valid supercritical inflow: finite, y2 > y1, ΔE ≥ 0, M(y1) = M(y2)', () => {
    fc.assert(
      fc.property(
        sectionArb,
        fc.double({ min: 0.01, max: 200, noNaN: true }),
        fc.double({ min: 0.05, max: 0.95, noNaN: true }),
        (section, discharge, fraction) => {
          const yc = criticalDepth(section, discharge, g);
          const y1 = fraction * yc;
          const r = solveHydraulicJump({ section, discharge, y1 });
          if (!r.ok) return r.error.code === 'section-surcharged';
          const v = r.value;
          expect(Object.values(v).every((x) => typeof x === 'string' || Number.isFinite(x))).toBe(true);
          expect(v.y2).toBeGreaterThan(v.y1);
          expect(v.headLoss).toBeGreaterThanOrEqual(0);
          const m2 = momentumFunction(section, discharge, v.y2, g);
          expect(Math.abs(m2 - v.momentum) / v.momentum).toBeLessThan(1e-9);
          return true;
        },
      ),
      { numRuns: 300 },
    );
  });

  it('never throws on junk input', () => {
    fc.assert(
      fc.property(fc.anything(), fc.anything(), fc.anything(), (section, discharge, y1) => {
        const r = solveHydraulicJump({ section, discharge, y1 } as unknown as HydraulicJumpInput);
        expect(typeof r.ok).toBe('boolean');
      }),
      { numRuns: 300 },
    );
  });
});

describe('near-critical flow', () => {
  it.each<Section>([rect, { shape: 'trapezoidal', width: 2, sideSlope: 1 }, { shape: 'circular', diameter: 2 }])('does not throw for y2 a hair above critical depth in %j', (section) => {
    const yc = criticalDepth(section, 1, g);
    for (const f of [1 + 1e-15, 1 + 1e-12, 1 + 1e-9]) {
      const r = solveHydraulicJump({ section, discharge: 1, y2: yc * f });
      if (r.ok) {
        expect(r.value.y1).toBeLessThanOrEqual(r.value.y2);
        expect(r.value.jumpType).toBe('undular');
      } else expect(['not-subcritical', 'no-convergence']).toContain(r.error.code);
    }
  });
});
