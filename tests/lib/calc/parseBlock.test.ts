import { describe, expect, it } from 'vitest';
import { extractBlocks } from '../../../src/lib/calc/extractBlocks';
import { parseBlock } from '../../../src/lib/calc/parseBlock';

const one = (body: string, info = 'jump basin') => parseBlock(extractBlocks(`\`\`\`${info}\n${body}\n\`\`\``)[0]!);

describe('extractBlocks(markdown)', () => {
  it('returns nothing for empty text or text without blocks', () => {
    expect(extractBlocks('')).toEqual([]);
    expect(extractBlocks('# Title\n\nJust prose, $Fr_1 = 5$.')).toEqual([]);
  });

  it('finds calculation blocks with document line numbers and skips other fenced code', () => {
    const md = ['# Case', '', '```python', 'y1 = 0.5', '```', '', '```jump basin', 'Q = 85 m3/s', '```', '~~~toe', 'H = 9 m', '~~~'].join('\n');
    const blocks = extractBlocks(md);
    expect(blocks.map((b) => [b.word, b.rest, b.line, b.endLine])).toEqual([
      ['jump', 'basin', 7, 9],
      ['toe', '', 10, 12],
    ]);
    expect(blocks[0]!.lines).toEqual([{ text: 'Q = 85 m3/s', line: 8 }]);
  });

  it('does not treat a calculation word inside another fenced block as a block', () => {
    const md = '````markdown\n```jump\nQ = 1 m3/s\n```\n````';
    expect(extractBlocks(md)).toEqual([]);
  });

  it('reports a block that is never closed', () => {
    const [block] = extractBlocks('```jump\nQ = 85 m3/s\n');
    expect(block!.closed).toBe(false);
    expect(parseBlock(block!).issues[0]).toMatchObject({ line: 1, message: 'This block is never closed.' });
  });

  it('accepts CRLF line endings', () => {
    expect(extractBlocks('```jump\r\nQ = 1 m3/s\r\n```').map((b) => b.lines.map((l) => l.text))).toEqual([['Q = 1 m3/s']]);
  });
});

describe('parseBlock(raw)', () => {
  it('reads numbers with and without units, words, references and comments', () => {
    const block = one('# basin inflow\nshape = rectangular\nb = 12 m\nQ = 85m3/s   # design flood\ny1 = toe.y1\nz = 1.5\ng = 9.81 m/s2');
    expect(block.issues).toEqual([]);
    expect(block.name).toBe('basin');
    expect(block.assignments).toEqual([
      { key: 'shape', value: { type: 'word', value: 'rectangular' }, line: 3 },
      { key: 'b', value: { type: 'number', value: 12, unit: 'm' }, line: 4 },
      { key: 'Q', value: { type: 'number', value: 85, unit: 'm3/s' }, line: 5 },
      { key: 'y1', value: { type: 'reference', block: 'toe', output: 'y1' }, line: 6 },
      { key: 'z', value: { type: 'number', value: 1.5, unit: '' }, line: 7 },
      { key: 'g', value: { type: 'number', value: 9.81, unit: 'm/s2' }, line: 8 },
    ]);
  });

  it('reads scientific notation and signs', () => {
    expect(one('S = 2.5e-3').assignments[0]!.value).toEqual({ type: 'number', value: 0.0025, unit: '' });
    expect(one('u = -1.2 m/s').assignments[0]!.value).toEqual({ type: 'number', value: -1.2, unit: 'm/s' });
  });

  it('applies a unit written once at the end of a list to every item without one', () => {
    expect(one('Q = 20, 40, 60 m3/s').assignments[0]!.value).toEqual({
      type: 'list',
      items: [20, 40, 60].map((value) => ({ type: 'number', value, unit: 'm3/s' })),
    });
    expect(one('Q = 20 m3/s, 700 cfs').assignments[0]!.value).toMatchObject({ items: [{ unit: 'm3/s' }, { unit: 'cfs' }] });
  });

  it('reads ranges by step and by count', () => {
    expect(one('Q = 10 to 120 m3/s step 10').assignments[0]!.value).toEqual({ type: 'range', from: 10, to: 120, unit: 'm3/s', step: 10 });
    expect(one('Q = 10 to 120 cfs count 12').assignments[0]!.value).toEqual({ type: 'range', from: 10, to: 120, unit: 'cfs', count: 12 });
  });

  it('reads a table under "key:" until the first line without a bar', () => {
    const block = one('rating:\n  Q m3/s | TW m\n  10 | 1.2\n  50 | 2.9   # bankfull\n\nn = 0.035');
    expect(block.issues).toEqual([]);
    expect(block.assignments[0]).toEqual({
      key: 'rating',
      line: 2,
      value: {
        type: 'table',
        header: [
          { name: 'Q', unit: 'm3/s', line: 3 },
          { name: 'TW', unit: 'm', line: 3 },
        ],
        rows: [
          { cells: [10, 1.2], line: 4 },
          { cells: [50, 2.9], line: 5 },
        ],
      },
    });
    expect(block.assignments[1]!.key).toBe('n');
  });

  describe.each([
    ['Q 85', 2, 'Cannot read "Q 85": each line is name = value.'],
    ['Q =', 2, 'The value is missing after "=".'],
    ['Q = 3,000 cfs', 2, 'Commas separate list items, so thousands cannot be written with commas.'],
    ['Q = 1, two, 3 m3/s', 2, 'Item 2 of the list, "two", is not a number with an optional unit.'],
    ['Q = 10 to 20 m3/s step 0', 2, 'The step of a range must be a positive number.'],
    ['Q = 10 to 20 m3/s count 1', 2, 'A range needs a whole count of at least 2 values.'],
    ['Q = 85 m3/s\nQ = 90 m3/s', 3, 'Q is already given on line 2.'],
    ['2b = 3 m', 2, '"2b" is not a name: use letters, digits, - and _, starting with a letter.'],
    ['Q = $$$', 2, '"$$$" is not a value Sequent can read.'],
    ['rating:\nQ m3/s | TW m\n10 | x', 4, '"x" in column TW is not a number.'],
    ['rating:\nQ m3/s | TW m\n10 | 1 | 2', 4, 'This row has 3 cells but the header has 2.'],
  ])('reports %j on line %i', (body, line, message) => {
    it('with a clear message', () => {
      expect(one(body).issues).toContainEqual(expect.objectContaining({ line, message }));
    });
  });

  it('checks the block name and extra words on the fence line', () => {
    expect(one('Q = 1 m3/s', 'jump 1st').issues[0]).toMatchObject({ line: 1, message: expect.stringContaining('cannot be a block name') });
    expect(one('Q = 1 m3/s', 'jump basin extra').issues[0]).toMatchObject({ line: 1, message: 'Only a block name may follow "jump"; "extra" is extra.' });
  });
});
