import { describe, expect, it } from 'vitest';
import { interpolateRating, validateRatingTable } from '@/lib/solver/tailwaterRating';

const table = { discharge: [10, 50, 100], depth: [1, 2, 3.5] };

describe('validateRatingTable(table)', () => {
  it.each([
    [null],
    [{ discharge: [1], depth: [1] }],
    [{ discharge: [1, 2], depth: [1] }],
    [{ discharge: [1, Number.NaN], depth: [1, 2] }],
    [{ discharge: [2, 1], depth: [1, 2] }],
    [{ discharge: [1, 1], depth: [1, 2] }],
    [{ discharge: [1, 2], depth: [1, 0] }],
    [{ discharge: 'x', depth: [1, 2] }],
  ])('rejects %j', (t) => {
    expect(validateRatingTable(t)?.error.code).toBe('invalid-input');
  });

  it('accepts a strictly increasing table', () => {
    expect(validateRatingTable(table)).toBeNull();
  });
});

describe('interpolateRating(table, Q)', () => {
  it.each([
    [10, 1],
    [30, 1.5],
    [50, 2],
    [75, 2.75],
    [100, 3.5],
  ])('interpolates linearly at Q = %f → %f', (q, y) => {
    expect(interpolateRating(table, q)).toBeCloseTo(y, 12);
  });

  it.each([9.99, 100.01, Number.NaN, -Infinity])('never extrapolates: Q = %f → NaN', (q) => {
    expect(interpolateRating(table, q)).toBeNaN();
  });
});
