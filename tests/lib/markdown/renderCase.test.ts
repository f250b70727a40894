import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { renderCase, renderMarkdown, slugify } from '@/lib/markdown';

const kinds = (markdown: string) => renderCase(markdown).segments.map((s) => (s.type === 'block' ? `block ${s.index}` : 'html'));
const htmlOf = (markdown: string) =>
  renderCase(markdown)
    .segments.map((s) => (s.type === 'html' ? s.html : `[block ${s.index}]`))
    .join('');

const CHAIN = [
  '# Basin',
  '',
  'The toe depth first.',
  '',
  '```toe spill',
  'b = 12 m',
  'Q = 85 m3/s',
  'H = 9.5 m',
  '```',
  '```jump basin',
  'b = spill.b',
  'Q = 85 m3/s',
  'y1 = spill.y1',
  '```',
  '',
  'Then the check.',
  '',
  '~~~tailwater outlet',
  'b = 12 m',
  'Q = 20, 60 m3/s',
  'H = 9.5 m',
  'rating:',
  '  Q m3/s | TW m',
  '  10     | 1.6',
  '  120    | 5.2',
  '~~~',
].join('\n');

describe('renderCase splits at calculation blocks', () => {
  it('renderCase("") has no segments and no blocks', () => {
    expect(renderCase('')).toMatchObject({ segments: [], evaluation: { blocks: [] } });
  });

  it('puts each block, in order, where it is written, with its evaluation index', () => {
    const { segments, evaluation } = renderCase(CHAIN);
    expect(segments.map((s) => s.type)).toEqual(['html', 'block', 'block', 'html', 'block']);
    expect(segments.filter((s) => s.type === 'block').map((s) => s.index)).toEqual([0, 1, 2]);
    expect(evaluation.blocks.map((b) => [b.index, b.name, b.line, b.status])).toEqual([
      [0, 'spill', 5, 'ok'],
      [1, 'basin', 10, 'ok'],
      [2, 'outlet', 18, 'ok'],
    ]);
    expect(htmlOf(CHAIN)).not.toContain('<pre');
  });

  it('matches blocks by source line, so a code fence mentioning a word before them does not shift them', () => {
    const md = ['````text', '```jump example', 'b = 1 m', '```', '````', '', '```jump real', 'b = 12 m', 'Q = 85 m3/s', 'y1 = 0.62 m', '```'].join('\n');
    const { segments, evaluation } = renderCase(md);
    expect(evaluation.blocks).toHaveLength(1);
    expect(evaluation.blocks[0]!.line).toBe(7);
    expect(segments.map((s) => s.type)).toEqual(['html', 'block']);
    expect(htmlOf(md)).toContain('<code class="language-text">```jump example');
  });

  it('leaves fences of other languages, and words that only start like a calculation word, as code', () => {
    const md = '```js\nconst jump = 1;\n```\n\n```jumping\nb = 1\n```\n\n```\nplain\n```';
    expect(kinds(md)).toEqual(['html']);
    const html = htmlOf(md);
    expect(html).toContain('<code class="language-js">const jump = 1;');
    expect(html).toContain('<code class="language-jumping">');
    expect(html).toContain('<code>plain');
  });

  it('accepts the block word in any case and the solver kind id, like the evaluator', () => {
    const md = '```JUMP a\nb = 12 m\nQ = 85 m3/s\ny1 = 0.62 m\n```\n\n```hydraulic-jump b\nb = 12 m\nQ = 85 m3/s\ny1 = 0.62 m\n```';
    expect(kinds(md)).toEqual(['block 0', 'block 1']);
  });

  it('still renders a body whose block is broken, with the block in its place', () => {
    const md = 'Intro.\n\n```jump basin\nb = 12 m\nQ = 85 m3/s\ny1 = 0.62 m\nflux = 3\nthis line is wrong\n```\n\nConclusion.';
    const { segments, evaluation } = renderCase(md);
    expect(segments.map((s) => s.type)).toEqual(['html', 'block', 'html']);
    expect(evaluation.blocks[0]!.status).toBe('error');
    expect(evaluation.blocks[0]!.errors.map((e) => e.line)).toEqual([7, 8]);
    expect(htmlOf(md)).toMatch(/Intro\.[\s\S]*\[block 0\][\s\S]*Conclusion\./);
  });

  it('handles an unclosed block at the end of the body', () => {
    const { segments, evaluation } = renderCase('Text\n\n```jump basin\nb = 12 m');
    expect(segments.map((s) => s.type)).toEqual(['html', 'block']);
    expect(evaluation.blocks[0]!.errors[0]!.message).toMatch(/never closed/);
  });

  it('places a block written inside a list item right after the list', () => {
    const md = '- first\n  ```jump a\n  b = 12 m\n  Q = 85 m3/s\n  y1 = 0.62 m\n  ```\n- second\n\nAfter.';
    const { segments } = renderCase(md);
    expect(segments.map((s) => s.type)).toEqual(['html', 'block', 'html']);
    const [list] = segments;
    expect(list!.type === 'html' && list!.html).toMatch(/<ul>[\s\S]*first[\s\S]*second[\s\S]*<\/ul>/);
    expect(list!.type === 'html' && list!.html).not.toContain('<pre');
  });

  it('places a block whose fence sits inside dropped raw HTML by its line', () => {
    const md = 'Before.\n\n<div>\n```gate g\na = 0.5 m\n```\n</div>\n\nAfter.';
    expect(kinds(md)).toEqual(['html', 'block 0', 'html']);
  });

  it('renders the block-syntax guide, whose examples are nested in text fences, with no blocks', () => {
    const guide = readFileSync('content/guide/block-syntax.md', 'utf8').replace(/^---[\s\S]*?---\n/, '');
    const { segments, evaluation } = renderCase(guide);
    expect(evaluation.blocks).toEqual([]);
    expect(segments.every((s) => s.type === 'html')).toBe(true);
  });
});

describe('renderCase never throws', () => {
  const odd: readonly (readonly [string, unknown])[] = [
    ['undefined', undefined],
    ['a number', 42],
    ['null characters', 'a\u0000b\u0000```jump\u0000\n```'],
    ['unbalanced math', '$$\n\\frac{\n\n$ $ $$ $'],
    ['deeply nested quotes', '>'.repeat(500) + ' deep'],
    ['deeply nested lists', Array.from({ length: 100 }, (_, i) => `${'  '.repeat(i)}- x`).join('\n')],
    ['many emphasis markers', '*'.repeat(20_000)],
    ['many brackets', '['.repeat(10_000) + ']('.repeat(5_000)],
    ['a table with ragged rows', '| a | b |\n|---|\n| 1 | 2 | 3 |'],
    ['CRLF line endings', 'x\r\n\r\n```jump a\r\nb = 12 m\r\nQ = 85 m3/s\r\ny1 = 0.62 m\r\n```\r\n'],
  ];
  it.each(odd)('with %s', (_title, input) => {
    expect(() => renderCase(input as string)).not.toThrow();
    expect(() => renderMarkdown(input as string)).not.toThrow();
  });

  it('keeps CRLF bodies on the same lines as the evaluator', () => {
    expect(kinds(odd[9]![1] as string)).toEqual(['html', 'block 0']);
  });
});

describe('renderMarkdown', () => {
  it('renders a comment as one HTML string, calculation fences staying code', () => {
    const html = renderMarkdown('Check **y2** against $TW$:\n\n```jump\nb = 1 m\n```');
    expect(html).toContain('<strong>y2</strong>');
    expect(html).toContain('class="katex"');
    expect(html).toContain('<code class="language-jump">b = 1 m');
  });

  it('gives repeated headings unique ids and takes math headings from their TeX', () => {
    const html = renderMarkdown('## Results\n\n## Results\n\n## Case $Fr_1$');
    expect(html).toContain('id="results"');
    expect(html).toContain('id="results-2"');
    expect(html).toContain('id="case-fr-1"');
  });
});

describe('slugify', () => {
  it.each([
    ['Design flood (Q100)', 'design-flood-q100'],
    ['  Énergie — perte  ', 'energie-perte'],
    ['***', ''],
  ])('slugify(%j) = %j', (text, slug) => expect(slugify(text)).toBe(slug));
});
