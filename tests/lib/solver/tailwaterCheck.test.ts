/**
 * Tailwater check. Checks are built from the module's own definitions (USBR EM 25, Peterka
 * 1958, Section 1, from memory: the jump stays at the toe when the tailwater equals the
 * sequent depth) and cross-checked against the single-flow toe-depth and jump solvers.
 */
import { describe, expect, it } from 'vitest';
import { solveHydraulicJump } from '@/lib/solver/hydraulicJump';
import type { Section } from '@/lib/solver/section';
import { dischargeRange, solveTailwaterCheck, type TailwaterCheckInput } from '@/lib/solver/tailwaterCheck';
import { normalDepth } from '@/lib/solver/normalDepth';
import { solveToeDepth } from '@/lib/solver/toeDepth';

const basin: Section = { shape: 'rectangular', width: 10 };

function ok(input: TailwaterCheckInput) {
  const r = solveTailwaterCheck(input);
  if (!r.ok) throw new Error(`${r.error.code}: ${r.error.message}`);
  return r;
}

const sequent = (q: number, y1: number) => {
  const r = solveHydraulicJump({ section: basin, discharge: q, y1 });
  if (!r.ok) throw new Error();
  return r.value.y2;
};

describe('solveTailwaterCheck(input) rejects invalid input', () => {
  const good: TailwaterCheckInput = { section: basin, discharges: [10], toe: { method: 'depth', y1: 0.3 }, tailwater: { method: 'table', discharge: [0, 100], depth: [1, 4] } };
  it.each([
    ['no discharges', { ...good, discharges: [] }, 'discharges'],
    ['a NaN discharge', { ...good, discharges: [10, Number.NaN] }, 'discharges'],
    ['a negative discharge', { ...good, discharges: [-1] }, 'discharges'],
    ['an unknown toe method', { ...good, toe: { method: 'guess' } }, 'toeMethod'],
    ['a zero head', { ...good, toe: { method: 'head', head: 0 } }, 'head'],
    ['a bad rating', { ...good, tailwater: { method: 'table', discharge: [1], depth: [1] } }, 'tailwaterRating'],
    ["a zero Manning's n", { ...good, tailwater: { method: 'manning', n: 0, slope: 0.001 } }, 'manningN'],
    ['a negative tolerance', { ...good, tolerance: -0.1 }, 'tolerance'],
  ])('%s → invalid-input on %s', (_, input, field) => {
    const r = solveTailwaterCheck(input as TailwaterCheckInput);
    expect(!r.ok && r.error.code).toBe('invalid-input');
    expect(!r.ok && r.error.field).toBe(field);
  });
});

describe('dischargeRange(min, max, steps)', () => {
  it('spaces flows evenly, ends included', () => {
    expect(dischargeRange(10, 50, 5)).toEqual([10, 20, 30, 40, 50]);
  });
  it.each([[0, 10, 5], [10, 5, 5], [1, 10, 1], [1, 10, 2.5]])('throws RangeError for (%f, %f, %f)', (a, b, n) => {
    expect(() => dischargeRange(a, b, n)).toThrow(RangeError);
  });
});

describe('jump position with a fixed toe depth and a rating table', () => {
  const y1 = 0.4;
  const qs = [20, 40, 60];
  const y2s = qs.map((q) => sequent(q, y1));
  // Tailwater: 20 % short at 20 m³/s, equal at 40, 20 % over at 60.
  const table = { discharge: qs, depth: [0.8 * (y2s[0] as number), y2s[1] as number, 1.2 * (y2s[2] as number)] };
  const r = ok({ section: basin, discharges: [...qs, 80], toe: { method: 'depth', y1 }, tailwater: { method: 'table', ...table } });
  const rows = r.value.rows;

  it('classifies swept out, at the toe and submerged', () => {
    expect(rows.map((x) => x.state)).toEqual(['swept-out', 'at-toe', 'submerged', 'no-tailwater']);
  });

  it('reports margin TW − y2, submergence (TW − y2)/y2 and apron lowering y2 − TW', () => {
    const first = rows[0];
    expect(first?.margin).toBeCloseTo(-0.2 * (y2s[0] as number), 12);
    expect(first?.submergence).toBeCloseTo(-0.2, 12);
    expect(first?.apronLowering).toBeCloseTo(0.2 * (y2s[0] as number), 12);
    expect(rows[2]?.submergence).toBeCloseTo(0.2, 12);
  });

  it('summarises the worst flow and warns, never extrapolating the table', () => {
    expect(r.value.sweptOutCount).toBe(1);
    expect(r.value.criticalDischarge).toBe(20);
    expect(r.value.requiredApronLowering).toBeCloseTo(0.2 * (y2s[0] as number), 12);
    expect(rows[3]?.tailwater).toBeNull();
    expect(r.warnings.map((w) => w.code)).toEqual(expect.arrayContaining(['jump-swept-out', 'rating-out-of-range']));
  });

  it('honours the at-the-toe tolerance', () => {
    const strict = ok({ section: basin, discharges: [60], toe: { method: 'depth', y1 }, tailwater: { method: 'table', ...table }, tolerance: 0.25 });
    expect(strict.value.rows[0]?.state).toBe('at-toe');
  });

  it('marks flows whose toe is not supercritical as no-jump', () => {
    const slow = ok({ section: basin, discharges: [1], toe: { method: 'depth', y1: 2 }, tailwater: { method: 'table', ...table } });
    expect(slow.value.rows[0]?.state).toBe('no-jump');
  });
});

describe('toe depth from the head, with the apron lowering found by a bracketed root', () => {
  const head = 12;
  const k = 0.1;
  const r = ok({ section: basin, discharges: dischargeRange(20, 200, 7), toe: { method: 'head', head, lossCoefficient: k }, tailwater: { method: 'table', discharge: [0, 250], depth: [0.5, 4] } });

  it.each(r.value.rows.map((x) => [x.discharge, x] as const))('Q = %f: lowering the apron by d puts the jump exactly at the toe', (q, x) => {
    const d = x.apronLowering as number;
    const toe = solveToeDepth({ section: basin, discharge: q, head: head + d, lossCoefficient: k });
    if (!toe.ok) throw new Error(toe.error.message);
    expect(sequent(q, toe.value.y1)).toBeCloseTo((x.tailwater as number) + d, 7);
    const here = solveToeDepth({ section: basin, discharge: q, head, lossCoefficient: k });
    expect(here.ok && x.y1).toBeCloseTo(here.ok ? here.value.y1 : Number.NaN, 10);
  });

  it('needs more lowering than the first-order guess y2 − TW when swept out (a deeper apron also raises y2)', () => {
    for (const x of r.value.rows) if (x.state === 'swept-out') expect(x.apronLowering as number).toBeGreaterThan(-(x.margin as number));
  });
});

describe('Manning tailwater', () => {
  it('uses the normal depth of the channel as tailwater', () => {
    const channel: Section = { shape: 'trapezoidal', width: 8, sideSlope: 2 };
    const r = ok({ section: channel, discharges: [50], toe: { method: 'gate', opening: 0.6 }, tailwater: { method: 'manning', n: 0.03, slope: 0.0008 } });
    expect(r.value.rows[0]?.tailwater).toBeCloseTo(normalDepth(channel, 50, 0.03, 0.0008), 12);
    expect(r.value.rows[0]?.y1).toBeCloseTo(0.6 * 0.61, 12);
  });

  it('runs a 500-flow sweep quickly', () => {
    const input: TailwaterCheckInput = { section: { shape: 'trapezoidal', width: 12, sideSlope: 1.5 }, discharges: dischargeRange(10, 400, 500), toe: { method: 'head', head: 15, lossCoefficient: 0.05 }, tailwater: { method: 'manning', n: 0.03, slope: 0.0005 } };
    ok(input);
    const t0 = performance.now();
    ok(input);
    // Generous bound for shared CI machines; scripts/bench.ts measures the ≤ 5 ms goal.
    expect(performance.now() - t0).toBeLessThan(100);
  });
});

describe('jump-type warnings over the range', () => {
  it('counts flows in the oscillating range 2.5 ≤ Fr1 < 4.5 (Chow 1959, ch. 15)', () => {
    const g = 9.80665;
    const y1 = 0.5;
    const q = (fr: number) => fr * Math.sqrt(g * y1) * y1 * 10;
    const r = ok({ section: basin, discharges: [q(2), q(3), q(4), q(6)], toe: { method: 'depth', y1 }, tailwater: { method: 'table', discharge: [0, 200], depth: [1, 8] } });
    const w = r.warnings.find((x) => x.code === 'oscillating-jump');
    expect(w?.message).toMatch(/^At 2 of 4 flows/);
  });
});
