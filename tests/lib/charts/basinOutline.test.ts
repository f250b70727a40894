import { describe, expect, it } from 'vitest';
import { BASIN_BOX, basinOutlineInput, basinOutlineLayout, stackLabels, type BasinOutlineInput } from '@/components/charts/basinOutline';
import { scaleNote } from '@/components/charts/jumpProfile';
import { evaluateCase } from '@/lib/calc';

/** A USBR III basin for y1 = 0.5 m, V1 = 14 m/s, TW = 4.6 m (the solver's outputs, rounded). */
const USBR3: BasinOutlineInput = {
  basinLength: 11.41, governingY1: 0.5, governingY2: 4.228, tailwater: 4.6, requiredTailwater: 4.228, margin: 0.372,
  chuteBlockHeight: 0.5, baffleHeight: 0.846, baffleWidth: 0.635, baffleDistance: 3.382, endSillHeight: 0.676, sillToothWidth: null,
};

const block = (lines: string[]) => evaluateCase(['```basin pick', ...lines, '```'].join('\n')).blocks[0]!;

describe('basinOutlineLayout', () => {
  it.each([
    ['NaN basin length', { basinLength: Number.NaN }],
    ['zero basin length', { basinLength: 0 }],
    ['infinite tailwater', { tailwater: Number.POSITIVE_INFINITY }],
    ['a negative toe depth', { governingY1: -0.5 }],
    ['a jump that does not rise', { governingY2: 0.4 }],
  ])('is null for %s', (_t, change) => {
    expect(basinOutlineLayout({ ...USBR3, ...change })).toBeNull();
  });

  it('draws a basin of usual proportions to scale, inside the box', () => {
    const l = basinOutlineLayout(USBR3)!;
    expect(l.exaggeration).toBe(1);
    expect(scaleNote(l)).toBe('To scale');
    expect(l.px(l.xMin)).toBeCloseTo(BASIN_BOX.left, 9);
    expect(l.px(l.xMax)).toBeCloseTo(BASIN_BOX.left + BASIN_BOX.width, 9);
    expect(BASIN_BOX.bed - l.py(l.zMax)).toBeLessThanOrEqual(BASIN_BOX.height + 1e-9);
  });

  it('keeps a short, deep basin to scale by giving the spare width to the chute and the downstream reach', () => {
    const l = basinOutlineLayout({ ...USBR3, basinLength: 1.2, governingY2: 5, tailwater: 5.5, requiredTailwater: 5 })!;
    expect(l.exaggeration).toBe(1);
    expect(BASIN_BOX.bed - l.py(l.zMax)).toBeCloseTo(BASIN_BOX.height, 9);
    expect(l.px(l.xMax) - l.px(l.xMin)).toBeCloseTo(BASIN_BOX.width, 9);
    expect(l.chute[0][1]).toBeLessThanOrEqual(l.zMax);
  });

  it('exaggerates the vertical scale of a shallow, long basin and says so', () => {
    const l = basinOutlineLayout({ ...USBR3, basinLength: 80, governingY2: 2, tailwater: 2.1, requiredTailwater: 2 })!;
    expect(l.exaggeration).toBeGreaterThan(1.25);
    expect(BASIN_BOX.bed - l.py(l.zMax)).toBeCloseTo(64, 9);
    expect(scaleNote(l)).toMatch(/^Vertical scale exaggerated ×\d/);
  });

  it('puts the baffles at baffleDistance from the toe and the sill at basinLength, at their heights', () => {
    const l = basinOutlineLayout(USBR3)!;
    const xs = (pts: readonly (readonly [number, number])[]) => pts.map((p) => p[0]);
    const zs = (pts: readonly (readonly [number, number])[]) => pts.map((p) => p[1]);
    expect(Math.min(...xs(l.baffle!))).toBeCloseTo(3.382, 12);
    expect(Math.max(...xs(l.baffle!)) - Math.min(...xs(l.baffle!))).toBeCloseTo(0.635, 12);
    expect(Math.max(...zs(l.baffle!))).toBeCloseTo(0.846, 12);
    expect(Math.max(...xs(l.sill!))).toBeCloseTo(11.41, 12);
    expect(Math.max(...zs(l.sill!))).toBeCloseTo(0.676, 12);
    expect(Math.min(...xs(l.chuteBlock!))).toBe(0);
    expect(Math.max(...xs(l.chuteBlock!))).toBeCloseTo(1, 12); // drawn 2·h1 long
    expect(l.chute[1]).toEqual([0, 0]);
    expect(l.sillSlotLevel).toBeNull();
  });

  it('rises from the governing y1 at the toe to y2 at the sill, never falling over the basin', () => {
    const s = basinOutlineLayout(USBR3)!.surface;
    const toe = s.findIndex(([x]) => x === 0);
    expect(s[toe]![1]).toBe(0.5);
    expect(s[s.length - 1]![0]).toBeCloseTo(11.41, 12);
    expect(s[s.length - 1]![1]).toBeCloseTo(4.228, 12);
    for (let i = toe + 1; i < s.length; i += 1) expect(s[i]![1]).toBeGreaterThanOrEqual(s[i - 1]![1]);
  });

  it('leaves out the elements a family does not have, and marks a dentated sill', () => {
    const natural = basinOutlineLayout({ ...USBR3, chuteBlockHeight: null, baffleHeight: null, baffleWidth: null, baffleDistance: null, endSillHeight: null })!;
    expect([natural.chuteBlock, natural.baffle, natural.sill]).toEqual([null, null, null]);
    expect(natural.labels).toEqual([]);
    const dentated = basinOutlineLayout({ ...USBR3, baffleHeight: null, endSillHeight: 0.85, sillToothWidth: 0.63 })!;
    expect(dentated.baffle).toBeNull();
    expect(dentated.sillSlotLevel).toBeCloseTo(0.425, 12);
  });
});

describe('stackLabels', () => {
  const px = (x: number) => x * 10;
  it('keeps labels that clear each other in the first row and drops an overlapping one to the next', () => {
    const rows = stackLabels([
      { key: 'chute', x: 0, anchor: 'start', width: 100 },
      { key: 'baffle', x: 8, anchor: 'middle', width: 100 },
      { key: 'sill', x: 40, anchor: 'end', width: 100 },
    ], px);
    expect(rows.map((r) => r.row)).toEqual([0, 1, 0]);
  });
});

describe('basinOutlineInput', () => {
  it('reads a solved basin block', () => {
    const b = block(['y1 = 0.5 m', 'V1 = 14 m/s', 'TW = 4.6 m']);
    const input = basinOutlineInput(b)!;
    expect(input.basinLength).toBeCloseTo(11.41, 2);
    expect(input.baffleDistance).toBeCloseTo(3.382, 3);
    expect(input.sillToothWidth).toBeNull();
  });

  it('is null when no family fits, and for other kinds', () => {
    expect(basinOutlineInput(block(['y1 = 0.5 m', 'V1 = 3.0 m/s', 'TW = 1 m']))).toBeNull();
    expect(basinOutlineInput({ ...block(['y1 = 0.5 m', 'V1 = 14 m/s', 'TW = 4.6 m']), kind: 'hydraulic-jump' })).toBeNull();
  });
});

describe('basinOutlineLayout at the extremes', () => {
  it('keeps a tall sill on a short basin inside the basin, and drops baffles that would run into it', () => {
    const l = basinOutlineLayout({ ...USBR3, basinLength: 2, governingY1: 0.3, governingY2: 2.5, tailwater: 2.6, requiredTailwater: 2.5, chuteBlockHeight: 0.3, endSillHeight: 1.2, baffleHeight: 0.5, baffleWidth: 0.4, baffleDistance: 1.5 })!;
    expect(l).not.toBeNull();
    expect(Math.min(...l.sill!.map(([x]) => x))).toBeGreaterThanOrEqual(0);
    expect(l.baffle).toBeNull();
  });
});
