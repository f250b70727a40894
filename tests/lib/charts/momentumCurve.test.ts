import { describe, expect, it } from 'vitest';
import { jumpCurves, sampleDepths, sectionOfBlock } from '@/components/charts/momentumCurve';
import { momentumFunction } from '@/lib/solver';
import { BROKEN, JUMP, PIPE, SURGE, US_JUMP } from './fixtures';

describe('sectionOfBlock', () => {
  it('reads the section of the block inputs, SI', () => {
    expect(sectionOfBlock(JUMP)).toEqual({ shape: 'rectangular', width: 12 });
    const trap = sectionOfBlock(US_JUMP);
    expect(trap).toMatchObject({ shape: 'trapezoidal', sideSlope: 2 });
    expect(trap && 'width' in trap ? trap.width : 0).toBeCloseTo(3.048, 12);
    expect(sectionOfBlock(PIPE)).toEqual({ shape: 'circular', diameter: 2 });
  });

  it('is null without the dimensions', () => {
    expect(sectionOfBlock(BROKEN)).toBeNull();
  });
});

describe('sampleDepths', () => {
  it('returns [] for empty or non-positive ranges', () => {
    expect(sampleDepths(0, 1, 10)).toEqual([]);
    expect(sampleDepths(2, 1, 10)).toEqual([]);
    expect(sampleDepths(1, 2, 1)).toEqual([]);
  });

  it('spaces depths geometrically, ends included', () => {
    const d = sampleDepths(0.5, 8, 5);
    expect(d[0]).toBe(0.5);
    expect(d[4]).toBeCloseTo(8, 12);
    expect(d[1]! / d[0]!).toBeCloseTo(d[4]! / d[3]!, 12);
  });
});

describe('jumpCurves', () => {
  it('is null for blocks with errors and for kinds without a jump', () => {
    expect(jumpCurves(BROKEN)).toBeNull();
    expect(jumpCurves(SURGE)).toBeNull();
  });

  it.each([
    ['rectangular', JUMP],
    ['trapezoidal (US block, SI curves)', US_JUMP],
    ['circular', PIPE],
  ])('has equal momentum at both conjugate depths in a %s section', (_name, block) => {
    const c = jumpCurves(block)!;
    expect(c).not.toBeNull();
    // Independent of the solver's sequent-depth root: M recomputed at both depths.
    const m2 = momentumFunction(c.section, c.discharge, c.y2, c.g);
    expect(Math.abs(m2 - c.m1) / c.m1).toBeLessThan(1e-6);
    expect(c.y1).toBeLessThan(c.yc);
    expect(c.yc).toBeLessThan(c.y2);
  });

  it('samples M and E between the chart edges, depths increasing, least M at the critical depth', () => {
    const c = jumpCurves(JUMP)!;
    for (const curve of [c.momentum, c.energy]) {
      expect(curve.length).toBe(120);
      for (let i = 1; i < curve.length; i += 1) expect(curve[i]!.y).toBeGreaterThan(curve[i - 1]!.y);
      expect(curve[curve.length - 1]!.y).toBeCloseTo(c.yTop, 9);
    }
    expect(Math.max(...c.momentum.map((p) => p.value))).toBeLessThanOrEqual(c.mMax * (1 + 1e-9));
    expect(Math.max(...c.energy.map((p) => p.value))).toBeLessThanOrEqual(c.eMax * (1 + 1e-9));
    const least = c.momentum.reduce((a, p) => (p.value < a.value ? p : a));
    expect(Math.abs(least.y - c.yc) / c.yc).toBeLessThan(0.05);
    expect(c.e1 - c.e2).toBeCloseTo(JUMP.outputs.find((o) => o.name === 'headLoss')!.si as number, 6);
  });

  it('stops the depth axis below the crown of a conduit', () => {
    const c = jumpCurves(PIPE)!;
    expect(c.yTop).toBeLessThan(2);
  });
});
