/**
 * References to a column of another block's results table: a tailwater sweep feeding a
 * basin screening. The basin's per-flow depths must be the sweep's own, row for row.
 */
import { describe, expect, it } from 'vitest';
import { evaluateCase } from '@/lib/calc';

const fence = (info: string, ...lines: string[]) => ['```' + info, ...lines, '```'].join('\n');
const sweep = (extra: string[] = []) =>
  fence('tailwater check', 'b = 25 m', 'Q = 40 to 280 m3/s step 40', 'toe = head', 'H = 12.0 m', 'rating:', '  Q m3/s | TW m', '  0 | 1.0', '  300 | 6.4', ...extra);

describe('a reference to a results-table column', () => {
  const md = [sweep(), '', fence('basin pick', 'Q = check.Q', 'b = check.b', 'y1 = check.y1', 'TW = check.TW', 'family = usbr3')].join('\n');
  const [check, basin] = evaluateCase(md).blocks;

  it('gives the column as a list, one value per row', () => {
    expect(check!.status).toBe('ok');
    expect(basin!.status).toBe('ok');
    const column = (name: string) => check!.table!.rows.map((r) => r[check!.table!.columns.findIndex((c) => c.name === name)]);
    const input = (name: string) => basin!.inputs.find((i) => i.name === name)!.si;
    expect(input('y1')).toEqual(column('y1'));
    expect(input('tailwater')).toEqual(column('tailwater'));
    expect(input('discharges')).toEqual(column('discharge'));
  });

  it('flags the flows of the sweep whose tailwater is short, by discharge', () => {
    const w = basin!.warnings.find((x) => x.code === 'tailwater-too-low');
    expect(w?.message).toMatch(/at \d of 7 flows/);
    expect(w?.message).toContain('Q = 80 m³/s');
    expect(w?.line).toBe(md.split('\n').indexOf('TW = check.TW') + 1);
  });

  it('refuses a column with rows that have no value, naming the rows', () => {
    // The rating stops at 200 m³/s: the last two flows have no tailwater.
    const short = [fence('tailwater check', 'b = 25 m', 'Q = 40 to 280 m3/s step 40', 'toe = head', 'H = 12.0 m', 'rating:', '  Q m3/s | TW m', '  0 | 1.0', '  200 | 4.4'), fence('basin pick', 'Q = check.Q', 'b = 25 m', 'y1 = check.y1', 'TW = check.TW')].join('\n');
    const b = evaluateCase(short).blocks[1]!;
    expect(b.status).toBe('error');
    expect(b.errors[0]!.message).toBe('check.TW has no value in rows 6, 7 of its results, so it cannot be used as a list. Narrow that block\'s flows to those with a value.');
  });

  it('refuses a column of the wrong quantity and a column of labels', () => {
    const wrong = [sweep(), fence('basin pick', 'Q = check.Q', 'b = 25 m', 'y1 = check.y1', 'TW = check.Q')].join('\n');
    expect(evaluateCase(wrong).blocks[1]!.errors[0]!.message).toBe('check.Q is a list of discharge values, but Tailwater depth is a length.');
    const labels = [sweep(), fence('basin pick', 'Q = check.Q', 'b = 25 m', 'y1 = check.y1', 'TW = check.state')].join('\n');
    expect(evaluateCase(labels).blocks[1]!.errors[0]!.message).toBe('check.state is a column of labels, not numbers.');
  });

  it('takes a scalar result of a toe block as one flow', () => {
    const one = [fence('toe spill', 'b = 12 m', 'Q = 85 m3/s', 'H = 9.5 m'), fence('basin', 'y1 = spill.y1', 'Q = 85 m3/s', 'b = spill.b', 'TW = 4.2 m')].join('\n');
    const [toe, basin1] = evaluateCase(one).blocks;
    expect(basin1!.status).toBe('ok');
    expect(basin1!.outputs.find((o) => o.name === 'y1')!.si).toBe(toe!.outputs.find((o) => o.name === 'y1')!.si);
  });
});

describe('a basin block\'s results leave out what the family has none of', () => {
  const names = (md: string) => evaluateCase(md).blocks[0]!.outputs.map((o) => o.name);
  it('a USBR III basin shows baffles and sill but no sill teeth, and no discharges when none were given', () => {
    const shown = names(fence('basin', 'y1 = 0.5 m', 'V1 = 14 m/s', 'TW = 4.6 m'));
    expect(shown).toEqual(expect.arrayContaining(['family', 'basinLength', 'baffleHeight', 'endSillHeight']));
    expect(shown).not.toEqual(expect.arrayContaining(['sillToothWidth']));
    expect(shown).not.toContain('designDischarge');
  });
  it('when no family fits, no sizes are shown', () => {
    const shown = names(fence('basin', 'y1 = 0.5 m', 'V1 = 3.3 m/s', 'TW = 1.0 m'));
    expect(shown).toContain('family');
    expect(shown).not.toContain('basinLength');
    expect(shown).not.toContain('chuteBlockHeight');
  });
});

describe('references keep their earlier meaning', () => {
  it('an input the block was given wins over the column of the same name (check.y1 with toe = depth)', () => {
    const md = [
      fence('tailwater check', 'b = 10 m', 'Q = 20, 40 m3/s', 'toe = depth', 'y1 = 0.6 m', 'rating:', '  Q m3/s | TW m', '  0 | 1.0', '  100 | 4.0'),
      fence('jump j', 'b = 10 m', 'Q = 40 m3/s', 'y1 = check.y1'),
    ].join('\n');
    const [, jump] = evaluateCase(md).blocks;
    expect(jump!.status).toBe('ok');
    expect(jump!.inputs.find((i) => i.name === 'y1')!.si).toBe(0.6);
  });
});

describe('solver messages in a US block', () => {
  it('a tailwater sweep quotes the apron lowering and the rating range in ft and ft³/s', () => {
    const md = fence('tailwater t', 'units = US', 'b = 30 ft', 'Q = 150 to 900 cfs step 150', 'toe = depth', 'y1 = 0.6 ft', 'rating:', '  Q cfs | TW ft', '  100 | 2.0', '  600 | 3.0');
    const messages = evaluateCase(md).blocks[0]!.warnings.map((w) => w.message).join(' ');
    expect(messages).toMatch(/The largest apron lowering found is \d+(\.\d+)? ft\./);
    expect(messages).toContain('outside the tailwater rating (100 ft³/s to 600 ft³/s)');
    expect(messages).not.toMatch(/\d m\b|m³/);
  });

  it.each([
    ['a jump whose inflow is already subcritical', fence('jump', 'units = US', 'b = 10 ft', 'Q = 100 cfs', 'y1 = 5 ft'), /y1 = 5 ft, critical depth 1\.459 ft/],
    ['a toe asked for more than its head delivers', fence('toe', 'units = US', 'b = 10 ft', 'Q = 5000 cfs', 'H = 3 ft'), /Q = 5000 ft³\/s exceeds the largest discharge the head H = 3 ft can deliver \(Q_max = [\d.]+ ft³\/s/],
    ['a gate above the water', fence('gate', 'units = US', 'b = 10 ft', 'a = 4 ft', 'Cc = 0.61', 'y0 = 3 ft'), /y0 = 3 ft is not above the gate lip \(a = 4 ft\)/],
  ])('%s is explained in ft', (_t, md, message) => {
    const b = evaluateCase(md).blocks[0]!;
    expect(b.errors[0]!.message).toMatch(message);
    expect(b.errors[0]!.message).not.toMatch(/\d m\b|m³/);
  });
});

describe('an inflow given by halves', () => {
  it('Q without b says so on the Q line, in the block\'s symbols', () => {
    const md = fence('basin', 'y1 = 0.5 m', 'Q = 60 m3/s', 'TW = 4 m');
    expect(evaluateCase(md).blocks[0]!.errors[0]).toEqual({ line: 3, message: 'Q needs b (basin width) too: give the inflow as the velocity at the toe, the discharge with the basin width, or the discharge per unit width (one of: V1 | Q + b | q).' });
  });
});
