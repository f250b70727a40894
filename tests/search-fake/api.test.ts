/**
 * The search fake through the official meilisearch SDK: health, keys, indexes, settings,
 * documents, tasks and index swaps, with Meilisearch's answer shapes and error codes.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { API_KEY, apiError, clientFor, startFake, succeeded, type FakeHandle } from './fake';

let h: FakeHandle;
beforeAll(async () => {
  h = await startFake();
});
afterAll(async () => {
  await h.cleanup();
});

/** A raw request with the key (for what the SDK cannot send). */
async function raw(method: string, pathname: string, body?: string, headers: Record<string, string> = {}) {
  const res = await fetch(`${h.fake.url}${pathname}`, {
    method,
    body,
    headers: { authorization: `Bearer ${API_KEY}`, 'content-type': 'application/json', ...headers },
  });
  return { status: res.status, type: res.headers.get('content-type'), body: (await res.json()) as Record<string, unknown> };
}

describe('health, version and the API key', () => {
  it('answers /health without a key', async () => {
    expect(await clientFor(h.fake.url, null).health()).toEqual({ status: 'available' });
    expect(await clientFor(h.fake.url, 'wrong').isHealthy()).toBe(true);
  });

  it('answers the version', async () => {
    const version = await h.client.getVersion();
    expect(version.pkgVersion).toMatch(/^\d+\.\d+\.\d+$/);
    expect(typeof version.commitSha).toBe('string');
  });

  it('refuses a request without a key (401) or with a wrong one (403)', async () => {
    expect(await apiError(clientFor(h.fake.url, null).getIndexes())).toMatchObject({
      status: 401,
      code: 'missing_authorization_header',
      type: 'auth',
      link: 'https://docs.meilisearch.com/errors#missing_authorization_header',
    });
    expect(await apiError(clientFor(h.fake.url, 'not-the-key').index('x').search('a'))).toMatchObject({ status: 403, code: 'invalid_api_key', type: 'auth' });
    expect(await apiError(clientFor(h.fake.url, 'not-the-key').createIndex('x'))).toMatchObject({ status: 403, code: 'invalid_api_key' });
  });

  it('answers JSON to everything, unknown routes and bad bodies included', async () => {
    const unknown = await raw('GET', '/no/such/route');
    expect(unknown).toMatchObject({ status: 404, type: 'application/json', body: { code: 'not_found', type: 'invalid_request' } });
    const method = await raw('PUT', '/health');
    expect(method).toMatchObject({ status: 405, type: 'application/json', body: { code: 'method_not_allowed' } });
    const badJson = await raw('POST', '/indexes', '{"uid": ');
    expect(badJson).toMatchObject({ status: 400, body: { code: 'bad_request' } });
    expect(String(badJson.body.message)).toMatch(/^Json deserialize error/);
    const badDocs = await raw('POST', '/indexes/x/documents', '[{"id": 1},');
    expect(badDocs).toMatchObject({ status: 400, body: { code: 'malformed_payload' } });
    const noBody = await raw('POST', '/indexes/x/documents', '');
    expect(noBody).toMatchObject({ status: 400, body: { code: 'missing_payload' } });
    const csv = await raw('POST', '/indexes/x/documents', 'id\n1', { 'content-type': 'text/csv' });
    expect(csv).toMatchObject({ status: 415, body: { code: 'invalid_content_type' } });
    const noKey = await fetch(`${h.fake.url}/indexes`);
    expect(noKey.headers.get('content-type')).toBe('application/json');
    expect(await noKey.json()).toMatchObject({ code: 'missing_authorization_header' });
  });
});

describe('indexes', () => {
  it('creates an index through a task, and reads it', async () => {
    const enqueued = await h.client.createIndex('idx-one', { primaryKey: 'ref' });
    expect(enqueued).toEqual({ taskUid: expect.any(Number), indexUid: 'idx-one', status: 'enqueued', type: 'indexCreation', enqueuedAt: expect.any(String) });
    const task = succeeded(await h.client.tasks.waitForTask(enqueued.taskUid));
    expect(task).toMatchObject({ uid: enqueued.taskUid, indexUid: 'idx-one', type: 'indexCreation', details: { primaryKey: 'ref' }, canceledBy: null });
    expect(task.duration).toMatch(/^PT\d+\.\d+S$/);
    const index = await h.client.getIndex('idx-one');
    expect(index.uid).toBe('idx-one');
    expect(index.primaryKey).toBe('ref');
    expect(index.createdAt).toBeInstanceOf(Date);
    expect(Number.isNaN(index.createdAt?.getTime())).toBe(false);
    const raw = await h.client.getRawIndex('idx-one');
    expect(Object.keys(raw).sort()).toEqual(['createdAt', 'primaryKey', 'uid', 'updatedAt']);
  });

  it('fails the task (does not throw) when the index already exists', async () => {
    const task = await h.client.createIndex('idx-one').waitTask();
    expect(task.status).toBe('failed');
    expect(task.error).toEqual({
      message: 'Index `idx-one` already exists.',
      code: 'index_already_exists',
      type: 'invalid_request',
      link: 'https://docs.meilisearch.com/errors#index_already_exists',
    });
  });

  it('rejects an invalid uid at once', async () => {
    expect(await apiError(h.client.createIndex('not valid!'))).toMatchObject({ status: 400, code: 'invalid_index_uid' });
    expect(await apiError(h.client.getIndex('not valid!'))).toMatchObject({ status: 400, code: 'invalid_index_uid' });
  });

  it('lists indexes in pages, sorted by uid', async () => {
    for (const uid of ['list-c', 'list-a', 'list-b']) await h.client.createIndex(uid).waitTask();
    const all = await h.client.getRawIndexes({ limit: 100 });
    const uids = all.results.map((i) => i.uid);
    expect(uids).toEqual([...uids].sort());
    expect(all.total).toBe(uids.length);
    const page = await h.client.getRawIndexes({ offset: 1, limit: 2 });
    expect(page).toMatchObject({ offset: 1, limit: 2, total: all.total });
    expect(page.results.map((i) => i.uid)).toEqual(uids.slice(1, 3));
    const wrapped = await h.client.getIndexes({ limit: 1 });
    expect(wrapped.results[0]?.uid).toBe(uids[0]);
  });

  it('updates the primary key until there are documents', async () => {
    await h.client.createIndex('idx-pk').waitTask();
    succeeded(await h.client.updateIndex('idx-pk', { primaryKey: 'key' }).waitTask());
    expect((await h.client.getIndex('idx-pk')).primaryKey).toBe('key');
    succeeded(await h.client.index('idx-pk').addDocuments([{ key: 'a' }]).waitTask());
    const task = await h.client.updateIndex('idx-pk', { primaryKey: 'other' }).waitTask();
    expect(task.status).toBe('failed');
    expect(task.error?.code).toBe('index_primary_key_already_exists');
  });

  it('deletes an index; a missing one fails the task and 404s on read', async () => {
    await h.client.createIndex('idx-gone').waitTask();
    const task = succeeded(await h.client.deleteIndex('idx-gone').waitTask());
    expect(task).toMatchObject({ type: 'indexDeletion', details: { deletedDocuments: 0 } });
    expect(await apiError(h.client.getIndex('idx-gone'))).toEqual({
      status: 404,
      message: 'Index `idx-gone` not found.',
      code: 'index_not_found',
      type: 'invalid_request',
      link: 'https://docs.meilisearch.com/errors#index_not_found',
    });
    const again = await h.client.deleteIndex('idx-gone').waitTask();
    expect(again.status).toBe('failed');
    expect(again.error?.code).toBe('index_not_found');
    expect(await apiError(h.client.index('idx-gone').search('x'))).toMatchObject({ status: 404, code: 'index_not_found' });
  });

  it('gives index and database stats', async () => {
    await h.client.index('idx-stats').addDocuments([{ id: 1, a: 'x' }, { id: 2, a: 'y', b: 2 }]).waitTask();
    const stats = await h.client.index('idx-stats').getStats();
    expect(stats).toMatchObject({ numberOfDocuments: 2, isIndexing: false, fieldDistribution: { a: 2, b: 1, id: 2 } });
    expect(stats.avgDocumentSize).toBeGreaterThan(0);
    await h.fake.flush();
    const all = await h.client.getStats();
    expect(all.databaseSize).toBeGreaterThan(0);
    expect(all.indexes['idx-stats']?.numberOfDocuments).toBe(2);
    expect(typeof all.lastUpdate).toBe('string');
  });
});

describe('settings', () => {
  it('starts from the Meilisearch defaults', async () => {
    await h.client.createIndex('set-defaults').waitTask();
    const settings = await h.client.index('set-defaults').getSettings();
    expect(settings).toMatchObject({
      displayedAttributes: ['*'],
      searchableAttributes: ['*'],
      filterableAttributes: [],
      sortableAttributes: [],
      rankingRules: ['words', 'typo', 'proximity', 'attribute', 'sort', 'exactness'],
      stopWords: [],
      synonyms: {},
      distinctAttribute: null,
      typoTolerance: { enabled: true, minWordSizeForTypos: { oneTypo: 5, twoTypos: 9 }, disableOnWords: [], disableOnAttributes: [] },
      faceting: { maxValuesPerFacet: 100, sortFacetValuesBy: { '*': 'alpha' } },
      pagination: { maxTotalHits: 1000 },
    });
  });

  it('updates settings through a task (creating the index), merging nested objects', async () => {
    const index = h.client.index('set-update');
    const task = succeeded(await index.updateSettings({ filterableAttributes: ['firmId', 'year'], sortableAttributes: ['year'], typoTolerance: { minWordSizeForTypos: { oneTypo: 4 } } }).waitTask());
    expect(task).toMatchObject({ type: 'settingsUpdate', indexUid: 'set-update', details: { filterableAttributes: ['firmId', 'year'], sortableAttributes: ['year'] } });
    succeeded(await index.updateSettings({ typoTolerance: { enabled: false } }).waitTask());
    const settings = await index.getSettings();
    expect(settings.filterableAttributes).toEqual(['firmId', 'year']);
    expect(settings.typoTolerance).toMatchObject({ enabled: false, minWordSizeForTypos: { oneTypo: 4, twoTypos: 9 } });
    succeeded(await index.updateSettings({ filterableAttributes: null }).waitTask());
    expect((await index.getSettings()).filterableAttributes).toEqual([]);
  });

  it('has the sub-routes the SDK calls', async () => {
    const index = h.client.index('set-sub');
    succeeded(await index.updateFilterableAttributes(['a', { attributePatterns: ['b*'], features: { facetSearch: false, filter: { equality: true, comparison: true } } }]).waitTask());
    expect(await index.getFilterableAttributes()).toEqual(['a', { attributePatterns: ['b*'], features: { facetSearch: false, filter: { equality: true, comparison: true } } }]);
    succeeded(await index.updateSortableAttributes(['year', 'title']).waitTask());
    expect(await index.getSortableAttributes()).toEqual(['year', 'title']);
    succeeded(await index.updateSearchableAttributes(['title', 'body']).waitTask());
    expect(await index.getSearchableAttributes()).toEqual(['title', 'body']);
    succeeded(await index.updateDisplayedAttributes(['title']).waitTask());
    expect(await index.getDisplayedAttributes()).toEqual(['title']);
    succeeded(await index.updateStopWords(['the']).waitTask());
    expect(await index.getStopWords()).toEqual(['the']);
    succeeded(await index.updateSynonyms({ weir: ['dam'] }).waitTask());
    expect(await index.getSynonyms()).toEqual({ weir: ['dam'] });
    succeeded(await index.updateDistinctAttribute('a').waitTask());
    expect(await index.getDistinctAttribute()).toBe('a');
    succeeded(await index.updateRankingRules(['sort', 'words', 'typo', 'year:desc']).waitTask());
    expect(await index.getRankingRules()).toEqual(['sort', 'words', 'typo', 'year:desc']);
    succeeded(await index.updateTypoTolerance({ disableOnWords: ['froude'] }).waitTask());
    expect((await index.getTypoTolerance())?.disableOnWords).toEqual(['froude']);
    succeeded(await index.updateFaceting({ maxValuesPerFacet: 5 }).waitTask());
    expect(await index.getFaceting()).toEqual({ maxValuesPerFacet: 5, sortFacetValuesBy: { '*': 'alpha' } });
    succeeded(await index.updatePagination({ maxTotalHits: 50 }).waitTask());
    expect(await index.getPagination()).toEqual({ maxTotalHits: 50 });
    succeeded(await index.resetSortableAttributes().waitTask());
    expect(await index.getSortableAttributes()).toEqual([]);
    succeeded(await index.resetPagination().waitTask());
    expect(await index.getPagination()).toEqual({ maxTotalHits: 1000 });
    succeeded(await index.resetSettings().waitTask());
    expect(await index.getSearchableAttributes()).toEqual(['*']);
    expect(await index.getDisplayedAttributes()).toEqual(['*']);
  });

  it('rejects invalid settings at once, with the setting named in the code', async () => {
    const index = h.client.index('set-bad');
    expect(await apiError(index.updateSettings({ filterableAttributes: 'firmId' as never }))).toMatchObject({ status: 400, code: 'invalid_settings_filterable_attributes' });
    expect(await apiError(index.updateSettings({ rankingRules: ['speed'] }))).toMatchObject({ status: 400, code: 'invalid_settings_ranking_rules' });
    expect(await apiError(index.updateSettings({ colour: 'red' } as never))).toMatchObject({ status: 400, code: 'bad_request' });
    expect(await apiError(index.updateSortableAttributes([1] as never))).toMatchObject({ status: 400, code: 'invalid_settings_sortable_attributes' });
    expect(await apiError(index.updatePagination({ maxTotalHits: -1 }))).toMatchObject({ status: 400, code: 'invalid_settings_pagination' });
    expect(await apiError(h.client.index('set-missing').getSettings())).toMatchObject({ status: 404, code: 'index_not_found' });
  });
});

describe('documents', () => {
  it('creates the index on the first addition and infers the primary key', async () => {
    const index = h.client.index('docs-auto');
    const task = succeeded(await index.addDocuments([{ id: 1, title: 'One' }, { id: 'two', title: 'Two' }]).waitTask());
    expect(task).toMatchObject({ type: 'documentAdditionOrUpdate', details: { receivedDocuments: 2, indexedDocuments: 2 } });
    expect((await index.fetchInfo()).primaryKey).toBe('id');
    expect(await index.getDocument(1)).toEqual({ id: 1, title: 'One' });
    expect(await index.getDocument('two')).toEqual({ id: 'two', title: 'Two' });
    expect(await index.getDocuments()).toEqual({ results: [{ id: 1, title: 'One' }, { id: 'two', title: 'Two' }], offset: 0, limit: 20, total: 2 });
  });

  it('replaces with POST and merges with PUT', async () => {
    const index = h.client.index('docs-write');
    succeeded(await index.addDocuments([{ id: 'a', title: 'First', year: 2001 }], { primaryKey: 'id' }).waitTask());
    succeeded(await index.addDocuments([{ id: 'a', title: 'Replaced' }]).waitTask());
    expect(await index.getDocument('a')).toEqual({ id: 'a', title: 'Replaced' });
    succeeded(await index.updateDocuments([{ id: 'a', year: 2020 }, { id: 'b', title: 'New' }]).waitTask());
    expect(await index.getDocument('a')).toEqual({ id: 'a', title: 'Replaced', year: 2020 });
    expect(await index.getDocument('b')).toEqual({ id: 'b', title: 'New' });
    expect((await index.getDocuments({ fields: ['title'] })).results).toEqual([{ title: 'Replaced' }, { title: 'New' }]);
    expect((await index.getDocument('a', { fields: ['year'] }))).toEqual({ year: 2020 });
    expect(await apiError(index.getDocument('nope'))).toMatchObject({ status: 404, code: 'document_not_found', message: 'Document `nope` not found.' });
  });

  it('deletes one, some, by filter and all', async () => {
    const index = h.client.index('docs-delete');
    await index.updateFilterableAttributes(['kind']).waitTask();
    succeeded(
      await index
        .addDocuments(
          Array.from({ length: 6 }, (_, i) => ({ id: i + 1, kind: i % 2 === 0 ? 'odd' : 'even' })),
          { primaryKey: 'id' },
        )
        .waitTask(),
    );
    expect(succeeded(await index.deleteDocument(1).waitTask()).details).toMatchObject({ providedIds: 1, deletedDocuments: 1 });
    expect(succeeded(await index.deleteDocuments([2, '3', 99] as never).waitTask()).details).toMatchObject({ providedIds: 3, deletedDocuments: 2 });
    const byFilter = succeeded(await index.deleteDocuments({ filter: 'kind = odd' }).waitTask());
    expect(byFilter.details).toMatchObject({ deletedDocuments: 1, originalFilter: '"kind = odd"' });
    expect((await index.getDocuments()).results).toEqual([{ id: 4, kind: 'even' }, { id: 6, kind: 'even' }]);
    expect(succeeded(await index.deleteAllDocuments().waitTask()).details).toMatchObject({ deletedDocuments: 2 });
    expect((await index.getDocuments()).total).toBe(0);
  });

  it('fails the whole batch on a bad document id, indexing nothing', async () => {
    const index = h.client.index('docs-bad-id');
    await index.addDocuments([{ id: 'kept' }], { primaryKey: 'id' }).waitTask();
    const task = await index.addDocuments([{ id: 'fine' }, { id: 'not fine!' }]).waitTask();
    expect(task.status).toBe('failed');
    expect(task.error).toMatchObject({ code: 'invalid_document_id', type: 'invalid_request' });
    expect(task.error?.message).toContain('Document identifier `"not fine!"` is invalid.');
    expect(task.details).toMatchObject({ receivedDocuments: 2, indexedDocuments: 0 });
    expect((await index.getDocuments()).results).toEqual([{ id: 'kept' }]);
    const floatId = await index.addDocuments([{ id: 1.5 }]).waitTask();
    expect(floatId.error?.code).toBe('invalid_document_id');
    const missing = await index.addDocuments([{ title: 'no id' }]).waitTask();
    expect(missing.error?.code).toBe('missing_document_id');
  });

  it('fails when the primary key cannot be inferred, without creating the index', async () => {
    const task = await h.client.index('docs-ambiguous').addDocuments([{ id: 1, firmId: 'a' }]).waitTask();
    expect(task.error?.code).toBe('index_primary_key_multiple_candidates_found');
    expect(await apiError(h.client.getIndex('docs-ambiguous'))).toMatchObject({ code: 'index_not_found' });
    const none = await h.client.index('docs-none').addDocuments([{ title: 'x' }]).waitTask();
    expect(none.error?.code).toBe('index_primary_key_no_candidate_found');
  });

  it('checks the filter of a deletion: syntax at once, filterability in the task', async () => {
    const index = h.client.index('docs-delete-filter');
    await index.addDocuments([{ id: 1, kind: 'x' }]).waitTask();
    expect(await apiError(index.deleteDocuments({ filter: 'kind = ' }))).toMatchObject({ status: 400, code: 'invalid_document_filter' });
    const task = await index.deleteDocuments({ filter: 'kind = x' }).waitTask();
    expect(task.status).toBe('failed');
    expect(task.error).toMatchObject({ code: 'invalid_document_filter' });
    expect(task.error?.message).toContain('Attribute `kind` is not filterable.');
    expect((await index.getDocuments()).total).toBe(1);
  });

  it('fetches documents with a filter, fields, offset and limit', async () => {
    const index = h.client.index('docs-fetch');
    await index.updateSettings({ filterableAttributes: ['n'], sortableAttributes: ['n'] }).waitTask();
    await index.addDocuments(Array.from({ length: 10 }, (_, i) => ({ id: i, n: i, other: 'x' }))).waitTask();
    const page = await index.getDocuments({ filter: 'n >= 4', fields: ['id'], offset: 1, limit: 3 });
    expect(page).toEqual({ results: [{ id: 5 }, { id: 6 }, { id: 7 }], offset: 1, limit: 3, total: 6 });
    const sorted = await index.getDocuments({ filter: ['n < 3'], sort: ['n:desc'], fields: ['n'] });
    expect(sorted.results).toEqual([{ n: 2 }, { n: 1 }, { n: 0 }]);
    expect(await apiError(index.getDocuments({ filter: 'other = x' }))).toMatchObject({ status: 400, code: 'invalid_document_filter' });
  });

  it('reads NDJSON and rejects documents that are not objects', async () => {
    const index = h.client.index('docs-ndjson');
    succeeded(await index.addDocumentsFromString('{"id": 1, "a": "x"}\n{"id": 2, "a": "y"}\n', 'application/x-ndjson').waitTask());
    expect((await index.getDocuments()).total).toBe(2);
    expect(await apiError(index.addDocuments([1, 2] as never))).toMatchObject({ status: 400, code: 'malformed_payload' });
  });

  it('keeps attributes outside displayedAttributes out of documents', async () => {
    const index = h.client.index('docs-displayed');
    await index.addDocuments([{ id: 1, shown: 'a', secret: 'b' }]).waitTask();
    await index.updateDisplayedAttributes(['id', 'shown']).waitTask();
    expect(await index.getDocument(1)).toEqual({ id: 1, shown: 'a' });
    expect((await index.search('a')).hits).toEqual([{ id: 1, shown: 'a' }]);
  });
});

describe('tasks', () => {
  it('numbers tasks in order and processes them in order', async () => {
    const index = h.client.index('tasks-order');
    const enqueued = await Promise.all([1, 2, 3, 4, 5].map((n) => index.addDocuments([{ id: n, step: n }])));
    const uids = enqueued.map((t) => t.taskUid);
    expect(uids).toEqual([...uids].sort((a, b) => a - b));
    expect(new Set(uids).size).toBe(5);
    const tasks = await h.client.tasks.waitForTasks(enqueued);
    tasks.forEach(succeeded);
    const finished = tasks.map((t) => Date.parse(String(t.finishedAt)));
    expect(finished).toEqual([...finished].sort((a, b) => a - b));
    const first = await h.client.tasks.getTask(uids[0] as number);
    expect(Object.keys(first).sort()).toEqual(['batchUid', 'canceledBy', 'details', 'duration', 'enqueuedAt', 'error', 'finishedAt', 'indexUid', 'startedAt', 'status', 'type', 'uid']);
    expect(Date.parse(String(first.enqueuedAt))).not.toBeNaN();
  });

  it('lists tasks newest first with the SDK filters and pages', async () => {
    const index = h.client.index('tasks-list');
    await index.addDocuments([{ id: 1 }]).waitTask();
    await index.addDocuments([{ id: 'bad id' }]).waitTask();
    await index.updateFilterableAttributes(['id']).waitTask();
    const all = await h.client.tasks.getTasks({ indexUids: ['tasks-list'] });
    expect(all.results.map((t) => t.type)).toEqual(['settingsUpdate', 'documentAdditionOrUpdate', 'documentAdditionOrUpdate']);
    expect(all.total).toBe(3);
    const failed = await h.client.tasks.getTasks({ indexUids: ['tasks-list'], statuses: ['failed'] });
    expect(failed.results).toHaveLength(1);
    expect(failed.results[0]?.error?.code).toBe('invalid_document_id');
    const byType = await h.client.tasks.getTasks({ indexUids: ['tasks-list'], types: ['settingsUpdate'] });
    expect(byType.results).toHaveLength(1);
    const page = await h.client.tasks.getTasks({ indexUids: ['tasks-list'], limit: 2 });
    expect(page.results).toHaveLength(2);
    expect(page.next).toBe(all.results[2]?.uid);
    const rest = await h.client.tasks.getTasks({ indexUids: ['tasks-list'], limit: 2, from: page.next });
    expect(rest.results.map((t) => t.uid)).toEqual([all.results[2]?.uid]);
    expect(rest.next).toBeNull();
    const oldestFirst = await h.client.tasks.getTasks({ indexUids: ['tasks-list'], reverse: true });
    expect(oldestFirst.results.map((t) => t.uid)).toEqual(all.results.map((t) => t.uid).reverse());
  });

  it('rejects bad task filters and unknown tasks', async () => {
    expect(await apiError(h.client.tasks.getTasks({ statuses: ['done' as never] }))).toMatchObject({ status: 400, code: 'invalid_task_statuses' });
    expect(await apiError(h.client.tasks.getTask(999_999))).toMatchObject({ status: 404, code: 'task_not_found' });
  });

  it('deletes finished tasks matching a filter', async () => {
    const index = h.client.index('tasks-delete');
    await index.addDocuments([{ id: 1 }]).waitTask();
    const deletion = succeeded(await h.client.tasks.deleteTasks({ indexUids: ['tasks-delete'] }).waitTask());
    expect(deletion).toMatchObject({ type: 'taskDeletion', details: { matchedTasks: 1, deletedTasks: 1 } });
    expect((await h.client.tasks.getTasks({ indexUids: ['tasks-delete'] })).total).toBe(0);
    expect(await apiError(h.client.tasks.deleteTasks({}))).toMatchObject({ status: 400, code: 'missing_task_filters' });
  });

  it('cancels only tasks still waiting', async () => {
    const done = await h.client.index('tasks-cancel').addDocuments([{ id: 1 }]).waitTask();
    const cancel = succeeded(await h.client.tasks.cancelTasks({ uids: [done.uid] }).waitTask());
    expect(cancel).toMatchObject({ type: 'taskCancelation', indexUid: null, details: { matchedTasks: 1, canceledTasks: 0 } });
    expect((await h.client.tasks.getTask(done.uid)).status).toBe('succeeded');
  });
});

describe('swapping indexes', () => {
  it('swaps two indexes, documents and settings, so a rebuilt index can replace the live one', async () => {
    await h.client.index('swap-live').addDocuments([{ id: 1, v: 'old' }]).waitTask();
    await h.client.index('swap-live').updateSettings({ filterableAttributes: ['v'] }).waitTask();
    await h.client.index('swap-next').addDocuments([{ id: 1, v: 'new' }, { id: 2, v: 'new' }]).waitTask();
    await h.client.index('swap-next').updateSettings({ filterableAttributes: ['v', 'id'] }).waitTask();
    const task = succeeded(await h.client.swapIndexes([{ indexes: ['swap-live', 'swap-next'], rename: false }]).waitTask());
    expect(task).toMatchObject({ type: 'indexSwap', indexUid: null, details: { swaps: [{ indexes: ['swap-live', 'swap-next'], rename: false }] } });
    expect((await h.client.index('swap-live').getDocuments()).results).toEqual([{ id: 1, v: 'new' }, { id: 2, v: 'new' }]);
    expect(await h.client.index('swap-live').getFilterableAttributes()).toEqual(['v', 'id']);
    expect((await h.client.index('swap-live').search('', { filter: 'v = new' })).estimatedTotalHits).toBe(2);
    expect((await h.client.index('swap-next').getDocuments()).results).toEqual([{ id: 1, v: 'old' }]);
    succeeded(await h.client.deleteIndex('swap-next').waitTask());
  });

  it('renames with rename: true, and fails for a missing index or a repeated one', async () => {
    await h.client.index('swap-src').addDocuments([{ id: 1 }]).waitTask();
    succeeded(await h.client.swapIndexes([{ indexes: ['swap-src', 'swap-dst'], rename: true }]).waitTask());
    expect((await h.client.index('swap-dst').getDocuments()).total).toBe(1);
    expect(await apiError(h.client.getIndex('swap-src'))).toMatchObject({ code: 'index_not_found' });
    const missing = await h.client.swapIndexes([{ indexes: ['swap-dst', 'swap-nowhere'], rename: false }]).waitTask();
    expect(missing.status).toBe('failed');
    expect(missing.error?.code).toBe('index_not_found');
    expect(await apiError(h.client.swapIndexes([{ indexes: ['a', 'b'], rename: false }, { indexes: ['b', 'c'], rename: false }]))).toMatchObject({
      status: 400,
      code: 'invalid_swap_duplicate_index_found',
    });
    expect(await apiError(h.client.swapIndexes([{ indexes: ['a'] as never, rename: false }]))).toMatchObject({ status: 400, code: 'invalid_swap_indexes' });
  });
});
