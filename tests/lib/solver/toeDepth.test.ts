/**
 * Toe depth from the energy equation. Sources per check:
 * - H = y + (1 + k)·q²/(2g·y²) and Q_max = b·√(g/(1 + k))·(2H/3)^(3/2) for rectangles:
 *   Henderson, F. M., 1966, Open Channel Flow, §2.4 (critical flow, maximum discharge).
 * - Non-rectangular sections: an independent strip-integration area and bisection here.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Section } from '@/lib/solver/section';
import { maxDischargeForHead, solveToeDepth, type ToeDepthInput } from '@/lib/solver/toeDepth';
import { bisect, stripArea } from './stripSection';

const g = 9.80665;
const rect: Section = { shape: 'rectangular', width: 4 };

function value(input: ToeDepthInput) {
  const r = solveToeDepth(input);
  if (!r.ok) throw new Error(`${r.error.code}: ${r.error.message}`);
  return r.value;
}

describe('solveToeDepth(input) rejects invalid input', () => {
  it.each([
    [{ section: rect, discharge: Number.NaN, head: 5 }, 'discharge'],
    [{ section: rect, discharge: 10, head: 0 }, 'head'],
    [{ section: rect, discharge: 10, head: -Infinity }, 'head'],
    [{ section: rect, discharge: 10, head: 5, lossCoefficient: -0.1 }, 'lossCoefficient'],
    [{ section: { shape: 'triangular', sideSlope: -1 }, discharge: 10, head: 5 }, 'sideSlope'],
  ])('%j → invalid-input on %s', (input, field) => {
    const r = solveToeDepth(input as ToeDepthInput);
    expect(!r.ok && r.error.code).toBe('invalid-input');
    expect(!r.ok && r.error.field).toBe(field);
  });

  it('fails with discharge-exceeds-maximum above Q_max, quoting it and explaining critical flow', () => {
    const qMax = 4 * Math.sqrt(g) * (2 * 5 / 3) ** 1.5;
    const r = solveToeDepth({ section: rect, discharge: qMax * 1.001, head: 5 });
    expect(!r.ok && r.error.code).toBe('discharge-exceeds-maximum');
    expect(!r.ok && r.error.message).toMatch(/critical/);
    expect(!r.ok && r.error.message).toContain(qMax.toPrecision(4));
  });
});

describe('rectangular toe depth (Henderson 1966, §2.4)', () => {
  it.each([
    [20, 10, 0],
    [20, 10, 0.1],
    [5, 30, 0.2],
    [120, 8, 0],
  ])('Q = %f m³/s under H = %f m with k = %f satisfies the energy equation on the supercritical branch', (discharge, head, k) => {
    const v = value({ section: rect, discharge, head, lossCoefficient: k });
    const q = discharge / 4;
    expect(v.y1 + ((1 + k) * q * q) / (2 * g * v.y1 * v.y1)).toBeCloseTo(head, 10);
    expect(v.fr1).toBeGreaterThan(1);
    expect(v.y1).toBeLessThan(v.yc);
    expect(v.headLoss).toBeCloseTo((k * v.v1 * v.v1) / (2 * g), 12);
    expect(v.e1 + v.headLoss).toBeCloseTo(head, 10);
  });

  it('gives Q_max = b·√(g/(1 + k))·(2H/3)^(3/2)', () => {
    expect(maxDischargeForHead(rect, 6, 0.15, g)).toBeCloseTo(4 * Math.sqrt(g / 1.15) * 4 ** 1.5, 10);
  });

  it('tends to critical depth as Q → Q_max', () => {
    const qMax = maxDischargeForHead(rect, 3, 0, g);
    const v = value({ section: rect, discharge: qMax * (1 - 1e-10), head: 3 });
    expect(v.y1 / 2).toBeCloseTo(1, 3); // yc = 2H/3
  });

  it('warns when a large loss coefficient leaves the toe flow subcritical', () => {
    const r = solveToeDepth({ section: rect, discharge: 0.98 * maxDischargeForHead(rect, 2, 1, g), head: 2, lossCoefficient: 1 });
    expect(r.ok && r.value.fr1).toBeLessThan(1);
    expect(r.ok && r.warnings.map((w) => w.code)).toContain('toe-not-supercritical');
  });

  it('is tiny and nearly all velocity head for a huge head', () => {
    const v = value({ section: rect, discharge: 1, head: 1e4 });
    expect(v.v1).toBeCloseTo(Math.sqrt(2 * g * (1e4 - v.y1)), 6);
  });
});

describe.each([
  { shape: 'trapezoidal', width: 3, sideSlope: 1 } as const,
  { shape: 'triangular', sideSlope: 1.5 } as const,
  { shape: 'circular', diameter: 2.5 } as const,
])('toe depth in %j', (section) => {
  it('matches an independent strip-area energy balance solved by bisection', () => {
    const discharge = 6;
    const head = 6;
    const k = 0.1;
    const v = value({ section, discharge, head, lossCoefficient: k });
    const f = (y: number) => y + ((1 + k) * discharge ** 2) / (2 * g * stripArea(section, y) ** 2) - head;
    expect(v.y1 / bisect(f, 1e-4, v.yc)).toBeCloseTo(1, 4);
  });

  it('has Q_max where the head just passes the flow critically', () => {
    const qMax = maxDischargeForHead(section, 2, 0, g);
    expect(solveToeDepth({ section, discharge: qMax * 0.999, head: 2 }).ok).toBe(true);
    expect(solveToeDepth({ section, discharge: qMax * 1.001, head: 2 }).ok).toBe(false);
  });
});

describe('properties (fast-check)', () => {
  it('for random rectangles and Q below Q_max the root is supercritical and satisfies energy', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 50, noNaN: true }),
        fc.double({ min: 0.5, max: 100, noNaN: true }),
        fc.double({ min: 0.01, max: 0.99, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (b, head, fraction, k) => {
          const section: Section = { shape: 'rectangular', width: b };
          const discharge = fraction * maxDischargeForHead(section, head, k, g);
          const r = solveToeDepth({ section, discharge, head, lossCoefficient: k });
          if (!r.ok) return false;
          const q = discharge / b;
          // With losses the shallow root only guarantees Fr1² ≥ 1/(1 + k) (minimum of E + loss).
          const frOk = k === 0 ? r.value.fr1 > 1 : r.value.fr1 ** 2 >= 1 / (1 + k) - 1e-9;
          const warned = r.value.fr1 > 1 || r.warnings.some((w) => w.code === 'toe-not-supercritical');
          return frOk && warned && Math.abs(r.value.y1 + ((1 + k) * q * q) / (2 * g * r.value.y1 ** 2) - head) < 1e-8 * head;
        },
      ),
      { numRuns: 300 },
    );
  });

  it('never throws on junk input', () => {
    fc.assert(
      fc.property(fc.anything(), fc.anything(), fc.anything(), (section, discharge, head) => {
        expect(typeof solveToeDepth({ section, discharge, head } as unknown as ToeDepthInput).ok).toBe('boolean');
      }),
    );
  });
});
