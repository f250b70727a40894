import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BLOCK_TEMPLATES, evaluateCase, type CaseEvaluation } from '../../../src/lib/calc';
import { compareEvaluations, DRIFT_TOLERANCE, MAX_TABLE_CELLS_LISTED, withinTolerance } from '../../../src/lib/review/drift';

const BODY = `Worked case.\n\n${BLOCK_TEMPLATES.map((t) => t.text).join('\n\n')}\n`;
const base = evaluateCase(BODY);

/** A deep copy whose block `b`'s output `name` has its SI value changed by `change`. */
function withOutput(evaluation: CaseEvaluation, b: number, name: string, change: (v: unknown) => unknown): CaseEvaluation {
  const copy = structuredClone(evaluation) as { blocks: Array<{ outputs: Array<{ name: string; si: unknown }> }> } & CaseEvaluation;
  const output = copy.blocks[b]!.outputs.find((o) => o.name === name)!;
  output.si = change(output.si);
  return copy;
}

const numericOutputs = base.blocks.flatMap((block, b) => block.outputs.filter((o) => typeof o.si === 'number' && o.si !== 0).map((o) => ({ b, name: o.name })));

describe('withinTolerance(approved, current)', () => {
  it('treats NaN as equal only to NaN and infinities only to themselves', () => {
    expect(withinTolerance(Number.NaN, Number.NaN)).toBe(true);
    expect(withinTolerance(Number.NaN, 1)).toBe(false);
    expect(withinTolerance(Infinity, Infinity)).toBe(true);
    expect(withinTolerance(Infinity, 1e300)).toBe(false);
  });

  it('uses the absolute floor at zero', () => {
    expect(withinTolerance(0, 1e-12)).toBe(true);
    expect(withinTolerance(0, 1e-6)).toBe(false);
    expect(withinTolerance(-0, 0)).toBe(true);
  });

  it('is relative to the approved value', () => {
    expect(withinTolerance(4.137, 4.137 * 1.0009)).toBe(true);
    expect(withinTolerance(4.137, 4.137 * 1.0011)).toBe(false);
    expect(withinTolerance(-2, -2.01)).toBe(false);
  });
});

describe('compareEvaluations(approved, current)', () => {
  it('finds nothing between an evaluation and a fresh one of the same body', () => {
    expect(base.blocks.every((b) => b.status === 'ok')).toBe(true);
    expect(compareEvaluations(base, evaluateCase(BODY))).toEqual([]);
  });

  it('names the block and the figure, with both values, texts, unit and relative difference', () => {
    const approved = withOutput(base, 0, 'y2', (v) => (v as number) * 1.05);
    const [found, ...rest] = compareEvaluations(approved, base);
    expect(rest).toEqual([]);
    const y2 = base.blocks[0]!.outputs.find((o) => o.name === 'y2')!;
    expect(found).toMatchObject({ index: 0, name: 'basin', title: base.blocks[0]!.title, change: 'figures', approvedStatus: 'ok', currentStatus: 'ok' });
    expect(found!.figures).toHaveLength(1);
    expect(found!.figures[0]).toMatchObject({ name: 'y2', label: 'Sequent depth', symbol: 'y2', unit: 'm', current: { value: y2.si, text: y2.text } });
    expect(found!.figures[0]!.approved!.value).toBeCloseTo((y2.si as number) * 1.05, 12);
    expect(found!.figures[0]!.relativeDifference).toBeCloseTo(1 / 1.05 - 1, 9);
  });

  it('compares text values exactly', () => {
    const textual = base.blocks.flatMap((block, b) => block.outputs.filter((o) => typeof o.si === 'string').map((o) => ({ b, name: o.name })));
    expect(textual.length).toBeGreaterThan(0);
    const { b, name } = textual[0]!;
    const approved = withOutput(base, b, name, (v) => `${v as string} `);
    const found = compareEvaluations(approved, base);
    expect(found).toHaveLength(1);
    expect(found[0]!.figures[0]).toMatchObject({ name, relativeDifference: null });
  });

  it('reports a figure that became undefined or appeared', () => {
    const approved = withOutput(base, 0, 'y2', () => null);
    expect(compareEvaluations(approved, base)[0]!.figures[0]).toMatchObject({ name: 'y2', approved: { value: null } });
    const fewer = structuredClone(base) as unknown as { blocks: Array<{ outputs: unknown[] }> };
    fewer.blocks[0]!.outputs = fewer.blocks[0]!.outputs.slice(1);
    const found = compareEvaluations(fewer as unknown as CaseEvaluation, base);
    expect(found[0]!.figures[0]).toMatchObject({ approved: null, current: { value: base.blocks[0]!.outputs[0]!.si } });
  });

  it('reports blocks that appeared, disappeared or changed between results and errors', () => {
    const shorter: CaseEvaluation = { ...base, blocks: base.blocks.slice(0, -1) };
    expect(compareEvaluations(shorter, base)).toEqual([expect.objectContaining({ index: base.blocks.length - 1, change: 'appeared', approvedStatus: null, currentStatus: 'ok' })]);
    expect(compareEvaluations(base, shorter)).toEqual([expect.objectContaining({ change: 'disappeared', approvedStatus: 'ok', currentStatus: null })]);
    const broken = evaluateCase(BODY.replace('Q = 85 m3/s', 'Q = -85 m3/s'));
    expect(broken.blocks[0]!.status).toBe('error');
    expect(compareEvaluations(base, broken)).toEqual([expect.objectContaining({ index: 0, change: 'status', approvedStatus: 'ok', currentStatus: 'error' })]);
    expect(compareEvaluations(broken, broken)).toEqual([]);
  });

  it('compares sweep cells, naming the row, and caps the list', () => {
    const t = base.blocks.findIndex((b) => b.table);
    expect(t).toBeGreaterThanOrEqual(0);
    const approved = structuredClone(base) as unknown as { blocks: Array<{ table: { rows: Array<Array<number | string | null>> } }> };
    const rows = approved.blocks[t]!.table.rows;
    const numericColumn = rows[0]!.findIndex((v, c) => c > 0 && typeof v === 'number' && v !== 0);
    rows[2]![numericColumn] = (rows[2]![numericColumn] as number) * 2;
    const [found] = compareEvaluations(approved as unknown as CaseEvaluation, base);
    expect(found).toMatchObject({ index: t, change: 'figures', moreTableCells: 0 });
    expect(found!.figures).toHaveLength(1);
    const cell = found!.figures[0]!;
    expect(cell).toMatchObject({ row: 2 });
    expect(cell.rowLabel).toContain(base.blocks[t]!.table!.text[2]![0]!);
    expect(cell.current!.text).toBe(base.blocks[t]!.table!.text[2]![numericColumn]);

    for (const row of rows) for (let c = 1; c < row.length; c++) if (typeof row[c] === 'number' && row[c] !== 0) row[c] = (row[c] as number) * 3;
    const [many] = compareEvaluations(approved as unknown as CaseEvaluation, base);
    expect(many!.figures.length).toBe(MAX_TABLE_CELLS_LISTED);
    expect(many!.moreTableCells).toBeGreaterThan(0);
  });

  it('never finds drift between an evaluation and itself (property)', () => {
    fc.assert(
      fc.property(fc.constantFrom(...numericOutputs), fc.double({ min: -1e6, max: 1e6, noNaN: true }), ({ b, name }, value) => {
        const e = withOutput(base, b, name, () => value);
        expect(compareEvaluations(e, structuredClone(e))).toEqual([]);
      }),
    );
  });

  it('always finds a value scaled beyond the tolerance, and never one scaled within it (property)', () => {
    const rel = DRIFT_TOLERANCE.relative;
    fc.assert(
      fc.property(
        fc.constantFrom(...numericOutputs),
        fc.double({ min: 1.01 * rel, max: 10, noNaN: true }),
        fc.double({ min: 0, max: 0.99 * rel, noNaN: true }),
        fc.boolean(),
        ({ b, name }, beyond, within, down) => {
          const sign = down ? -1 : 1;
          const far = withOutput(base, b, name, (v) => (v as number) * (1 + sign * Math.min(beyond, down ? 0.99 : beyond)));
          const near = withOutput(base, b, name, (v) => (v as number) * (1 + sign * within));
          const found = compareEvaluations(base, far);
          expect(found).toHaveLength(1);
          expect(found[0]!.figures.map((f) => f.name)).toEqual([name]);
          expect(compareEvaluations(base, near)).toEqual([]);
        },
      ),
    );
  });
});
