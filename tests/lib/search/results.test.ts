import { describe, expect, it } from 'vitest';
import { figure, figureRange } from '../../../src/lib/search/format';
import { emptyQuery } from '../../../src/lib/search/params';
import { HIGHLIGHT_POST as B, HIGHLIGHT_PRE as A } from '../../../src/lib/search/requests';
import { segments, toHit, toResults } from '../../../src/lib/search/results';

describe('segments(marked)', () => {
  it('splits text at the highlight sentinels', () => {
    expect(segments(`Outlet ${A}culvert${B} apron`)).toEqual([
      { text: 'Outlet ', hit: false },
      { text: 'culvert', hit: true },
      { text: ' apron', hit: false },
    ]);
  });

  it('keeps markup-looking text as text and drops stray sentinels', () => {
    expect(segments(`<b>x</b>${B} ${A}`)).toEqual([{ text: '<b>x</b> ', hit: false }]);
    expect(segments('')).toEqual([]);
  });
});

describe('toHit / toResults', () => {
  const raw = {
    id: 'c1',
    title: 'Kilnbarrow culvert',
    summary: 'Jump at the outlet.',
    publishedAt: Date.UTC(2026, 10, 3),
    fr1Min: 5.2,
    fr1Max: 5.4,
    tags: ['culvert', 3],
    _formatted: { title: `Kilnbarrow ${A}culvert${B}`, body: `… the ${A}culvert${B} barrel …`, summary: 'Jump at the outlet.' },
  };

  it('shows the body snippet when the words matched there and not in the summary', () => {
    const hit = toHit(raw);
    expect(hit.title.filter((s) => s.hit).map((s) => s.text)).toEqual(['culvert']);
    expect(hit.snippet.some((s) => s.hit)).toBe(true);
    expect(hit.publishedAt).toBe('2026-11-03T00:00:00.000Z');
    expect(hit.tags).toEqual(['culvert']);
    expect(hit.figures).toMatchObject({ fr1Min: 5.2, fr1Max: 5.4, y1: null });
  });

  it('keeps a selected facet value with no result at count 0, counts each group from its own query', () => {
    const selected = { ...emptyQuery().facets, structure: ['outfall'] };
    const out = toResults(
      [
        { hits: [raw], estimatedTotalHits: 1, facetDistribution: { tags: { culvert: 1, apron: 0 } } },
        { hits: [], facetDistribution: { structureType: { 'culvert-outlet': 3 } } },
      ],
      ['structure'],
      selected,
      1,
      (facet, value) => (facet === 'structure' && value === 'outfall' ? 'Outfall' : value),
    );
    expect(out.facets.structure).toEqual([
      { value: 'culvert-outlet', label: 'culvert-outlet', count: 3 },
      { value: 'outfall', label: 'Outfall', count: 0 },
    ]);
    expect(out.facets.tag).toEqual([{ value: 'culvert', label: 'culvert', count: 1 }]);
    expect(out).toMatchObject({ total: 1, page: 1, pages: 1, perPage: 20 });
  });
});

describe('figure / figureRange', () => {
  it('prints three significant figures and ranges', () => {
    expect(figure(5.2634)).toBe('5.26');
    expect(figure(0.0123)).toBe('0.0123');
    expect(figure(85)).toBe('85');
    expect(figure(0)).toBe('0');
    expect(figureRange(4.123, 6.01)).toBe('4.12–6.01');
    expect(figureRange(5.261, 5.2612)).toBe('5.26');
    expect(figureRange(null, null)).toBe('—');
  });
});
