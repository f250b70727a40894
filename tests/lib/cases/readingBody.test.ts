import { describe, expect, it } from 'vitest';
import { readingBody, readingChunks, renderReadingBody } from '@/components/cases/readingBody';
import { NO_FILES } from '@/lib/calc';
import { CASE } from '../charts/fixtures';

const BODY = `# Basin check\n\nThe jump: $Fr_1 = V_1/\\sqrt{g y_1}$.\n\n${CASE}\n\nAfter the blocks <script>alert(1)</script>.`;

describe('renderReadingBody', () => {
  const { parts } = renderReadingBody(BODY);

  it('keeps the document order: prose, then each block, then prose', () => {
    expect(parts[0]!.type).toBe('html');
    expect(parts.at(-1)!.type).toBe('html');
    expect(parts.filter((p) => p.type !== 'html')).toHaveLength(7);
  });

  it('gives blocks with numeric inputs a what-if island with a static body, and the others a static panel', () => {
    const islands = parts.filter((p) => p.type === 'what-if');
    const panels = parts.filter((p) => p.type === 'panel');
    expect(islands.map((p) => p.head.name)).toEqual(['spill', 'basin', 'outlet', 'trap', 'pipe']);
    // `bad` has an unknown input, `wave` misses its inputs: both cannot be calculated.
    expect(panels).toHaveLength(2);
    for (const panel of panels) expect(panel.html).toContain('This block cannot be calculated yet.');
    const basin = islands.find((p) => p.head.name === 'basin')!;
    expect(basin.bodyHtml).toContain('<svg');
    expect(basin.bodyHtml).not.toContain('What if');
    const props = JSON.parse(basin.payload);
    expect(props.headingId).toBe(basin.headingId);
    expect(props.source.split('\n')[0]).toBe('```jump basin');
    expect(props.plan.fields.map((f: { key: string }) => f.key)).toEqual(['b', 'Q', 'y1']);
  });

  it('renders chart ids with a prefix per block, so two charts on one page never share an id', () => {
    const ids = parts.flatMap((p) => [...(p.type === 'what-if' ? p.bodyHtml : p.html).matchAll(/ id="([^"]+)"/g)].map((m) => m[1]));
    expect(ids.length).toBeGreaterThan(0);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('goes through the sanitising pipeline', () => {
    const html = parts.map((p) => (p.type === 'what-if' ? p.bodyHtml : p.html)).join('');
    expect(html).not.toContain('<script');
    expect(html).toContain('class="katex"');
  });
});

describe('readingChunks', () => {
  const { parts } = renderReadingBody(BODY);
  const chunks = readingChunks(parts);

  it('alternates HTML and islands, one island per what-if block', () => {
    expect(chunks.map((c) => c.type)).toEqual(['html', 'island', 'html', 'island', 'html', 'island', 'html', 'island', 'html', 'island', 'html']);
  });

  it('makes a whole document once each island stands in for its header', () => {
    const page = chunks.map((c) => (c.type === 'html' ? new TextDecoder().decode(c.html) : c.headerHtml)).join('');
    const opened = (tag: string) => (page.match(new RegExp(`<${tag}[\\s>]`, 'g')) ?? []).length;
    const closed = (tag: string) => (page.match(new RegExp(`</${tag}>`, 'g')) ?? []).length;
    for (const tag of ['section', 'div', 'header', 'table']) expect(opened(tag), tag).toBe(closed(tag));
    // Each what-if frame names the heading its island draws.
    for (const c of chunks) if (c.type === 'island') expect(page).toContain(`aria-labelledby="${JSON.parse(c.payload).headingId}"`);
  });
});

describe('readingBody', () => {
  it('renders a revision once and answers the same object afterwards', async () => {
    const noFiles = async () => NO_FILES;
    const first = await readingBody('case-1#1', BODY, noFiles);
    expect(await readingBody('case-1#1', BODY, noFiles)).toBe(first);
    expect(await readingBody('case-1#2', BODY, noFiles)).not.toBe(first);
  });

  it('loads the files only for a body whose blocks read one, and once per revision', async () => {
    let loads = 0;
    const loadFiles = async () => {
      loads += 1;
      return { names: ['tw.csv'], texts: { 'tw.csv': 'Q (m3/s),TW (m)\n10,1.2\n50,2.4\n' } };
    };
    await readingBody('case-2#1', BODY, loadFiles);
    expect(loads).toBe(0);
    const withFile = ['```tailwater tw', 'b = 5 m', 'Q = 20, 40 m3/s', 'toe = depth', 'y1 = 0.4 m', 'rating = file "tw.csv"', '```', ''].join('\n');
    const first = await readingBody('case-3#1', withFile, loadFiles);
    await readingBody('case-3#1', withFile, loadFiles);
    expect(loads).toBe(1);
    const block = first.evaluation.blocks[0]!;
    expect(block.errors).toEqual([]);
    expect(block.tables?.[0]?.source).toBe('tw.csv');
    // The what-if island gets the file text its block reads.
    const island = first.chunks.find((c) => c.type === 'island');
    expect(island && JSON.parse(island.payload).files.texts['tw.csv']).toContain('Q (m3/s)');
  });
});
