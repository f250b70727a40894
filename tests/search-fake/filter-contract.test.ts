/**
 * Filter expressions on the fake through the SDK: what they select, the errors Meilisearch
 * gives for bad ones (a 400 `invalid_search_filter` the SDK throws as MeilisearchApiError),
 * and the fake still answering after each.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiError, idsOf, startFake, succeeded, type FakeHandle } from './fake';

let h: FakeHandle;

const DOCS = [
  { id: 1, firmId: 'firm-a', kind: 'jump', year: 2001, froude: 4.5, tags: ['jump', 'channel'], note: null, label: 'a, b' },
  { id: 2, firmId: 'firm-a', kind: 'bore', year: 1999, froude: 1.3, tags: ['bore'], note: 'x', label: 'x]y' },
  { id: 3, firmId: 'firm-b', kind: 'jump', year: 2010, froude: 9, tags: [], label: 'say "hi"' },
  { id: 4, firmId: 'a" OR firmId = "firm-a', kind: 'weir', year: 2005, tags: ['weir'], label: "it's" },
];

beforeAll(async () => {
  h = await startFake();
  const index = h.client.index('filters');
  succeeded(await index.updateFilterableAttributes(['firmId', 'kind', 'year', 'froude', 'tags', 'note', 'label']).waitTask());
  succeeded(await index.addDocuments(DOCS, { primaryKey: 'id' }).waitTask());
});
afterAll(async () => {
  await h.cleanup();
});

const select = async (filter: string | Array<string | string[]>) => idsOf((await h.client.index('filters').search('', { filter, limit: 100 })).hits);

/** How the app quotes a value: backslashes and double quotes escaped, inside double quotes. */
const quote = (value: string) => `"${value.replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"`;

describe('filters through the SDK', () => {
  it.each<[string | Array<string | string[]>, number[]]>([
    ['firmId = firm-a', [1, 2]],
    ['firmId = firm-a AND kind = jump OR firmId = firm-b', [1, 3]],
    ['firmId = firm-a AND (kind = jump OR firmId = firm-b)', [1]],
    ['NOT firmId = firm-a AND NOT kind = weir', [3]],
    ['year 1999 TO 2005', [1, 2, 4]],
    ['froude > 2 AND froude <= 9', [1, 3]],
    ['tags IN [bore, weir]', [2, 4]],
    ['tags NOT IN [jump]', [2, 3, 4]],
    ['tags IS EMPTY', [3]],
    ['note IS NULL', [1]],
    ['note EXISTS', [1, 2]],
    ['note NOT EXISTS', [3, 4]],
    ['label IN ["a, b", "x]y"]', [1, 2]],
    [`label = ${quote('say "hi"')}`, [3]],
    ["label = 'it\\'s'", [4]],
    ['tags IN []', []],
    [[['kind = bore', 'kind = weir'], 'year > 2000'], [4]],
    [['firmId = firm-a', ['tags = jump', 'tags = bore']], [1, 2]],
  ])('%j', async (filter, expected) => expect(await select(filter)).toEqual(expected));

  it('keeps a crafted value inside its quotes', async () => {
    expect(await select(`firmId = ${quote('a" OR firmId = "firm-a')}`)).toEqual([4]);
    expect(await select(`firmId = ${quote('nobody" OR firmId = "firm-a')}`)).toEqual([]);
    expect(await select(['kind = jump', `firmId = ${quote('x") OR (firmId = "firm-b')}`])).toEqual([]);
  });
});

describe('bad filters answer 400 invalid_search_filter and the fake keeps working', () => {
  it.each<[string, unknown, RegExp]>([
    ['unbalanced parenthesis', '(firmId = firm-a AND kind = jump', /is missing the following closing delimiter: `\)`\.\n1:33 /],
    ['extra closing parenthesis', 'firmId = firm-a)', /Found unexpected characters at the end of the filter: `\)`/],
    ['dangling operator', 'firmId = firm-a AND', /but instead got nothing\.\n20:20 firmId = firm-a AND$/],
    ['missing value', 'year >', /Was expecting a value but instead got nothing/],
    ['attribute not filterable', 'title = x', /^Attribute `title` is not filterable\. Available filterable attribute patterns are: `firmId`, `froude`, `kind`, `label`, `note`, `tags`, `year`\.\n1:6 title = x$/],
    ['unterminated quote', 'firmId = "firm-a', /Expression `\\"firm-a` is missing the following closing delimiter: `"`\.\n10:17 /],
    ['IN without brackets', 'tags IN bore', /Expected `\[` after `IN` keyword/],
    ['IN not closed', 'tags IN [bore, weir', /Expected matching `\]`/],
    ['keyword as a value', 'kind = AND', /reserved keyword/],
    ['wrong type', 42, /Invalid syntax for the filter parameter: `expected String, Array, found: 42`/],
    ['wrong type inside the array', ['kind = jump', [3]], /expected String, found: 3/],
  ])('%s', async (_name, filter, pattern) => {
    const error = await apiError(h.client.index('filters').search('', { filter: filter as string }));
    expect(error).toMatchObject({ status: 400, code: 'invalid_search_filter', type: 'invalid_request', link: 'https://docs.meilisearch.com/errors#invalid_search_filter' });
    expect(error.message).toMatch(pattern);
    expect(await select('kind = jump')).toEqual([1, 3]);
  });

  it('reports the same errors in multi-search, GET search, document fetch and deletion', async () => {
    const multi = await apiError(h.client.multiSearch({ queries: [{ indexUid: 'filters', filter: 'kind =' }] }));
    expect(multi).toMatchObject({ status: 400, code: 'invalid_search_filter' });
    expect(multi.message).toMatch(/^Inside `\.queries\[0\]`: Was expecting a value/);
    expect(await apiError(h.client.index('filters').searchGet('', { filter: 'kind = (' }))).toMatchObject({ status: 400, code: 'invalid_search_filter' });
    expect(await apiError(h.client.index('filters').getDocuments({ filter: 'kind = ' }))).toMatchObject({ status: 400, code: 'invalid_document_filter' });
    expect(await apiError(h.client.index('filters').deleteDocuments({ filter: '(kind = jump' }))).toMatchObject({ status: 400, code: 'invalid_document_filter' });
    expect((await h.client.index('filters').getDocuments()).total).toBe(4);
  });

  it('needs the experimental feature for CONTAINS, as Meilisearch does', async () => {
    expect(await apiError(h.client.index('filters').search('', { filter: 'kind CONTAINS um' }))).toMatchObject({ status: 400, code: 'feature_not_enabled' });
    await h.client.updateExperimentalFeatures({ containsFilter: true });
    expect(await select('kind CONTAINS um')).toEqual([1, 3]);
    await h.client.updateExperimentalFeatures({ containsFilter: false });
    expect((await h.client.getExperimentalFeatures()).containsFilter).toBe(false);
  });
});
