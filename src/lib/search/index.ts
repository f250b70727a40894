// Precedent search. The search page imports ./params and ./results (pure) directly;
// this barrel also carries the services, which need the database and the SDK.
export { buildSearchDocument, MAX_INDEXED_BODY, type PublishedCaseRow, type SearchDocument } from './document';
export {
  emptyQuery,
  FACET_PARAMS,
  FACETS,
  paramsFromQuery,
  queryFromParams,
  RESULTS_PER_PAGE,
  SEARCH_SORT_LABELS,
  SEARCH_SORTS,
  type FacetParam,
  type PrecedentQuery,
  type SearchSort,
} from './params';
export { MAX_FROUDE, MAX_PAGE, MAX_QUERY_LENGTH, PrecedentQuerySchema, type ValidPrecedentQuery } from './validation';
export { HIGHLIGHT_POST, HIGHLIGHT_PRE, quote, searchFilter, searchRequests, type SearchRequest } from './requests';
export { segments, toHit, toResults, type FacetCount, type PrecedentHit, type PrecedentResults, type TextSegment } from './results';
export { INDEX_SETTINGS, PRIMARY_KEY } from './settings';
export { countPublishedCases, loadSearchDocumentPage, loadSearchDocuments } from './load';
export { queueSearchUpdate, type SearchUpdateReason } from './outbox';
export {
  describeSearchError,
  ensureIndex,
  facetLabel,
  removeDocuments,
  resetSearchService,
  runSearch,
  SearchUnavailableError,
  searchService,
  upsertDocuments,
  type SearchService,
} from './service';
export { DRAIN_BATCH, drainSearchOutbox, pendingSearchUpdates, SEARCH_SYNC_LOCK, type SearchDrainResult } from './sync';
export { SEARCH_POLL_INTERVAL_MS, startSearchWorker, stopSearchWorker, wakeSearchWorker } from './worker';
export { REINDEX_BATCH, reindexAll, type ReindexProgress, type ReindexResult } from './reindex';
export { searchPrecedents, type PrecedentSearch } from './search';
