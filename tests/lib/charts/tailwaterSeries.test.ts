import { describe, expect, it } from 'vitest';
import { tailwaterSeries } from '@/components/charts/tailwaterSeries';
import type { BlockResult } from '@/lib/calc';
import { BROKEN, JUMP, TAILWATER } from './fixtures';

describe('tailwaterSeries', () => {
  it('is null for blocks without rows', () => {
    expect(tailwaterSeries(JUMP)).toBeNull();
    expect(tailwaterSeries(BROKEN)).toBeNull();
  });

  it('reads Q, y2, TW and the jump position of every flow, SI', () => {
    const s = tailwaterSeries(TAILWATER)!;
    expect(s.points.map((p) => p.q)).toEqual([20, 30, 40, 50, 60, 70, 80, 90, 100]);
    expect(s.points[0]).toMatchObject({ q: 20, tw: 1.96, state: 'swept-out' });
    expect(s.points[0]!.y2).toBeCloseTo(2.0864, 3);
    expect(s.sweptOut).toBe(s.points.filter((p) => p.tw! < p.y2! * 0.95).length);
    expect(s.qMin).toBe(20);
    expect(s.qMax).toBe(100);
    expect(s.depthMax).toBeCloseTo(4.6, 9);
    expect(s.depthMin).toBeCloseTo(1.96, 9);
  });

  it('sorts flows by discharge and keeps missing depths as null', () => {
    const table = TAILWATER.table!;
    const rows = [...table.rows].reverse().map((r, k) => (k === 0 ? r.map((c, i) => (i === 3 ? null : c)) : r));
    const s = tailwaterSeries({ ...TAILWATER, table: { ...table, rows } } as BlockResult)!;
    expect(s.points[0]!.q).toBe(20);
    expect(s.points[s.points.length - 1]!.y2).toBeNull();
  });
});
