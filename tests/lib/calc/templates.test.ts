import { describe, expect, it } from 'vitest';
import { BLOCK_TEMPLATES, BLOCK_WORDS, evaluateCase } from '../../../src/lib/calc';

describe('BLOCK_TEMPLATES', () => {
  it('offers one template for every calculation word but the bore alias', () => {
    const words = Object.keys(BLOCK_WORDS).filter((w) => w !== 'bore');
    expect(BLOCK_TEMPLATES.map((t) => t.word).sort()).toEqual(words.sort());
  });

  it.each(BLOCK_TEMPLATES.map((t) => [t.label, t] as const))('%s evaluates without errors', (_label, template) => {
    const [block] = evaluateCase(template.text).blocks;
    expect(block!.status, JSON.stringify(block!.errors)).toBe('ok');
  });
});
