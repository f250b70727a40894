/** Evaluated blocks shared by the chart and block-component tests (invented data). */
import { evaluateCase, type BlockResult } from '@/lib/calc';

/** A toe → jump → tailwater chain, a US trapezoidal jump, a broken block and a circular conduit. */
export const CASE = [
  '```toe spill', // 1
  'b = 12 m',
  'Q = 85 m3/s',
  'H = 9.5 m',
  '```', // 5
  '',
  '```jump basin', // 7
  'b = spill.b',
  'Q = 85 m3/s',
  'y1 = spill.y1', // 10
  '```',
  '',
  '```tailwater outlet', // 13
  'b = 12 m',
  'Q = 20 to 100 m3/s step 10',
  'toe = head',
  'H = 9.5 m',
  'rating:',
  '  Q m3/s | TW m',
  '  10     | 1.6',
  '  60     | 3.4',
  '  120    | 5.2',
  '```', // 23
  '',
  '```jump trap', // 25
  'units = US',
  'shape = trapezoidal',
  'b = 10 ft',
  'z = 2',
  'Q = 1200 cfs',
  'y1 = 1.1 ft',
  '```', // 32
  '',
  '```jump bad', // 34
  'b = 12 m',
  'Q = 85',
  'flux = 3', // 37
  '```',
  '',
  '```jump pipe', // 40
  'shape = circular',
  'D = 2 m',
  'Q = 3 m3/s',
  'y1 = 0.4 m',
  '```', // 45
  '',
  '```surge wave', // 47
  'b = 8 m',
  '```',
].join('\n');

const blocks = evaluateCase(CASE).blocks;
const byName = (name: string): BlockResult => {
  const b = blocks.find((x) => x.name === name);
  if (!b) throw new Error(`fixture block ${name} missing`);
  return b;
};

export const TOE = byName('spill');
export const JUMP = byName('basin');
export const TAILWATER = byName('outlet');
export const US_JUMP = byName('trap');
export const BROKEN = byName('bad');
export const PIPE = byName('pipe');
export const SURGE = byName('wave');

/** The source text of a block as written, opening fence to closing fence. */
export function sourceOf(block: BlockResult): string {
  return CASE.split('\n').slice(block.line - 1, block.endLine).join('\n');
}
