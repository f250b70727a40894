import { describe, expect, it } from 'vitest';
import { csvCell, csvRow } from '../../../src/lib/audit/csv';

describe('csvCell(value)', () => {
  it.each([
    [null, ''],
    [undefined, ''],
    ['plain', 'plain'],
    [42, '42'],
    ['a,b', '"a,b"'],
    ['say "hi"', '"say ""hi"""'],
    ['two\nlines', '"two\nlines"'],
    [' padded ', '" padded "'],
    [new Date('2026-12-02T03:04:05.678Z'), '2026-12-02T03:04:05.678Z'],
  ])('writes %j as %j', (value, expected) => expect(csvCell(value)).toBe(expected));

  it.each(['=1+1', '+41 22', '-2', '@SUM(A1)', '\tx', '\rx'])('guards %j against running as a formula', (value) => {
    expect(csvCell(value).replace(/^"/, '').startsWith(`'${value[0]}`)).toBe(true);
  });

  it('quotes a guarded cell that also needs quoting', () => {
    expect(csvCell('=HYPERLINK("x"), y')).toBe(`"'=HYPERLINK(""x""), y"`);
  });
});

describe('csvRow(values)', () => {
  it('joins with commas and ends with CRLF', () => expect(csvRow(['a', 'b,c', null])).toBe('a,"b,c",\r\n'));
});
