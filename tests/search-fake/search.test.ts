/**
 * Search on the fake through the SDK: relevance, prefix and typo matching, placeholder
 * search, filters, sorting, facets, pagination, highlighting and cropping, retrieval,
 * distinct, multi-search, and the parameter errors.
 */
import { MeilisearchError } from 'meilisearch';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiError, idsOf, startFake, succeeded, type FakeHandle } from './fake';

let h: FakeHandle;

const CASES = [
  { id: 'c1', firmId: 'firm-a', title: 'Hydraulic jump in a rectangular channel', summary: 'A jump below a sluice gate.', body: 'The flow is supercritical upstream of the jump and subcritical downstream.', tags: ['jump', 'channel'], year: 2001, froude: 4.5, status: 'published' },
  { id: 'c2', firmId: 'firm-a', title: 'Tidal bore on an estuary', summary: 'An undular bore travelling upstream.', body: 'The bore forms when the tide rises quickly in a narrowing estuary.', tags: ['bore'], year: 1999, froude: 1.3, status: 'draft' },
  { id: 'c3', firmId: 'firm-b', title: 'Stilling basin design', summary: 'Baffle blocks shorten the hydraulic jump.', body: 'A basin with baffle blocks and an end sill keeps the jump on the apron.', tags: ['jump', 'basin'], year: 2010, froude: 9, status: 'published' },
  { id: 'c4', firmId: 'firm-b', title: 'Sluice gate discharge', summary: 'Free and submerged flow under a gate.', body: 'Discharge coefficients for a vertical sluice gate.', tags: ['gate'], year: 2005, froude: 2.2, status: 'in review' },
  { id: 'c5', firmId: 'firm-a', title: 'Écoulement torrentiel', summary: 'Un ressaut hydraulique dans un canal.', body: 'Mesures sur modèle réduit.', tags: ['jump'], year: 2015, status: 'published' },
  { id: 'c6', firmId: 'firm-c', title: 'Culvert outlet', summary: 'Energy dissipation downstream of a culvert.', body: 'Riprap protects the bed where the flow leaves the culvert <b>barrel</b>.', tags: ['culvert', 'energy'], year: 2018, froude: 3.1, status: 'published' },
];

beforeAll(async () => {
  h = await startFake();
  const index = h.client.index('cases');
  succeeded(
    await index
      .updateSettings({
        searchableAttributes: ['title', 'summary', 'body', 'tags'],
        filterableAttributes: ['firmId', 'tags', 'year', 'froude', 'status'],
        sortableAttributes: ['year', 'froude', 'title'],
      })
      .waitTask(),
  );
  succeeded(await index.addDocuments(CASES, { primaryKey: 'id' }).waitTask());
});
afterAll(async () => {
  await h.cleanup();
});

const cases = () => h.client.index('cases');

describe('matching and relevance', () => {
  it('ranks a match in an earlier searchable attribute first', async () => {
    const res = await cases().search('basin');
    expect(idsOf(res.hits)).toEqual(['c3']);
    const jump = await cases().search('jump');
    // title (c1), then summary (c3), then… c5 only has the tag; attribute order decides.
    expect(idsOf(jump.hits).slice(0, 2)).toEqual(['c1', 'c3']);
    expect(idsOf(jump.hits)).toContain('c5');
  });

  it('ranks documents with more query words first and, by default, needs the first word', async () => {
    const res = await cases().search('sluice jump');
    expect(idsOf(res.hits)).toEqual(['c1', 'c4']);
    const all = await cases().search('sluice jump', { matchingStrategy: 'all' });
    expect(idsOf(all.hits)).toEqual(['c1']);
    const frequency = await cases().search('sluice jump', { matchingStrategy: 'frequency' });
    expect(idsOf(frequency.hits)).toEqual(expect.arrayContaining(['c1', 'c3', 'c4', 'c5']));
    expect(idsOf(frequency.hits)[0]).toBe('c1');
  });

  it('matches the last word as a prefix', async () => {
    expect(idsOf((await cases().search('estu')).hits)).toEqual(['c2']);
    expect(idsOf((await cases().search('tidal estu')).hits)).toEqual(['c2']);
    expect((await cases().search('estu tidal')).hits).toEqual([]);
  });

  it('tolerates typos like Meilisearch: none under 5 letters, 1 from 5, 2 from 9', async () => {
    expect(idsOf((await cases().search('hydrualic')).hits).sort()).toEqual(['c1', 'c3']);
    expect(idsOf((await cases().search('sluica')).hits).sort()).toEqual(['c1', 'c4']);
    expect(idsOf((await cases().search('sluiec')).hits).sort()).toEqual(['c1', 'c4']);
    expect((await cases().search('bote')).hits).toEqual([]);
    expect((await cases().search('xluice')).hits).toEqual([]);
    // A typo on the first letter counts as two: allowed only from 9 letters.
    expect(idsOf((await cases().search('xydraulic')).hits).sort()).toEqual(['c1', 'c3']);
  });

  it('ignores case and accents', async () => {
    expect(idsOf((await cases().search('ECOULEMENT')).hits)).toEqual(['c5']);
    expect(idsOf((await cases().search('modele reduit')).hits)).toEqual(['c5']);
  });

  it('returns every (filtered) document in a stable order for an empty query', async () => {
    const res = await cases().search('');
    expect(idsOf(res.hits)).toEqual(CASES.map((c) => c.id));
    expect(res).toMatchObject({ query: '', limit: 20, offset: 0, estimatedTotalHits: 6 });
    expect(typeof res.processingTimeMs).toBe('number');
    expect(idsOf((await cases().search(null, { filter: 'firmId = firm-b' })).hits)).toEqual(['c3', 'c4']);
    expect(idsOf((await cases().search(undefined)).hits)).toEqual(CASES.map((c) => c.id));
  });

  it('searches only the attributes asked for', async () => {
    expect(idsOf((await cases().search('jump', { attributesToSearchOn: ['title'] })).hits)).toEqual(['c1']);
    expect(await apiError(cases().search('jump', { attributesToSearchOn: ['firmId'] }))).toMatchObject({ status: 400, code: 'invalid_search_attributes_to_search_on' });
  });

  it('gives a ranking score between 0 and 1', async () => {
    const res = await cases().search('hydraulic jump', { showRankingScore: true });
    const scores = res.hits.map((hit) => hit._rankingScore as number);
    for (const score of scores) expect(score).toBeGreaterThan(0);
    for (const score of scores) expect(score).toBeLessThanOrEqual(1);
    expect(scores[0]).toBe(Math.max(...scores));
  });
});

describe('filters, sorting and pagination', () => {
  it('combines a query with a filter (string or array form)', async () => {
    expect(idsOf((await cases().search('jump', { filter: 'firmId = firm-a' })).hits)).toEqual(['c1', 'c5']);
    expect(idsOf((await cases().search('jump', { filter: ['firmId = firm-b', ['year < 2005', 'froude > 5']] })).hits)).toEqual(['c3']);
    expect(idsOf((await cases().search('', { filter: 'froude 2 TO 5 AND NOT status = draft' })).hits)).toEqual(['c1', 'c4', 'c6']);
  });

  it('sorts on sortable attributes, documents without the field last', async () => {
    expect(idsOf((await cases().search('', { sort: ['year:desc'] })).hits)).toEqual(['c6', 'c5', 'c3', 'c4', 'c1', 'c2']);
    expect(idsOf((await cases().search('', { sort: ['froude:asc'] })).hits)).toEqual(['c2', 'c4', 'c6', 'c1', 'c3', 'c5']);
    expect(idsOf((await cases().search('', { sort: ['froude:desc'] })).hits)).toEqual(['c3', 'c1', 'c6', 'c4', 'c2', 'c5']);
    // Strings compare in their normalised form: "Écoulement" sorts with the e's.
    expect(idsOf((await cases().search('', { sort: ['title:asc'], limit: 3 })).hits)).toEqual(['c6', 'c5', 'c1']);
    expect(idsOf((await cases().search('', { filter: 'status = published', sort: ['year:asc'] })).hits)).toEqual(['c1', 'c3', 'c5', 'c6']);
  });

  it('sorts a keyword search within the relevance buckets before `sort`, or strictly with `sort` first', async () => {
    const index = h.client.index('sorted-relevance');
    await index.updateSettings({ sortableAttributes: ['y'] }).waitTask();
    await index.addDocuments([{ id: 1, t: 'alpha beta', y: 1 }, { id: 2, t: 'alpha', y: 3 }, { id: 3, t: 'alpha', y: 2 }, { id: 4, t: 'alpha beta', y: 5 }]).waitTask();
    // Default rules (words, typo, proximity, attribute, sort, exactness): both words first.
    expect(idsOf((await index.search('alpha beta', { sort: ['y:desc'] })).hits)).toEqual([4, 1, 2, 3]);
    await index.updateRankingRules(['sort', 'words', 'typo', 'proximity', 'attribute', 'exactness']).waitTask();
    expect(idsOf((await index.search('alpha beta', { sort: ['y:desc'] })).hits)).toEqual([4, 2, 3, 1]);
    await index.updateRankingRules(['words', 'typo']).waitTask();
    expect(await apiError(index.search('alpha', { sort: ['y:desc'] }))).toMatchObject({ status: 400, code: 'invalid_search_sort' });
  });

  it('rejects a sort on an attribute that is not sortable, or malformed', async () => {
    expect(await apiError(cases().search('', { sort: ['firmId:asc'] }))).toMatchObject({
      status: 400,
      code: 'invalid_search_sort',
      message: 'Attribute `firmId` is not sortable. Available sortable attributes are: `froude`, `title`, `year`.',
    });
    expect(await apiError(cases().search('', { sort: ['year'] }))).toMatchObject({ status: 400, code: 'invalid_search_sort' });
  });

  it('pages with offset/limit and with page/hitsPerPage', async () => {
    const res = await cases().search('', { offset: 2, limit: 2 });
    expect(idsOf(res.hits)).toEqual(['c3', 'c4']);
    expect(res).toMatchObject({ offset: 2, limit: 2, estimatedTotalHits: 6 });
    const page = await cases().search('', { page: 2, hitsPerPage: 4 });
    expect(idsOf(page.hits)).toEqual(['c5', 'c6']);
    expect(page).toMatchObject({ page: 2, hitsPerPage: 4, totalPages: 2, totalHits: 6 });
    expect(page).not.toHaveProperty('estimatedTotalHits');
    const none = await cases().search('', { limit: 0 });
    expect(none.hits).toEqual([]);
    expect(none.estimatedTotalHits).toBe(6);
  });

  it('caps the hits at pagination.maxTotalHits', async () => {
    const index = h.client.index('capped');
    await index.updatePagination({ maxTotalHits: 3 }).waitTask();
    await index.addDocuments(Array.from({ length: 8 }, (_, i) => ({ id: i, word: 'same' }))).waitTask();
    const res = await index.search('same', { limit: 20 });
    expect(res.hits).toHaveLength(3);
    expect(res.estimatedTotalHits).toBe(3);
    expect((await index.search('same', { offset: 2, limit: 5 })).hits).toHaveLength(1);
  });

  it('keeps one document per value of a distinct attribute', async () => {
    const res = await cases().search('', { distinct: 'firmId' });
    expect(idsOf(res.hits)).toEqual(['c1', 'c3', 'c6']);
    expect(await apiError(cases().search('', { distinct: 'title' }))).toMatchObject({ status: 400, code: 'invalid_search_distinct' });
  });
});

describe('facets', () => {
  it('counts facet values over the filtered result, each array value once', async () => {
    const res = await cases().search('', { filter: 'firmId IN [firm-a, firm-b]', facets: ['tags', 'status', 'year'] });
    expect(res.facetDistribution).toEqual({
      tags: { basin: 1, bore: 1, channel: 1, gate: 1, jump: 3 },
      status: { draft: 1, 'in review': 1, published: 3 },
      year: { '1999': 1, '2001': 1, '2005': 1, '2010': 1, '2015': 1 },
    });
    expect(res.facetStats).toEqual({ year: { min: 1999, max: 2015 } });
    const withQuery = await cases().search('jump', { facets: ['firmId', 'froude'] });
    expect(withQuery.facetDistribution?.firmId).toEqual({ 'firm-a': 2, 'firm-b': 1 });
    expect(withQuery.facetStats?.froude).toEqual({ min: 4.5, max: 9 });
  });

  it('sorts facet values by count when asked, and keeps at most maxValuesPerFacet', async () => {
    const index = h.client.index('facet-order');
    await index.updateSettings({ filterableAttributes: ['t'], faceting: { maxValuesPerFacet: 2, sortFacetValuesBy: { t: 'count' } } }).waitTask();
    await index.addDocuments([{ id: 1, t: ['b', 'c'] }, { id: 2, t: ['c'] }, { id: 3, t: ['a', 'c', 'b'] }]).waitTask();
    const res = await index.search('', { facets: ['t'] });
    expect(Object.entries(res.facetDistribution?.t ?? {})).toEqual([
      ['c', 3],
      ['b', 2],
    ]);
  });

  it('gives the disjunctive counts the app needs through a multi-search', async () => {
    const { results } = await h.client.multiSearch({
      queries: [
        { indexUid: 'cases', q: 'jump', filter: ['firmId = firm-a', 'tags IN [jump]'], facets: ['tags', 'status'] },
        { indexUid: 'cases', q: 'jump', filter: ['firmId = firm-a'], facets: ['tags'], limit: 0 },
      ],
    });
    expect(results.map((r) => r.indexUid)).toEqual(['cases', 'cases']);
    expect(idsOf(results[0]?.hits ?? [])).toEqual(['c1', 'c5']);
    expect(results[1]?.hits).toEqual([]);
    expect(results[1]?.facetDistribution).toEqual({ tags: { channel: 1, jump: 2 } });
  });

  it('refuses facets on attributes that are not filterable; * means all filterable ones', async () => {
    expect(await apiError(cases().search('', { facets: ['title'] }))).toMatchObject({ status: 400, code: 'invalid_search_facets' });
    const all = await cases().search('', { facets: ['*'] });
    expect(Object.keys(all.facetDistribution ?? {}).sort()).toEqual(['firmId', 'froude', 'status', 'tags', 'year']);
  });
});

describe('highlighting and cropping', () => {
  it('wraps the matched words, prefix and typo matches too, in _formatted', async () => {
    const res = await cases().search('hydrualic ju', { attributesToHighlight: ['title', 'summary'] });
    const c1 = res.hits.find((hit) => hit.id === 'c1');
    expect(c1?._formatted?.title).toBe('<em>Hydraulic</em> <em>ju</em>mp in a rectangular channel');
    const c3 = res.hits.find((hit) => hit.id === 'c3');
    expect(c3?._formatted?.summary).toBe('Baffle blocks shorten the <em>hydraulic</em> <em>ju</em>mp.');
    expect(c1?.title).toBe('Hydraulic jump in a rectangular channel');
  });

  it('uses any tags as given (no HTML escaping), and copies other fields as strings', async () => {
    const res = await cases().search('culvert', { attributesToHighlight: ['*'], highlightPreTag: '\u0001', highlightPostTag: '$&\u0002' });
    const hit = res.hits[0];
    expect(hit?._formatted).toEqual({
      id: 'c6',
      firmId: 'firm-c',
      title: '\u0001Culvert$&\u0002 outlet',
      summary: 'Energy dissipation downstream of a \u0001culvert$&\u0002.',
      body: 'Riprap protects the bed where the flow leaves the \u0001culvert$&\u0002 <b>barrel</b>.',
      tags: ['\u0001culvert$&\u0002', 'energy'],
      year: '2018',
      froude: '3.1',
      status: 'published',
    });
  });

  it('gives no _formatted unless an attribute is highlighted or cropped', async () => {
    expect((await cases().search('culvert')).hits[0]).not.toHaveProperty('_formatted');
    expect((await cases().search('culvert', { attributesToHighlight: ['nope'] })).hits[0]).not.toHaveProperty('_formatted');
  });

  it('crops around the matches with the marker where text was cut', async () => {
    const res = await cases().search('narrowing', { attributesToCrop: ['body'], cropLength: 4 });
    // Centred on the match, but never past the end of the text.
    expect(res.hits[0]?._formatted?.body).toBe('…in a narrowing estuary.');
    const middle = await cases().search('rises', { attributesToCrop: ['body'], cropLength: 3 });
    expect(middle.hits[0]?._formatted?.body).toBe('…tide rises quickly…');
    const marked = await cases().search('narrowing', { attributesToCrop: ['body:3'], cropMarker: '[…]', attributesToHighlight: ['body'] });
    expect(marked.hits[0]?._formatted?.body).toBe('[…]a <em>narrowing</em> estuary.');
    const start = await cases().search('tide', { attributesToCrop: ['title'], cropLength: 2 });
    expect(start.hits[0]?._formatted?.title).toBe('Tidal bore…');
    const short = await cases().search('culvert', { attributesToCrop: ['title'], cropLength: 5 });
    expect(short.hits[0]?._formatted?.title).toBe('Culvert outlet');
  });

  it('retrieves only the attributes asked for, _formatted keeping those and the formatted ones', async () => {
    const res = await cases().search('culvert', { attributesToRetrieve: ['id', 'year'], attributesToHighlight: ['title'] });
    expect(res.hits[0]).toEqual({ id: 'c6', year: 2018, _formatted: { id: 'c6', title: '<em>Culvert</em> outlet', year: '2018' } });
  });

  it('gives match positions in bytes', async () => {
    const res = await cases().search('ecoulement', { showMatchesPosition: true, attributesToRetrieve: ['id'] });
    expect(res.hits[0]?._matchesPosition).toEqual({ title: [{ start: 0, length: 11 }] });
    const arr = await cases().search('culvert', { showMatchesPosition: true, attributesToRetrieve: ['id'] });
    expect(arr.hits[0]?._matchesPosition?.tags).toEqual([{ start: 0, length: 7, indices: [0] }]);
  });
});

describe('the other forms of search', () => {
  it('answers the GET form', async () => {
    const res = await cases().searchGet('jump', { filter: 'firmId = firm-b', facets: ['tags'], attributesToHighlight: ['title'], limit: 5 });
    expect(idsOf(res.hits)).toEqual(['c3']);
    expect(res.facetDistribution?.tags).toEqual({ basin: 1, jump: 1 });
    await expect(cases().searchGet('x', { filter: ['a = 1'] })).rejects.toBeInstanceOf(MeilisearchError);
  });

  it('fails a whole multi-search on one bad query, naming it', async () => {
    const error = await apiError(
      h.client.multiSearch({
        queries: [
          { indexUid: 'cases', q: 'jump' },
          { indexUid: 'cases', q: 'jump', filter: 'title = x' },
        ],
      }),
    );
    expect(error).toMatchObject({ status: 400, code: 'invalid_search_filter' });
    expect(error.message).toMatch(/^Inside `\.queries\[1\]`: Attribute `title` is not filterable\./);
    expect(await apiError(h.client.multiSearch({ queries: [{ indexUid: 'missing-index', q: 'x' }] }))).toMatchObject({ status: 404, code: 'index_not_found' });
  });

  it('rejects unknown and mistyped parameters as Meilisearch does', async () => {
    expect(await apiError(cases().search('x', { colour: 'red' } as never))).toMatchObject({ status: 400, code: 'bad_request' });
    expect(await apiError(cases().search('x', { limit: 'ten' } as never))).toMatchObject({ status: 400, code: 'invalid_search_limit' });
    expect(await apiError(cases().search('x', { offset: -1 }))).toMatchObject({ status: 400, code: 'invalid_search_offset' });
    expect(await apiError(cases().search('x', { attributesToHighlight: 'title' as never }))).toMatchObject({ status: 400, code: 'invalid_search_attributes_to_highlight' });
    expect(await apiError(cases().search('x', { matchingStrategy: 'some' as never }))).toMatchObject({ status: 400, code: 'invalid_search_matching_strategy' });
    expect(await apiError(cases().search(42 as never))).toMatchObject({ status: 400, code: 'invalid_search_q' });
  });

  it('uses synonyms and ignores stop words', async () => {
    const index = h.client.index('synonyms');
    await index.updateSettings({ synonyms: { dam: ['weir'] }, stopWords: ['the'] }).waitTask();
    await index.addDocuments([{ id: 1, t: 'a broad crested weir' }, { id: 2, t: 'the end' }]).waitTask();
    expect(idsOf((await index.search('dam')).hits)).toEqual([1]);
    expect(idsOf((await index.search('the weir')).hits)).toEqual([1]);
  });
});
