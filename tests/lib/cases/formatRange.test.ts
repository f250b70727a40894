import { describe, expect, it } from 'vitest';
import { formatRange } from '../../../src/lib/cases/keyFigures';

describe('formatRange(min, max, unit?)', () => {
  it.each([
    [null, null, '', '—'],
    [null, 5, '', '—'],
    [5.261, 15.43, '', '5.26–15.4'],
    [5.2612, 5.2649, '', '5.26'],
    [40, 280, 'm³/s', '40.0–280 m³/s'],
    [0.62, 0.62, 'm', '0.620 m'],
  ])('formats %s … %s %s as %s', (min, max, unit, expected) => {
    expect(formatRange(min, max, unit)).toBe(expected);
  });
});
