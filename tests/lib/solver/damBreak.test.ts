/**
 * Wet-bed dam break. Sources per check:
 * - Stoker, J. J., 1957, Water Waves, ch. 10 (from memory): Riemann invariant u2 + 2c2 = 2c0
 *   and the bore relations at the front.
 * - Ritter, A., 1892 (dry bed, front speed 2√(g·h0)), as the h1 → 0 limit.
 * - Independent numerical check: a first-order HLL finite-volume shallow-water model written
 *   in ./shallowWaterFv.ts (Toro 2001, ch. 10).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { damBreakProfile, solveDamBreak, type DamBreakInput } from '@/lib/solver/damBreak';
import { depthAt, frontPosition, simulateDamBreak } from './shallowWaterFv';

const g = 9.80665;

function value(input: DamBreakInput) {
  const r = solveDamBreak(input);
  if (!r.ok) throw new Error(`${r.error.code}: ${r.error.message}`);
  return r;
}

describe('solveDamBreak(input) rejects invalid input', () => {
  it.each([
    [{ upstreamDepth: Number.NaN, downstreamDepth: 0.1 }, 'upstreamDepth'],
    [{ upstreamDepth: Infinity, downstreamDepth: 0.1 }, 'upstreamDepth'],
    [{ upstreamDepth: 1, downstreamDepth: 0 }, 'downstreamDepth'],
    [{ upstreamDepth: 1, downstreamDepth: -0.1 }, 'downstreamDepth'],
    [{ upstreamDepth: 1, downstreamDepth: 1 }, 'downstreamDepth'],
    [{ upstreamDepth: 1, downstreamDepth: 2 }, 'downstreamDepth'],
    [{ upstreamDepth: 1, downstreamDepth: 0.5, time: -1 }, 'time'],
  ])('%j → invalid-input on %s', (input, field) => {
    const r = solveDamBreak(input);
    expect(!r.ok && r.error.code).toBe('invalid-input');
    expect(!r.ok && r.error.field).toBe(field);
  });
});

describe.each([0.5, 0.2, 0.138, 0.05, 1e-3, 1e-6])('Stoker solution for h1/h0 = %f', (ratio) => {
  const h0 = 2;
  const h1 = ratio * h0;
  const r = value({ upstreamDepth: h0, downstreamDepth: h1 });
  const { depthBehind: h2, velocityBehind: u2, frontSpeed: s } = r.value;
  const c0 = Math.sqrt(g * h0);

  it('satisfies the Riemann invariant u2 + 2√(g·h2) = 2√(g·h0)', () => {
    expect(u2 + 2 * Math.sqrt(g * h2)).toBeCloseTo(2 * c0, 10);
  });

  it('satisfies mass and momentum at the bore', () => {
    expect((0 - s) * h1).toBeCloseTo((u2 - s) * h2, 10);
    const m1 = s * s * h1 + 0.5 * g * h1 * h1;
    const m2 = (u2 - s) ** 2 * h2 + 0.5 * g * h2 * h2;
    expect(m2 / m1).toBeCloseTo(1, 9);
  });

  it('orders the depths h1 < h2 < h0 and the front ahead of the flow', () => {
    expect(h2).toBeGreaterThan(h1);
    expect(h2).toBeLessThan(h0);
    expect(s).toBeGreaterThan(u2);
    expect(s).toBeGreaterThan(Math.sqrt(g * h1));
    expect(s).toBeLessThan(2 * c0);
  });

  it('has depth 4h0/9 at the dam when the fan spans it (h1/h0 below about 0.138), else h2', () => {
    if (r.value.fanTailSpeed > 0) expect(r.value.depthAtDam).toBeCloseTo((4 * h0) / 9, 12);
    else expect(r.value.depthAtDam).toBe(h2);
  });
});

describe('Ritter dry-bed limit (Ritter 1892)', () => {
  it('approaches the front speed 2√(g·h0) monotonically as h1 → 0', () => {
    const speeds = [1e-2, 1e-4, 1e-6, 1e-9, 1e-12].map((r) => value({ upstreamDepth: 1, downstreamDepth: r }).value.frontSpeed);
    for (let i = 1; i < speeds.length; i++) expect(speeds[i]).toBeGreaterThan(speeds[i - 1] as number);
    expect((speeds.at(-1) as number) / (2 * Math.sqrt(g))).toBeGreaterThan(0.995);
  });

  it('warns that a nearly dry bed is friction-dominated', () => {
    expect(value({ upstreamDepth: 1, downstreamDepth: 1e-3 }).warnings.map((w) => w.code)).toContain('nearly-dry-bed');
  });
});

describe('against a first-order HLL finite-volume simulation (within 2 %)', () => {
  it.each([0.3, 0.1])('matches the front speed and middle depth for h1/h0 = %f', (ratio) => {
    const h0 = 1;
    const h1 = ratio;
    const r = value({ upstreamDepth: h0, downstreamDepth: h1, time: 2 });
    const t = 2;
    const fv = simulateDamBreak(h0, h1, 10, 800, t, g);
    const { depthBehind: h2, frontSpeed: s, fanTailSpeed } = r.value;
    const front = frontPosition(fv, 0.5 * (h1 + h2));
    expect(front / t / s).toBeGreaterThan(0.98);
    expect(front / t / s).toBeLessThan(1.02);
    expect(r.value.frontPosition).toBeCloseTo(s * t, 12);
    const mid = 0.5 * (Math.max(fanTailSpeed, 0) * t + front);
    expect(depthAt(fv, mid) / h2).toBeCloseTo(1, 1);
    expect(Math.abs(depthAt(fv, mid) / h2 - 1)).toBeLessThan(0.02);
    // The analytic profile agrees with the simulation inside the fan too.
    const xFan = -0.5 * Math.sqrt(g * h0) * t;
    expect(Math.abs(depthAt(fv, xFan) / damBreakProfile(r.value, h0, h1, xFan, t).depth - 1)).toBeLessThan(0.02);
  });
});

describe('properties (fast-check)', () => {
  it('for random 0 < h1 < h0: finite, ordered, front faster than the flow behind', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 100, noNaN: true }), fc.double({ min: 1e-6, max: 0.999, noNaN: true }), (h0, ratio) => {
        const r = solveDamBreak({ upstreamDepth: h0, downstreamDepth: ratio * h0 });
        if (!r.ok) return false;
        const v = r.value;
        return v.depthBehind > ratio * h0 && v.depthBehind < h0 && v.frontSpeed > v.velocityBehind && Number.isFinite(v.unitDischargeAtDam);
      }),
      { numRuns: 300 },
    );
  });

  it('never throws on junk input', () => {
    fc.assert(
      fc.property(fc.anything(), fc.anything(), fc.anything(), (a, b, t) => {
        const r = solveDamBreak({ upstreamDepth: a, downstreamDepth: b, time: t } as unknown as DamBreakInput);
        expect(typeof r.ok).toBe('boolean');
      }),
    );
  });
});
