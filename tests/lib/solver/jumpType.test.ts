/** Jump types by Fr1: Chow, V. T., 1959, Open-Channel Hydraulics, ch. 15 (ranges from memory). */
import { describe, expect, it } from 'vitest';
import { JUMP_TYPE_BOUNDS, JUMP_TYPES, jumpType } from '@/lib/solver/jumpType';

describe('jumpType(fr1)', () => {
  it.each([Number.NaN, 1, 0.5, -2])('throws RangeError for Fr1 = %f (no jump: a programmer error to ask)', (fr) => {
    expect(() => jumpType(fr)).toThrow(RangeError);
  });

  it.each(JUMP_TYPES.map((t) => [t, JUMP_TYPE_BOUNDS[t]] as const))('starts %s at Fr1 = %f', (type, bound) => {
    expect(jumpType(bound === 1 ? 1.0001 : bound)).toBe(type);
  });

  it('is strong for any huge Fr1', () => {
    expect(jumpType(1e9)).toBe('strong');
  });
});
