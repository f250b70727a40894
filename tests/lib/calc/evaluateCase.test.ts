import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { evaluateCase } from '../../../src/lib/calc';
import { SOLVER_VERSION } from '../../../src/lib/solver';

const fence = (info: string, ...lines: string[]) => ['```' + info, ...lines, '```'].join('\n');
const out = (md: string, block = 0) => {
  const b = evaluateCase(md).blocks[block]!;
  return Object.fromEntries(b.outputs.map((o) => [o.name, o.si]));
};

// Bélanger equation for a rectangular channel: y2/y1 = ½(√(1 + 8·Fr1²) − 1)
// (Chow 1959, Open-Channel Hydraulics, §15-2, eq. 3-20).
const belanger = (q: number, y1: number, g = 9.80665) => {
  const fr1 = q / (y1 * Math.sqrt(g * y1));
  return (y1 / 2) * (Math.sqrt(1 + 8 * fr1 * fr1) - 1);
};

describe('evaluateCase(markdown)', () => {
  it('returns no blocks for a body without calculation blocks', () => {
    expect(evaluateCase('# Notes\n\nNothing to compute.')).toEqual({ blocks: [], solverVersion: SOLVER_VERSION });
  });

  it('never throws for a body that is not a string', () => {
    expect(evaluateCase(undefined as unknown as string).blocks).toEqual([]);
  });

  it('solves a rectangular jump block with the Bélanger sequent depth', () => {
    const md = fence('jump basin', 'shape = rectangular', 'b = 12 m', 'Q = 85 m3/s', 'y1 = 0.62 m');
    const [block] = evaluateCase(md).blocks;
    expect(block).toMatchObject({ status: 'ok', name: 'basin', kind: 'hydraulic-jump', line: 1, endLine: 6, unitSystem: 'SI', solverVersion: SOLVER_VERSION });
    expect(block!.outputs.find((o) => o.name === 'y2')!.si).toBeCloseTo(belanger(85 / 12, 0.62), 9);
    expect(block!.outputs.find((o) => o.name === 'y2')).toMatchObject({ unit: 'm', symbol: 'y2' });
  });

  it('chains blocks by reference: toe depth → jump', () => {
    const md = [
      fence('toe spill', 'shape = rectangular', 'b = 12 m', 'Q = 85 m3/s', 'H = 9.5 m'),
      '',
      'Prose between blocks.',
      '',
      fence('jump basin', 'shape = rectangular', 'b = spill.b', 'Q = 85 m3/s', 'y1 = spill.y1'),
    ].join('\n');
    const evaluation = evaluateCase(md);
    expect(evaluation.blocks.map((b) => b.status)).toEqual(['ok', 'ok']);
    const toe = out(md, 0);
    const jump = out(md, 1);
    expect(jump.y1).toBe(toe.y1);
    expect(jump.y2 as number).toBeCloseTo(belanger(85 / 12, toe.y1 as number), 9);
  });

  it('evaluates a block that refers to a later block (dependency order, not document order)', () => {
    const md = [fence('jump basin', 'b = 12 m', 'Q = 85 m3/s', 'y1 = toe1.y1'), fence('toe toe1', 'b = 12 m', 'Q = 85 m3/s', 'H = 9.5 m')].join('\n');
    expect(evaluateCase(md).blocks.map((b) => b.status)).toEqual(['ok', 'ok']);
  });

  it('reports a cycle on the lines of the references', () => {
    const md = [fence('jump a', 'b = 3 m', 'Q = 10 m3/s', 'y1 = b.y2'), fence('jump b', 'b = 3 m', 'Q = 10 m3/s', 'y1 = a.y2')].join('\n');
    const [a, b] = evaluateCase(md).blocks;
    expect(a!.status).toBe('error');
    expect(b!.status).toBe('error');
    const messages = [...a!.errors, ...b!.errors].map((e) => e.message).join(' ');
    expect(messages).toContain('Blocks refer to each other in a circle');
  });

  it('reports a reference to a block that does not exist, with the names there are', () => {
    const md = [fence('toe spill', 'b = 12 m', 'Q = 85 m3/s', 'H = 9.5 m'), fence('jump', 'b = 12 m', 'Q = 85 m3/s', 'y1 = spil.y1')].join('\n');
    const error = evaluateCase(md).blocks[1]!.errors[0]!;
    expect(error).toEqual({ line: 9, message: 'No block is named "spil" in this case. Named blocks: spill.', hint: 'Did you mean spill.y1?' });
  });

  it('reports a reference to a result a block does not have', () => {
    const md = [fence('toe spill', 'b = 12 m', 'Q = 85 m3/s', 'H = 9.5 m'), fence('jump', 'b = 12 m', 'Q = 85 m3/s', 'y1 = spill.y3')].join('\n');
    expect(evaluateCase(md).blocks[1]!.errors[0]!.message).toContain('Block "spill" has no result "y3".');
  });

  it('says so when a referenced block has errors itself', () => {
    const md = [fence('toe spill', 'b = 12 m', 'H = 9.5 m'), fence('jump', 'b = 12 m', 'Q = 85 m3/s', 'y1 = spill.y1')].join('\n');
    const [toe, jump] = evaluateCase(md).blocks;
    expect(toe!.status).toBe('error');
    expect(jump!.errors[0]!.message).toBe('Block "spill" has errors, so spill.y1 has no value yet.');
  });

  it('refuses two blocks with the same name', () => {
    const md = [fence('jump x', 'b = 3 m', 'Q = 10 m3/s', 'y1 = 0.4 m'), fence('jump x', 'b = 3 m', 'Q = 10 m3/s', 'y1 = 0.4 m')].join('\n');
    expect(evaluateCase(md).blocks[1]!.errors[0]!.message).toBe('Another block is already named "x" (line 1).');
  });

  it('points a solver error at the line of the field it concerns', () => {
    // y1 above critical depth: the flow is already subcritical, no jump can form.
    const md = fence('jump', 'b = 3 m', 'Q = 1 m3/s', 'y1 = 2 m');
    const [block] = evaluateCase(md).blocks;
    expect(block!.status).toBe('error');
    expect(block!.errors[0]!.line).toBe(4);
  });

  it('names the input a block does not have and suggests the likely one', () => {
    const [block] = evaluateCase(fence('jump', 'width = 3 m', 'Qq = 10 m3/s', 'y1 = 0.4 m')).blocks;
    expect(block!.errors[0]).toMatchObject({ line: 3, hint: 'Did you mean Q?' });
  });

  it('refuses a unit of the wrong quantity', () => {
    const [block] = evaluateCase(fence('jump', 'b = 3 m3/s', 'Q = 10 m3/s', 'y1 = 0.4 m')).blocks;
    expect(block!.errors[0]!.line).toBe(2);
    expect(block!.errors[0]!.message).toContain('m3/s');
  });

  it('gives the same physical answer for SI and US customary inputs', () => {
    const ft = 0.3048;
    const si = out(fence('jump', 'shape = trapezoidal', 'b = 3.048 m', 'z = 2', `Q = ${(500 * ft ** 3).toFixed(10)} m3/s`, `y1 = ${(1.2 * ft).toFixed(10)} m`));
    const us = out(fence('jump', 'units = US', 'shape = trapezoidal', 'b = 10', 'z = 2', 'Q = 500', 'y1 = 1.2'));
    expect(us.y2 as number).toBeCloseTo(si.y2 as number, 8);
    expect(us.power as number).toBeCloseTo(si.power as number, 3);
  });

  it('shows results in the block’s unit system', () => {
    const [block] = evaluateCase(fence('jump', 'units = US', 'b = 10 ft', 'Q = 500 cfs', 'y1 = 1.2 ft')).blocks;
    expect(block!.outputs.find((o) => o.name === 'y2')!.unit).toBe('ft');
    expect(block!.outputs.find((o) => o.name === 'discharge')!.text).toBe('500.0');
  });

  it('mixes units per value inside one block', () => {
    const a = out(fence('jump', 'b = 10 ft', 'Q = 500 cfs', 'y1 = 365.76 mm'));
    const b = out(fence('jump', 'b = 3.048 m', 'Q = 14.158423296 m3/s', 'y1 = 0.36576 m'));
    expect(a.y2 as number).toBeCloseTo(b.y2 as number, 9);
  });

  it('runs a tailwater sweep over a range against a rating table', () => {
    const md = fence(
      'tailwater outlet',
      'b = 12 m',
      'Q = 20 to 100 m3/s step 20',
      'toe = head',
      'H = 9.5 m',
      'rating:',
      '  Q m3/s | TW m',
      '  10     | 1.6',
      '  120    | 5.2',
    );
    const [block] = evaluateCase(md).blocks;
    expect(block!.status, JSON.stringify(block!.errors)).toBe('ok');
    expect(block!.table!.rows).toHaveLength(5);
    expect(block!.table!.columns.map((c) => c.symbol)).toContain('TW');
  });

  it('keeps evaluating the other blocks when one is broken', () => {
    const md = [fence('jump', 'b = ?'), fence('jump', 'b = 3 m', 'Q = 10 m3/s', 'y1 = 0.4 m')].join('\n');
    expect(evaluateCase(md).blocks.map((b) => b.status)).toEqual(['error', 'ok']);
  });

  it('never throws, whatever the text (fast-check)', () => {
    const line = fc.oneof(
      fc.string(),
      fc.constantFrom('Q = 85 m3/s', 'b = 12 m', 'y1 = a.y2', 'y1 = 0', 'Q = 1e308 m3/s', 'Q = -5 m3/s', 'rating:', '1 | 2', 'units = US', 'shape = circular', 'D = 0 m'),
    );
    const block = fc.tuple(fc.constantFrom('jump', 'toe', 'gate', 'surge', 'dambreak', 'tailwater', 'jump a', 'toe a', 'jump b'), fc.array(line, { maxLength: 8 }));
    fc.assert(
      fc.property(fc.array(block, { maxLength: 4 }), fc.string(), (blocks, prose) => {
        const md = blocks.map(([info, lines]) => fence(info, ...lines)).join(`\n${prose}\n`);
        const evaluation = evaluateCase(md);
        for (const b of evaluation.blocks) {
          expect(['ok', 'error']).toContain(b.status);
          if (b.status === 'error') expect(b.errors.length).toBeGreaterThan(0);
          for (const e of b.errors) expect(e.line).toBeGreaterThan(0);
        }
      }),
      { numRuns: 300 },
    );
  });
});
