/**
 * Sequent's side of the search service, through the official `meilisearch` SDK and nothing
 * else, so a firm can point SEQUENT_SEARCH_URL at a real Meilisearch deployment unchanged
 * (npm start and the tests run the local fake in search-fake/ instead).
 */
import { Meilisearch, MeilisearchApiError, MeilisearchError, type Task } from 'meilisearch';
import { config } from '../config';
import type { SearchDocument } from './document';
import { searchRequests } from './requests';
import { SECTION_SHAPE_LABELS, STRUCTURE_TYPE_LABELS } from '../cases/validation';
import { KIND_SPECS, isSolverKind } from '../solver';
import type { FacetParam } from './params';
import { toResults, type PrecedentResults, type RawSearchResult } from './results';
import { INDEX_SETTINGS, PRIMARY_KEY } from './settings';
import type { ValidPrecedentQuery } from './validation';

/** How long one request to the search service may take before it counts as down. */
export const REQUEST_TIMEOUT_MS = 5_000;
/** How long to wait for an indexing task (a batch of documents) to finish. */
export const TASK_TIMEOUT_MS = 30_000;

/** A configured search service: the SDK client and the live index's name. */
export interface SearchService {
  readonly client: Meilisearch;
  readonly indexUid: string;
}

/** The search service could not be reached, or refused what Sequent sent. */
export class SearchUnavailableError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'SearchUnavailableError';
  }
}

const globalForSearch = globalThis as unknown as { sequentSearch?: SearchService | null; sequentSearchReady?: Set<string> };

/** The process's search service, or null when SEQUENT_SEARCH_URL is unset. */
export function searchService(): SearchService | null {
  if (globalForSearch.sequentSearch !== undefined) return globalForSearch.sequentSearch;
  const { SEQUENT_SEARCH_URL: host, SEQUENT_SEARCH_KEY: apiKey, SEQUENT_SEARCH_INDEX: indexUid } = config();
  globalForSearch.sequentSearch = host
    ? { client: new Meilisearch({ host, ...(apiKey ? { apiKey } : {}), timeout: REQUEST_TIMEOUT_MS, clientAgents: ['Sequent'] }), indexUid }
    : null;
  return globalForSearch.sequentSearch;
}

/** Forgets the process's client (tests that change the environment). */
export function resetSearchService(): void {
  globalForSearch.sequentSearch = undefined;
  globalForSearch.sequentSearchReady = undefined;
}

/** A one-line reason for a failure of the search service, for logs and the outbox. */
export function describeSearchError(error: unknown): string {
  if (error instanceof MeilisearchApiError) return `${error.cause?.code ?? 'api_error'}: ${error.message}`;
  if (error instanceof MeilisearchError) return error.message;
  return error instanceof Error ? error.message : String(error);
}

async function settled(task: Promise<Task>, what: string): Promise<Task> {
  const done = await task;
  if (done.status !== 'succeeded') {
    throw new SearchUnavailableError(`${what} did not succeed (${done.status}${done.error ? `: ${done.error.message}` : ''}).`);
  }
  return done;
}

/**
 * Creates `uid` if it is missing and applies {@link INDEX_SETTINGS}. Once per index and
 * process (settings updates are idempotent; a restart applies changed settings).
 */
export async function ensureIndex(service: SearchService, uid = service.indexUid, options: { force?: boolean } = {}): Promise<void> {
  const ready = (globalForSearch.sequentSearchReady ??= new Set());
  if (ready.has(uid) && !options.force) return;
  const created = await service.client.createIndex(uid, { primaryKey: PRIMARY_KEY }).waitTask({ timeout: TASK_TIMEOUT_MS });
  if (created.status === 'failed' && created.error?.code !== 'index_already_exists') {
    throw new SearchUnavailableError(`Creating the search index ${uid} failed: ${created.error?.message}`);
  }
  await settled(service.client.index(uid).updateSettings(INDEX_SETTINGS).waitTask({ timeout: TASK_TIMEOUT_MS }), `Setting up the search index ${uid}`);
  ready.add(uid);
}

/** Adds or replaces `documents` in `uid` and waits until they are searchable. */
export async function upsertDocuments(service: SearchService, documents: readonly SearchDocument[], uid = service.indexUid): Promise<void> {
  if (documents.length === 0) return;
  await settled(
    service.client.index(uid).addDocuments([...documents], { primaryKey: PRIMARY_KEY }).waitTask({ timeout: TASK_TIMEOUT_MS }),
    `Indexing ${documents.length} case(s)`,
  );
}

/** Removes the documents of `caseIds` from `uid` (missing ones are fine) and waits. */
export async function removeDocuments(service: SearchService, caseIds: readonly string[], uid = service.indexUid): Promise<void> {
  if (caseIds.length === 0) return;
  await settled(service.client.index(uid).deleteDocuments([...caseIds]).waitTask({ timeout: TASK_TIMEOUT_MS }), `Removing ${caseIds.length} case(s)`);
}

/** How the page names a facet value. */
export function facetLabel(facet: FacetParam, value: string): string {
  if (facet === 'structure') return (STRUCTURE_TYPE_LABELS as Record<string, string>)[value] ?? value;
  if (facet === 'shape') return (SECTION_SHAPE_LABELS as Record<string, string>)[value] ?? value;
  if (facet === 'kind') return isSolverKind(value) ? KIND_SPECS[value].title : value;
  return value;
}

/**
 * Runs a precedent search for `firmId` (the caller's firm, from the session: the filter
 * that scopes the search is added here, never taken from the client). Throws
 * {@link SearchUnavailableError} when the service cannot answer.
 */
export async function runSearch(service: SearchService, firmId: string, query: ValidPrecedentQuery): Promise<Omit<PrecedentResults, 'pending' | 'tookMs'>> {
  const { requests, groups } = searchRequests(service.indexUid, firmId, query);
  try {
    const { results } = await service.client.multiSearch({ queries: requests });
    return toResults(results as unknown as RawSearchResult[], groups, query.facets, query.page, facetLabel);
  } catch (error) {
    if (error instanceof MeilisearchApiError && error.cause?.code === 'index_not_found') {
      // Nothing was ever published (or indexed) yet: an empty casebook, not an outage.
      return toResults([{ hits: [], estimatedTotalHits: 0 }], [], query.facets, query.page, facetLabel);
    }
    throw new SearchUnavailableError(`Search is not answering (${describeSearchError(error)}).`, { cause: error });
  }
}
