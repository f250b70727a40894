import { describe, expect, it } from 'vitest';
import { jumpProfileLayout, scaleNote } from '@/components/charts/jumpProfile';

const BOX = { left: 24, bed: 168, width: 592, height: 136 };

describe('jumpProfileLayout', () => {
  it.each([
    ['y2 not above y1', { y1: 2, y2: 1 }],
    ['equal depths', { y1: 1, y2: 1 }],
    ['NaN', { y1: Number.NaN, y2: 1 }],
    ['a zero depth', { y1: 0, y2: 1 }],
  ])('is null for %s', (_t, input) => {
    expect(jumpProfileLayout(input, BOX)).toBeNull();
  });

  it('draws a jump of usual proportions (Lj ≈ 6.1·y2) to scale', () => {
    const l = jumpProfileLayout({ y1: 0.534, y2: 4.118, jumpLength: 25.12, rollerLength: 18.35 }, BOX)!;
    expect(l.exaggeration).toBe(1);
    expect(scaleNote(l)).toBe('To scale');
    expect(l.px(l.length)).toBeCloseTo(BOX.left + BOX.width, 9);
    expect(l.py(4.118)).toBeGreaterThanOrEqual(BOX.bed - BOX.height);
  });

  it('exaggerates the vertical scale of a long, shallow jump and says so', () => {
    const l = jumpProfileLayout({ y1: 0.1, y2: 0.5, jumpLength: 20 }, BOX)!;
    expect(l.exaggeration).toBeGreaterThan(1);
    expect(BOX.bed - l.py(0.5)).toBeCloseTo(BOX.height * 0.62, 9);
    expect(scaleNote(l)).toMatch(/^Vertical scale exaggerated ×\d/);
  });

  it('reduces the vertical scale of a short, deep jump to fit the box', () => {
    const l = jumpProfileLayout({ y1: 1, y2: 10, jumpLength: 5 }, BOX)!;
    expect(l.exaggeration).toBeLessThan(1);
    expect(BOX.bed - l.py(10)).toBeCloseTo(BOX.height * 0.9, 9);
    expect(scaleNote(l)).toMatch(/^Vertical scale reduced/);
  });

  it('estimates an unknown jump length as 6.1·y2 and calls the sketch schematic', () => {
    const l = jumpProfileLayout({ y1: 0.5, y2: 3 }, BOX)!;
    expect(l.jumpLength).toBeCloseTo(18.3, 9);
    expect(l.lengthKnown).toBe(false);
    expect(scaleNote(l)).toMatch(/not to scale/);
  });

  it('rises from y1 at the toe to y2 over the roller, never falling, then stays level', () => {
    const l = jumpProfileLayout({ y1: 0.5, y2: 3, jumpLength: 18, rollerLength: 12 }, BOX)!;
    const s = l.surface;
    expect(s[0]).toEqual([0, 0.5]);
    expect(s[1]).toEqual([l.toe, 0.5]);
    expect(s[s.length - 1]).toEqual([l.length, 3]);
    for (let i = 1; i < s.length; i += 1) {
      expect(s[i]![0]).toBeGreaterThanOrEqual(s[i - 1]![0]);
      expect(s[i]![1]).toBeGreaterThanOrEqual(s[i - 1]![1]);
    }
    const end = s.find(([x]) => Math.abs(x - (l.toe + 12)) < 1e-9);
    expect(end?.[1]).toBeCloseTo(3, 12);
  });

  it('never draws the roller longer than the jump', () => {
    expect(jumpProfileLayout({ y1: 0.3, y2: 4.5, jumpLength: 27, rollerLength: 40 }, BOX)!.rollerLength).toBe(27);
  });
});
