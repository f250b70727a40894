/**
 * Sluice gate in free flow. Sources per check:
 * - q = y0·y1·√(2g/(y0 + y1)) with y1 = Cc·a, and Cd = Cc/√(1 + Cc·a/y0): Henderson, F. M.,
 *   1966, Open Channel Flow, ch. 6, sluice gates (from memory).
 * - Cc ≈ 0.61 and Cd ≈ 0.59 at small openings: common practice.
 */
import { describe, expect, it } from 'vitest';
import { solveSluiceGate, type SluiceGateInput } from '@/lib/solver/sluiceGate';

const g = 9.80665;

function ok(input: SluiceGateInput) {
  const r = solveSluiceGate(input);
  if (!r.ok) throw new Error(`${r.error.code}: ${r.error.message}`);
  return r;
}

describe('solveSluiceGate(input) rejects invalid input', () => {
  it.each([
    [{ width: 0, opening: 0.5, upstreamDepth: 3 }, 'invalid-input', 'width'],
    [{ width: 2, opening: Number.NaN, upstreamDepth: 3 }, 'invalid-input', 'opening'],
    [{ width: 2, opening: 0.5, contractionCoefficient: 1.2, upstreamDepth: 3 }, 'invalid-input', 'contractionCoefficient'],
    [{ width: 2, opening: 0.5, upstreamDepth: -3 }, 'invalid-input', 'upstreamDepth'],
    [{ width: 2, opening: 0.5 }, 'conflicting-input', 'upstreamDepth'],
    [{ width: 2, opening: 0.5, upstreamDepth: 3, discharge: 4 }, 'conflicting-input', 'discharge'],
    [{ width: 2, opening: 0.5, upstreamDepth: 0.4 }, 'gate-not-submerged', 'upstreamDepth'],
  ])('%j → %s on %s', (input, code, field) => {
    const r = solveSluiceGate(input as SluiceGateInput);
    expect(!r.ok && r.error.code).toBe(code);
    expect(!r.ok && r.error.field).toBe(field);
  });
});

describe('free flow under a vertical gate (Henderson 1966, ch. 6, from memory)', () => {
  const r = ok({ width: 3, opening: 0.4, upstreamDepth: 4 });

  it('contracts to y1 = 0.61·a by default (common practice)', () => {
    expect(r.value.y1).toBeCloseTo(0.244, 12);
  });

  it('conserves energy from upstream to the vena contracta', () => {
    const { y1, upstreamDepth: y0, unitDischarge: q } = r.value;
    expect(y0 + q ** 2 / (2 * g * y0 ** 2)).toBeCloseTo(y1 + q ** 2 / (2 * g * y1 ** 2), 10);
  });

  it('has Cd = Cc/√(1 + Cc·a/y0) ≈ 0.59 at a small opening', () => {
    expect(r.value.dischargeCoefficient).toBeCloseTo(0.61 / Math.sqrt(1 + 0.244 / 4), 12);
    expect(r.value.dischargeCoefficient).toBeCloseTo(0.59, 2);
  });

  it('round-trips y0 → Q → y0', () => {
    const back = ok({ width: 3, opening: 0.4, discharge: r.value.discharge });
    expect(back.value.upstreamDepth).toBeCloseTo(4, 10);
  });

  it('gives supercritical flow at the vena contracta', () => {
    expect(r.value.fr1).toBeGreaterThan(1);
    expect(r.warnings).toEqual([]);
  });

  it.each([
    [{ width: 3, opening: 0.4, contractionCoefficient: 0.8, upstreamDepth: 4 }, 'contraction-coefficient-range'],
    [{ width: 3, opening: 0.4, contractionCoefficient: 0.45, upstreamDepth: 4 }, 'contraction-coefficient-range'],
    [{ width: 3, opening: 1, upstreamDepth: 1.5 }, 'large-gate-opening'],
  ])('warns for %j with %s', (input, code) => {
    expect(ok(input).warnings.map((w) => w.code)).toContain(code);
  });
});
