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
    // The extent covers the rating's own points too (the fixture's rating runs from 10 m³/s).
    const ratingQ = s.rating.map((r) => r.q);
    expect(s.rating.length).toBeGreaterThan(1);
    expect(s.ratingSource).toBeNull();
    expect(s.qMin).toBe(Math.min(20, ...ratingQ));
    expect(s.qMax).toBe(Math.max(100, ...ratingQ));
    expect(s.depthMin).toBeLessThanOrEqual(1.96);
  });

  it('shows a stage rating as depth above the apron, and names its file', () => {
    const tables = [{ name: 'tailwaterRating', label: 'Tailwater rating', source: 'tw.csv', rowNumbers: [2, 3], columns: { discharge: [10, 100], stage: [101.5, 104] } }];
    const inputs = [...TAILWATER.inputs, { name: 'apronLevel', label: 'Apron level', symbol: 'apron', latex: '', quantity: 'length', si: 100, text: '100', unit: 'm' }];
    const s = tailwaterSeries({ ...TAILWATER, inputs, tables } as BlockResult)!;
    expect(s.rating).toEqual([{ q: 10, depth: 1.5 }, { q: 100, depth: 4 }]);
    expect(s.ratingSource).toBe('tw.csv');
  });

  it('sorts flows by discharge and keeps missing depths as null', () => {
    const table = TAILWATER.table!;
    const rows = [...table.rows].reverse().map((r, k) => (k === 0 ? r.map((c, i) => (i === 3 ? null : c)) : r));
    const s = tailwaterSeries({ ...TAILWATER, table: { ...table, rows } } as BlockResult)!;
    expect(s.points[0]!.q).toBe(20);
    expect(s.points[s.points.length - 1]!.y2).toBeNull();
  });
});
