/**
 * Positive surges (bores). Sources per check:
 * - Celerity c = √(g·h2·(h + h2)/(2h)) relative to the water ahead and continuity across
 *   the front: Henderson, F. M., 1966, Open Channel Flow, ch. 9 (surges); Chow, V. T.,
 *   1959, Open-Channel Hydraulics, §18-2.
 * - Weak-bore limit c ≈ √(gh)·(1 + 3ε/4), ε = (h2 − h)/h: classical expansion of the above.
 * - Independent check: mass and momentum flux balances written out in the front's frame.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { solveSurge, type SurgeInput } from '@/lib/solver/surge';
import { parseUnit, toSI } from '@/lib/solver/units';

const g = 9.80665;

function value(input: SurgeInput) {
  const r = solveSurge(input);
  if (!r.ok) throw new Error(`${r.error.code}: ${r.error.message}`);
  return r;
}
function errorOf(input: unknown) {
  const r = solveSurge(input as SurgeInput);
  if (r.ok) throw new Error('expected failure');
  return r.error;
}

describe('solveSurge(input) rejects invalid input', () => {
  it.each([
    ['NaN depth', { depth: Number.NaN, direction: 'upstream', depthBehind: 2 }, 'depth'],
    ['zero depth', { depth: 0, direction: 'upstream', depthBehind: 2 }, 'depth'],
    ['infinite velocity', { depth: 1, velocity: Infinity, direction: 'upstream', depthBehind: 2 }, 'velocity'],
    ['bad direction', { depth: 1, direction: 'sideways', depthBehind: 2 }, 'direction'],
    ['NaN unknown', { depth: 1, direction: 'upstream', surgeSpeed: Number.NaN }, 'surgeSpeed'],
  ])('%s → invalid-input on %s', (_, input, field) => {
    const e = errorOf(input);
    expect(e.code).toBe('invalid-input');
    expect(e.field).toBe(field);
  });

  it('only supports rectangular sections, saying so', () => {
    const e = errorOf({ shape: 'trapezoidal', depth: 1, direction: 'upstream', depthBehind: 2 });
    expect(e.code).toBe('unsupported-section');
    expect(e.message).toBe('Only rectangular sections are supported for moving surges.');
  });

  it('needs exactly one of the four surge properties', () => {
    expect(errorOf({ depth: 1, direction: 'upstream' }).code).toBe('conflicting-input');
    expect(errorOf({ depth: 1, direction: 'upstream', depthBehind: 2, surgeSpeed: -5 }).code).toBe('conflicting-input');
  });

  it.each([
    ['a depth behind below the undisturbed depth', { depth: 2, direction: 'upstream', depthBehind: 1.5 }],
    ['a front slower than √(gh)', { depth: 1, direction: 'downstream', surgeSpeed: 2 }],
    ['a discharge increase behind an upstream front (gate opening downstream)', { depth: 2, velocity: 1, direction: 'upstream', dischargeChange: 0.5 }],
    ['a discharge decrease behind a downstream front (gate closing upstream)', { depth: 2, velocity: 1, direction: 'downstream', dischargeChange: -0.5 }],
    ['flow accelerating across an upstream front', { depth: 2, velocity: 1, direction: 'upstream', velocityBehind: 1.5 }],
  ])('fails with negative-surge for %s, naming a rarefaction wave', (_, input) => {
    const e = errorOf(input);
    expect(e.code).toBe('negative-surge');
    expect(e.message).toMatch(/rarefaction/);
  });
});

describe('sudden full closure of a downstream gate (Henderson 1966, ch. 9)', () => {
  const h = 2;
  const u = 1.5;
  const r = value({ depth: h, velocity: u, direction: 'upstream', dischargeChange: -u * h });
  const { depthBehind: h2, velocityBehind: u2, surgeSpeed: w, relativeCelerity: c } = r.value;

  it('brings the flow behind the front to rest', () => {
    expect(u2).toBeCloseTo(0, 10);
  });

  it('satisfies continuity in the front frame: (u − w)·h = (u2 − w)·h2', () => {
    expect((u - w) * h).toBeCloseTo((u2 - w) * h2, 10);
  });

  it('satisfies the momentum balance in the front frame', () => {
    const m1 = (u - w) ** 2 * h + (g * h * h) / 2;
    const m2 = (u2 - w) ** 2 * h2 + (g * h2 * h2) / 2;
    expect(m1 / m2).toBeCloseTo(1, 12);
  });

  it('has c = √(g·h2·(h + h2)/(2h)) and w = u − c', () => {
    expect(c).toBeCloseTo(Math.sqrt((g * h2 * (h + h2)) / (2 * h)), 12);
    expect(w).toBeCloseTo(u - c, 12);
    expect(w).toBeLessThan(0);
  });

  it('is faster than the linear wave, with the flow behind slower than the front', () => {
    expect(c).toBeGreaterThan(Math.sqrt(g * h));
    expect(r.value.linearWaveSpeed).toBeCloseTo(Math.sqrt(g * h), 12);
    expect(Math.abs(u2 - u)).toBeLessThan(c);
    // Behind the front the flow is subcritical relative to it.
    expect(Math.abs(u2 - w)).toBeLessThan(Math.sqrt(g * h2));
  });
});

describe.each([
  { known: 'depthBehind', direction: 'upstream' },
  { known: 'depthBehind', direction: 'downstream' },
  { known: 'velocityBehind', direction: 'upstream' },
  { known: 'velocityBehind', direction: 'downstream' },
  { known: 'surgeSpeed', direction: 'upstream' },
  { known: 'surgeSpeed', direction: 'downstream' },
  { known: 'dischargeChange', direction: 'upstream' },
  { known: 'dischargeChange', direction: 'downstream' },
] as const)('given $known for a front moving $direction', ({ known, direction }) => {
  const base = value({ depth: 1.2, velocity: 0.8, direction, depthBehind: 1.9 });

  it('reproduces the same surge from the depth behind', () => {
    const r = value({ depth: 1.2, velocity: 0.8, direction, [known]: base.value[known] });
    expect(r.value.depthBehind).toBeCloseTo(1.9, 9);
    expect(r.value.surgeSpeed).toBeCloseTo(base.value.surgeSpeed, 9);
  });
});

describe('Galilean invariance', () => {
  it.each([-2, -0.5, 0, 0.7, 1.5])('keeps relative quantities for ambient velocity u = %f', (u) => {
    const still = value({ depth: 1, velocity: 0, direction: 'downstream', depthBehind: 1.6 });
    const moving = value({ depth: 1, velocity: u, direction: 'downstream', depthBehind: 1.6 });
    expect(moving.value.relativeCelerity).toBeCloseTo(still.value.relativeCelerity, 12);
    expect(moving.value.surgeSpeed - u).toBeCloseTo(still.value.surgeSpeed, 12);
    expect(moving.value.velocityBehind - u).toBeCloseTo(still.value.velocityBehind, 12);
  });
});

describe('front type (Favre 1935, Treske 1994; thresholds from memory, common practice)', () => {
  it.each([
    [1.1, 'undular', 'undular-bore'],
    [1.4, 'transitional', 'transitional-bore'],
    [2, 'breaking', undefined],
  ])('surge Froude %f is %s', (frS, type, code) => {
    const c = frS * Math.sqrt(g * 1);
    const r = value({ depth: 1, direction: 'downstream', surgeSpeed: c });
    expect(r.value.surgeFroude).toBeCloseTo(frS, 12);
    expect(r.value.frontType).toBe(type);
    expect(r.warnings.map((w) => w.code)[0]).toBe(code);
  });

  it('tends to c ≈ √(gh)(1 + 3ε/4) for a weak bore', () => {
    const eps = 1e-4;
    const r = value({ depth: 1, direction: 'downstream', depthBehind: 1 + eps });
    expect(r.value.relativeCelerity / Math.sqrt(g)).toBeCloseTo(1 + 0.75 * eps, 7);
  });

  it('warns when an upstream-facing front is swept downstream by supercritical flow', () => {
    const r = value({ depth: 0.5, velocity: 5, direction: 'upstream', depthBehind: 1 });
    expect(r.value.surgeSpeed).toBeGreaterThan(0);
    expect(r.warnings.map((w) => w.code)).toContain('swept-downstream');
  });
});

describe('units', () => {
  it('gives the same physical answer from SI and US customary inputs', () => {
    const ft = parseUnit('ft');
    const fps = parseUnit('ft/s');
    if (!ft.ok || !fps.ok) throw new Error();
    const us = value({ depth: toSI(6.5, ft.value), velocity: toSI(3, fps.value), direction: 'upstream', depthBehind: toSI(9, ft.value) });
    const si = value({ depth: 6.5 * 0.3048, velocity: 3 * 0.3048, direction: 'upstream', depthBehind: 9 * 0.3048 });
    expect(us.value.surgeSpeed).toBeCloseTo(si.value.surgeSpeed, 12);
  });
});

describe('properties (fast-check)', () => {
  it('for random positive surges: faster than √(gh), flow behind slower than the front, finite', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.05, max: 20, noNaN: true }),
        fc.double({ min: -3, max: 3, noNaN: true }),
        fc.double({ min: 1.0001, max: 5, noNaN: true }),
        fc.constantFrom('upstream' as const, 'downstream' as const),
        (h, u, ratio, direction) => {
          const r = solveSurge({ depth: h, velocity: u, direction, depthBehind: ratio * h });
          if (!r.ok) return false;
          const v = r.value;
          expect(v.relativeCelerity).toBeGreaterThan(v.linearWaveSpeed);
          expect(Math.abs(v.velocityBehind - u)).toBeLessThan(v.relativeCelerity);
          expect(Math.abs(v.velocityBehind - v.surgeSpeed)).toBeLessThan(Math.sqrt(g * v.depthBehind));
          return Object.values(v).every((x) => typeof x === 'string' || Number.isFinite(x));
        },
      ),
      { numRuns: 300 },
    );
  });

  it('never throws on junk input', () => {
    fc.assert(
      fc.property(fc.object(), fc.anything(), (o, x) => {
        const r = solveSurge({ ...o, depth: x } as unknown as SurgeInput);
        expect(typeof r.ok).toBe('boolean');
      }),
      { numRuns: 200 },
    );
  });
});
