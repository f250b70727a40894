/**
 * readCsvTable: CSV text → SI columns of a table input (a tailwater rating).
 * Unit factors: 1 ft = 0.3048 m exactly, so 1 cfs = 0.3048³ m³/s = 0.028316846592 m³/s exactly
 * (NIST SP 811 (2008), Appendix B). Rating files here are invented.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readCsvTable, type CsvColumn, type CsvTableOptions, type CsvTableResult } from '../../../src/lib/calc/csvTable';

const CFS = 0.028316846592; // NIST SP 811 (2008), Appendix B
const FT = 0.3048; // NIST SP 811 (2008), Appendix B

const COLUMNS: readonly CsvColumn[] = [
  { name: 'discharge', label: 'Discharge', quantity: 'discharge', aliases: ['Q', 'flow'] },
  { name: 'depth', label: 'Tailwater depth', quantity: 'length', aliases: ['TW', 'tailwater', 'y'] },
  { name: 'stage', label: 'Stage', quantity: 'length', aliases: ['level', 'WL', 'water level', 'elevation'] },
];
const SI: CsvTableOptions = { fileName: 'aldmere-rating.csv', columns: COLUMNS, unitSystem: 'SI' };
const US: CsvTableOptions = { ...SI, unitSystem: 'US' };

const read = (text: string, options: Partial<CsvTableOptions> = {}): CsvTableResult => readCsvTable(text, { ...SI, ...options });
const good = (text: string, options: Partial<CsvTableOptions> = {}) => {
  const result = read(text, options);
  if (!result.ok) throw new Error(`expected a table, got: ${result.message}`);
  return result;
};
const refused = (text: string, options: Partial<CsvTableOptions> = {}) => {
  const result = read(text, options);
  if (result.ok) throw new Error('expected a refusal, got a table');
  return result;
};
const close = (actual: readonly number[], expected: readonly number[]) => {
  expect(actual).toHaveLength(expected.length);
  actual.forEach((x, i) => expect(Math.abs(x - (expected[i] as number))).toBeLessThanOrEqual(1e-12 * Math.abs(expected[i] as number)));
};

describe('readCsvTable: good files', () => {
  it('reads an SI rating with its row numbers and headers', () => {
    const r = good('Q (m3/s),TW (m)\n10,1.2\n20,1.8\n40,2.65\n');
    expect(r.values).toEqual({ discharge: [10, 20, 40], depth: [1.2, 1.8, 2.65] });
    expect(r.rowNumbers).toEqual([2, 3, 4]);
    expect(r.headers).toEqual([
      { text: 'Q (m3/s)', column: 'discharge', unit: 'm3/s' },
      { text: 'TW (m)', column: 'depth', unit: 'm' },
    ]);
  });

  it('converts a US rating (cfs, ft) to SI by the exact factors', () => {
    const r = good('Q (cfs),TW (ft),stage (ft)\n100,2,101.5\n250,3.5,103\n', US);
    close(r.values.discharge!, [100 * CFS, 250 * CFS]);
    close(r.values.depth!, [2 * FT, 3.5 * FT]);
    close(r.values.stage!, [101.5 * FT, 103 * FT]);
    expect(r.headers.map((h) => h.unit)).toEqual(['cfs', 'ft', 'ft']);
  });

  it('takes the unit system display unit for a header without a unit', () => {
    expect(good('Q,TW\n1,2\n2,3').headers.map((h) => h.unit)).toEqual(['m3/s', 'm']);
    const us = good('flow,tailwater\n100,2\n200,3', US);
    expect(us.headers.map((h) => h.unit)).toEqual(['cfs', 'ft']);
    close(us.values.discharge!, [100 * CFS, 200 * CFS]);
  });

  it.each([
    ['Q (m3/s)', 'TW (m)'],
    ['Q [m³/s]', 'TW [m]'],
    ['Q(m3/s)', 'TW(m)'],
    ['discharge m3/s', 'tailwater depth m'],
    ['Q_m3/s', 'TW_m'],
    ['DISCHARGE (M3/S)', 'y (M)'],
    ['flow (L/s)', 'TW (mm)'],
  ])('reads the header form %s, %s', (q, tw) => {
    const r = good(`${q},${tw}\n1000,500\n2000,800`);
    const scale = q.includes('L/s') ? 1e-3 : 1;
    const depthScale = tw.includes('mm') ? 1e-3 : 1;
    close(r.values.discharge!, [1000 * scale, 2000 * scale]);
    close(r.values.depth!, [500 * depthScale, 800 * depthScale]);
    expect(r.headers.map((h) => h.text)).toEqual([q, tw]);
  });

  it('matches names, labels and aliases with spaces or underscores, in any case', () => {
    const r = good('Discharge (m3/s),water_level (m),Tailwater Depth\n1,100.5,0.5\n2,101,1');
    expect(r.values).toEqual({ discharge: [1, 2], stage: [100.5, 101], depth: [0.5, 1] });
    expect(good('"Q (m3/s)","WL m"\n1,-2.5\n2,-2').values.stage).toEqual([-2.5, -2]);
  });

  it('reads semicolon files with decimal commas, and tab files', () => {
    const r = good('Q (m3/s);TW (m)\n1,5;0,75\n2,25;1\n3;1,5e0\n');
    expect(r.values).toEqual({ discharge: [1.5, 2.25, 3], depth: [0.75, 1, 1.5] });
    const t = good('Q (m3/s)\tTW (m)\n1,5\t0.75\n2\t1,25');
    expect(t.values).toEqual({ discharge: [1.5, 2], depth: [0.75, 1.25] });
  });

  it('strips a BOM, reads CRLF and quoted cells', () => {
    const r = good('\uFEFF"Q (m3/s)",TW (m)\r\n"10", 1.2 \r\n20,1.8\r\n');
    expect(r.values).toEqual({ discharge: [10, 20], depth: [1.2, 1.8] });
    expect(r.rowNumbers).toEqual([2, 3]);
  });

  it('skips comments and blank lines but counts them in row numbers', () => {
    const text = ['# Aldmere weir tailwater, invented', '', 'Q (m3/s),TW (m)', '  # measured 2019', '10,1.2', '', ',', '20,1.8', '# end'].join('\n');
    const r = good(text);
    expect(r.rowNumbers).toEqual([5, 8]);
    expect(r.values.discharge).toEqual([10, 20]);
  });

  it('ignores a column whose header cell is empty', () => {
    const r = good('Q (m3/s),,TW (m)\n10,note,1.2\n20,,1.8');
    expect(r.values).toEqual({ discharge: [10, 20], depth: [1.2, 1.8] });
    expect(r.headers.map((h) => h.column)).toEqual(['discharge', 'depth']);
  });

  it('accepts zero discharge and a stage below the datum', () => {
    expect(good('Q,stage\n0,-1.5\n5,-1').values).toEqual({ discharge: [0, 5], stage: [-1.5, -1] });
  });
});

describe('readCsvTable: bad rows', () => {
  it('names the row of a cell that is not a number', () => {
    const r = refused('Q (m3/s),TW (m)\n10,1.2\n\n1.2.3,1.5\n30,2');
    expect(r.message).toBe('aldmere-rating.csv row 4: "1.2.3" in column Q (m3/s) is not a number.');
    expect(r.hint).toMatch(/decimal point/);
  });

  it.each([
    ['12 m3/s', 'is not a number'],
    ['1,000', 'is not a number'],
    ['0x10', 'is not a number'],
    ['Infinity', 'is not a number'],
    ['1e999', 'is too large'],
  ])('refuses the cell %s', (cell, what) => {
    expect(refused(`Q (m3/s),TW (m)\n"${cell}",1\n50,2`).message).toContain(`row 2: "${cell}" in column Q (m3/s) ${what}`);
  });

  it('reports a ragged row with both cell counts, and suggests semicolons for decimal commas', () => {
    const r = refused('Q (m3/s),TW (m)\n10,1,2\n20,1.8');
    expect(r.message).toBe('aldmere-rating.csv row 2: the row has 3 cells, the header has 2.');
    expect(r.hint).toMatch(/semicolons/);
    expect(refused('Q,TW\n10\n20,1.8').message).toBe('aldmere-rating.csv row 2: the row has 1 cell, the header has 2.');
  });

  it('reports an empty cell, a negative discharge and a depth not above zero', () => {
    expect(refused('Q (m3/s),TW (m)\n10,\n20,1.8').message).toBe('aldmere-rating.csv row 2: column TW (m) is empty.');
    expect(refused('Q (m3/s),TW (m)\n-5,1\n20,1.8').message).toBe('aldmere-rating.csv row 2: discharge -5 m3/s in column Q (m3/s) is negative.');
    expect(refused('Q (m3/s),TW (m)\n5,1\n20,0').message).toBe('aldmere-rating.csv row 3: tailwater depth 0 m in column TW (m) is not above zero.');
  });

  it('reports a discharge that does not increase, quoting values as written', () => {
    const r = refused('Q (m3/s),TW (m)\n10,1\n# x\n20,1.5\n30,2\n40,2.4\n40,2.5\n35,2.6');
    expect(r.message).toBe('aldmere-rating.csv has 2 bad rows: row 7: discharge 40 m3/s does not increase on row 6 (40 m3/s); row 8: discharge 35 m3/s does not increase on row 6 (40 m3/s).');
    expect(r.hint).toMatch(/increasing discharge/);
    expect(refused('Q;TW\n1,5;1\n1,50;2').message).toBe('aldmere-rating.csv row 3: discharge 1,50 m³/s does not increase on row 2 (1,5 m³/s).');
  });

  it('collects the bad rows of the example in one message', () => {
    const text = ['Q (m3/s),TW (m)', '1,1', '2,1.1', '1.2.3,1', '4,1.2', '5,1.3', '6,1.4', '7,1.5', '9', '10,1.8', '11,1.9', '12,'].join('\n');
    expect(refused(text).message).toBe('aldmere-rating.csv has 3 bad rows: row 4: "1.2.3" in column Q (m3/s) is not a number; row 9: the row has 1 cell, the header has 2; row 12: column TW (m) is empty.');
  });

  it('shows five bad rows and counts the rest', () => {
    const rows = Array.from({ length: 9 }, (_, i) => `${i + 1},x${i}`);
    const r = refused(['Q (m3/s),TW (m)', ...rows].join('\n'));
    expect(r.message).toMatch(/^aldmere-rating\.csv has 9 bad rows: row 2: "x0" in column TW \(m\) is not a number; /);
    expect(r.message.match(/row \d+:/g)).toHaveLength(5);
    expect(r.message).toMatch(/row 6: "x4" in column TW \(m\) is not a number; …and 4 more\.$/);
  });

  it('reports an unclosed quote', () => {
    expect(refused('Q,TW\n1,2\n"2,3\n3,4').message).toMatch(/^aldmere-rating\.csv row 3: a quote \(".*not closed/);
  });
});

describe('readCsvTable: headers', () => {
  it('reads a level whose unit names its datum (m AOD, ft NAVD88)', () => {
    const si = good('Q (m3/s),stage (m AOD)\n20,97.85\n40,98.30\n');
    expect(si.values['stage']).toEqual([97.85, 98.3]);
    const us = good('Q (cfs),WL (ft NAVD88)\n100,10\n200,12\n', { unitSystem: 'US' });
    close(us.values['stage']!, [10 * FT, 12 * FT]);
    // A datum word after a discharge unit is no unit at all.
    expect(refused('Q (m3/s AOD),stage (m)\n1,2\n2,3\n').message).toContain('m3/s AOD');
  });

  it('refuses a unit of the wrong quantity', () => {
    const r = refused('Q (m),TW (m)\n1,2\n2,3');
    expect(r.message).toBe('aldmere-rating.csv row 1: the header cell "Q (m)" gives the unit m, which measures length; the discharge column needs a unit of discharge.');
    expect(r.hint).toBe('Write the unit as one of m3/s, L/s or cfs, e.g. "Q (m3/s)".');
    expect(refused('Q (cfs),TW (cfs)\n1,2\n2,3', US).message).toMatch(/"TW \(cfs\)" gives the unit cfs, which measures discharge; the tailwater depth column needs a unit of length/);
    expect(refused('Q m,TW\n1,2\n2,3').message).toMatch(/"Q m" gives the unit m, which measures length/);
  });

  it('refuses an unknown unit', () => {
    expect(refused('Q (gpm),TW (m)\n1,2\n2,3').message).toMatch(/"Q \(gpm\)" gives the unit "gpm", which Sequent does not know/);
  });

  it('refuses an unknown column and names the columns it takes', () => {
    const r = refused('Q (m3/s),TW (m),velocity (m/s)\n1,2,3\n2,3,4');
    expect(r.message).toBe(
      'aldmere-rating.csv row 1: the header cell "velocity (m/s)" is not a column this table takes. It takes discharge (or Q, flow); depth (or Tailwater depth, TW, tailwater, y); stage (or level, WL, water level, elevation).',
    );
    expect(r.hint).toMatch(/clear the header cell/);
    expect(refused('Q,flow rate\n1,2\n2,3').message).toMatch(/"flow rate" is not a column/);
  });

  it('refuses a column given twice', () => {
    expect(refused('Q (m3/s),TW (m),flow (cfs)\n1,2,3\n2,3,4').message).toBe('aldmere-rating.csv row 1: header cells 1 ("Q (m3/s)") and 3 ("flow (cfs)") both give the discharge.');
  });

  it('needs a discharge column and at least two columns', () => {
    expect(refused('TW (m),stage (m)\n1,2\n2,3').message).toBe('aldmere-rating.csv row 1: the header has no discharge column (it names "TW (m)", "stage (m)").');
    expect(refused('Q (m3/s)\n1\n2').message).toBe('aldmere-rating.csv row 1: the header names "Q (m3/s)"; the table needs at least 2 columns.');
  });

  it('numbers the header by its physical line', () => {
    expect(refused('# note\n\nQ (m),TW\n1,2').message).toMatch(/^aldmere-rating\.csv row 3: /);
  });
});

describe('readCsvTable: size and empty files', () => {
  it('refuses empty text, comments only and a header alone', () => {
    expect(refused('').message).toBe('aldmere-rating.csv is empty: it has no header row and no data.');
    expect(refused('  \n\n').message).toMatch(/is empty/);
    expect(refused('# rating to follow\n').message).toMatch(/only comment lines/);
    expect(refused('Q,TW\n\n').message).toBe('aldmere-rating.csv has a header (row 1) but no data rows.');
  });

  it('needs at least two data rows', () => {
    expect(refused('Q,TW\n\n1,2\n').message).toBe('aldmere-rating.csv has only one data row (row 3); a table needs at least two.');
  });

  it('refuses more rows than maxRows (default 5000)', () => {
    const rows = (n: number) => ['Q,TW', ...Array.from({ length: n }, (_, i) => `${i + 1},1`)].join('\n');
    expect(good(rows(5000)).rowNumbers).toHaveLength(5000);
    expect(refused(rows(5001)).message).toBe('aldmere-rating.csv has more than 5000 data rows; a table takes at most 5000.');
    expect(good(rows(3), { maxRows: 3 }).rowNumbers).toEqual([2, 3, 4]);
    expect(refused(rows(4), { maxRows: 3 }).message).toMatch(/more than 3 data rows/);
  });
});

describe('readCsvTable: properties', () => {
  const table = fc.record({
    steps: fc.array(fc.integer({ min: 1, max: 1_000_000 }), { minLength: 2, maxLength: 40 }),
    scale: fc.constantFrom(1, 1e-3, 0.1, 7, 1e4),
    depths: fc.array(fc.double({ min: 1e-6, max: 1e4, noNaN: true }), { minLength: 40, maxLength: 40 }),
    stages: fc.array(fc.double({ min: -1e4, max: 1e4, noNaN: true }), { minLength: 40, maxLength: 40 }),
    system: fc.constantFrom<'SI' | 'US'>('SI', 'US'),
    form: fc.constantFrom('paren', 'bracket', 'space', 'bare'),
    delimiter: fc.constantFrom(',', ';', '\t'),
    gaps: fc.array(fc.constantFrom('', '# comment', ' ', ',,'), { minLength: 41, maxLength: 41 }),
    gapMask: fc.array(fc.boolean(), { minLength: 41, maxLength: 41 }),
  });

  it('round-trips random increasing tables with their row numbers', () => {
    fc.assert(
      fc.property(table, (t) => {
        const [qUnit, yUnit, qFactor, yFactor] = t.system === 'SI' ? ['m3/s', 'm', 1, 1] : ['cfs', 'ft', CFS, FT];
        const head = (name: string, unit: string) => ({ paren: `${name} (${unit})`, bracket: `${name} [${unit}]`, space: `${name} ${unit}`, bare: name })[t.form]!;
        const d = t.delimiter;
        // ",," is an all-empty row only for comma files; elsewhere use a blank line.
        const gap = (i: number) => (t.gaps[i] === ',,' && d !== ',' ? '' : t.gaps[i]!);
        const write = (x: number) => (d === ',' ? String(x) : String(x).replace('.', ','));
        let q = 0;
        const qs = t.steps.map((s) => (q += s) * t.scale);
        const lines: string[] = [];
        if (t.gapMask[0]) lines.push(gap(0));
        lines.push([head('Q', qUnit), head('TW', yUnit), head('stage', yUnit)].join(d));
        const rowNumbers: number[] = [];
        qs.forEach((x, i) => {
          if (t.gapMask[i + 1]) lines.push(gap(i + 1));
          lines.push([write(x), write(t.depths[i]!), write(t.stages[i]!)].join(d));
          rowNumbers.push(lines.length);
        });
        const r = readCsvTable(lines.join('\n'), { ...SI, unitSystem: t.system });
        if (!r.ok) throw new Error(r.message);
        expect(r.rowNumbers).toEqual(rowNumbers);
        close(r.values.discharge!, qs.map((x) => x * qFactor));
        close(r.values.depth!, t.depths.slice(0, qs.length).map((x) => x * yFactor));
        close(r.values.stage!, t.stages.slice(0, qs.length).map((x) => x * yFactor));
      }),
      { numRuns: 300 },
    );
  });

  const csvish = fc.string({ unit: fc.constantFrom(',', ';', '\t', '\n', '\r', '"', '#', '1', '2', '.', ' ', '-', 'e', 'Q', 'TW', ' (m)', '(m3/s)', '[', '\uFEFF'), maxLength: 200 });

  it.each([
    ['fc.string', fc.string({ maxLength: 300 })],
    ['binary (full Unicode) strings', fc.string({ unit: 'binary', maxLength: 300 })],
    ['CSV-like strings', csvish],
  ])('never throws on %s and always answers ok or a message', (_, strings) => {
    fc.assert(
      fc.property(strings, fc.constantFrom<'SI' | 'US'>('SI', 'US'), (text, unitSystem) => {
        const r = readCsvTable(text, { ...SI, unitSystem });
        if (r.ok) {
          expect(r.rowNumbers.length).toBeGreaterThanOrEqual(2);
          for (const column of Object.values(r.values)) expect(column.every(Number.isFinite)).toBe(true);
        } else {
          expect(r.message.startsWith('aldmere-rating.csv')).toBe(true);
        }
      }),
      { numRuns: 500 },
    );
  });
});
