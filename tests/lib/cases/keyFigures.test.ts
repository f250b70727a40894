import { describe, expect, it } from 'vitest';
import type { BlockResult, CaseEvaluation } from '../../../src/lib/calc';
import { evaluateCase } from '../../../src/lib/calc';
import { keyFigures, NO_KEY_FIGURES } from '../../../src/lib/cases/keyFigures';

const fence = (info: string, ...lines: string[]) => ['```' + info, ...lines, '```'].join('\n');
const g = 9.80665;

// Rectangular jump from first principles: V1 = Q/(b·y1), Fr1 = V1/√(g·y1), Bélanger
// y2/y1 = ½(√(1 + 8·Fr1²) − 1) (Chow 1959, Open-Channel Hydraulics, §15-2), E = y + V²/2g.
function rectangularJump(b: number, q: number, y1: number) {
  const v1 = q / (b * y1);
  const fr1 = v1 / Math.sqrt(g * y1);
  const y2 = (y1 / 2) * (Math.sqrt(1 + 8 * fr1 * fr1) - 1);
  const e1 = y1 + (v1 * v1) / (2 * g);
  const v2 = q / (b * y2);
  const e2 = y2 + (v2 * v2) / (2 * g);
  return { v1, fr1, y2, relativeLoss: (e1 - e2) / e1 };
}

describe('keyFigures(evaluation)', () => {
  it('gives no figures for a body without blocks', () => {
    expect(keyFigures(evaluateCase('Only prose.'))).toEqual(NO_KEY_FIGURES);
  });

  it('never throws for a missing evaluation', () => {
    expect(keyFigures(undefined as unknown as CaseEvaluation)).toEqual(NO_KEY_FIGURES);
  });

  it('takes Fr1, discharge, V1, y1, y2 and ΔE/E1 from one jump block', () => {
    const figures = keyFigures(evaluateCase(fence('jump', 'b = 12 m', 'Q = 85 m3/s', 'y1 = 0.62 m')));
    const expected = rectangularJump(12, 85, 0.62);
    expect(figures.fr1Min).toBeCloseTo(expected.fr1, 9);
    expect(figures.fr1Max).toBeCloseTo(expected.fr1, 9);
    expect(figures.dischargeMin).toBe(85);
    expect(figures.dischargeMax).toBe(85);
    expect(figures.v1).toBeCloseTo(expected.v1, 9);
    expect(figures.y1).toBe(0.62);
    expect(figures.y2).toBeCloseTo(expected.y2, 9);
    expect(figures.relativeLoss).toBeCloseTo(expected.relativeLoss, 9);
    // A shape left out is the kind's default.
    expect(figures.sectionShapes).toEqual(['rectangular']);
    expect(figures.calcKinds).toEqual(['hydraulic-jump']);
  });

  it('spans the range over several blocks and converts US customary inputs to SI', () => {
    const body = [
      fence('jump', 'b = 12 m', 'Q = 85 m3/s', 'y1 = 0.62 m'),
      fence('jump', 'shape = trapezoidal', 'b = 6 m', 'z = 1.5', 'Q = 40 m3/s', 'y1 = 0.9 m'),
      fence('jump', 'units = US', 'b = 40', 'Q = 1000', 'y1 = 1.5'),
    ].join('\n\n');
    const evaluation = evaluateCase(body);
    const fr1s = evaluation.blocks.map((b) => b.outputs.find((o) => o.name === 'fr1')!.si as number);
    const figures = keyFigures(evaluation);
    expect(figures.fr1Min).toBe(Math.min(...fr1s));
    expect(figures.fr1Max).toBe(Math.max(...fr1s));
    // 1000 ft³/s = 28.317 m³/s; 1.5 ft = 0.4572 m.
    expect(figures.dischargeMin).toBeCloseTo(1000 * 0.3048 ** 3, 9);
    expect(figures.dischargeMax).toBe(85);
    expect(figures.y1).toBeCloseTo(1.5 * 0.3048, 12);
    expect(figures.sectionShapes).toEqual(['rectangular', 'trapezoidal']);
  });

  it('reads the Fr1 and discharge columns of a tailwater sweep', () => {
    const body = fence('tailwater', 'b = 12 m', 'Q = 20 to 100 m3/s step 20', 'toe = head', 'H = 9.5 m', 'rating:', '  Q m3/s | TW m', '  10 | 1.6', '  60 | 3.4', '  120 | 5.2');
    const evaluation = evaluateCase(body);
    const block = evaluation.blocks[0]!;
    expect(block.status).toBe('ok');
    const column = block.table!.columns.findIndex((c) => c.name === 'fr1');
    const fr1s = block.table!.rows.map((r) => r[column]).filter((x): x is number => typeof x === 'number');
    const figures = keyFigures(evaluation);
    expect(figures).toMatchObject({ fr1Min: Math.min(...fr1s), fr1Max: Math.max(...fr1s), dischargeMin: 20, dischargeMax: 100 });
    expect(figures.calcKinds).toEqual(['tailwater-check']);
  });

  it('leaves out blocks with errors', () => {
    const body = [fence('jump', 'b = 12 m', 'Q = 85 m3/s', 'y1 = -1 m'), fence('gate', 'nonsense'), fence('weir', 'Q = 5')].join('\n\n');
    expect(keyFigures(evaluateCase(body))).toEqual(NO_KEY_FIGURES);
  });

  it('skips values that are not finite numbers', () => {
    const block = {
      status: 'ok',
      kind: 'made-up',
      inputs: [],
      outputs: [
        { name: 'fr1', si: Number.NaN },
        { name: 'fr1', si: null },
        { name: 'fr1', si: 'strong' },
        { name: 'y2', si: Number.POSITIVE_INFINITY },
        { name: 'discharge', si: [10, 30] },
      ],
      table: { columns: [{ name: 'fr1' }], rows: [[null], ['n/a'], [3.5]], text: [] },
    } as unknown as BlockResult;
    expect(keyFigures({ blocks: [block], solverVersion: 'test' })).toMatchObject({
      fr1Min: 3.5,
      fr1Max: 3.5,
      y2: null,
      dischargeMin: 10,
      dischargeMax: 30,
      sectionShapes: [],
      calcKinds: ['made-up'],
    });
  });
});
