/**
 * A precedent search as the requests the search service answers: filter expressions in the
 * Meilisearch syntax, and the multi-search that gives the hits and the facet counts. Pure.
 *
 * Takes a validated query (`PrecedentQuerySchema`); numbers are finite or null by then.
 *
 * **Firm isolation.** Every request's filter is an array whose first element is
 * `firmId = "<the caller's firm>"`; the array form ANDs its elements, each parsed on its
 * own, so nothing in a later element can widen the first. User values only ever appear
 * inside quoted strings (see {@link quote}); no user text is spliced into an expression.
 *
 * **Facet counts** are disjunctive, as people expect of checkboxes: each facet group is
 * counted with every other filter applied but its own, so ticking "Culvert outlet" still
 * shows how many "Outfall" cases there would be. One extra query per group with a selection.
 */
import { FIGURE_NAMES } from './figures';
import { FACET_PARAMS, FACETS, RESULTS_PER_PAGE, type FacetParam, type PrecedentQuery, type SearchSort } from './params';

/** Marks a matched word in `_formatted` (control characters never typed into a case). */
export const HIGHLIGHT_PRE = '\u0001';
export const HIGHLIGHT_POST = '\u0002';

/** Words of body text around a match in a result's snippet. */
export const SNIPPET_WORDS = 36;

/** A string literal in a filter expression: double quotes, with `\` and `"` escaped. */
export function quote(value: string): string {
  return `"${value.replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"`;
}

/** `attribute IN ["a", "b"]`. */
function anyOf(attribute: string, values: readonly string[]): string {
  return `${attribute} IN [${values.map(quote).join(', ')}]`;
}

/** A finite number as a filter literal. */
function literal(value: number): string {
  return String(value);
}

/**
 * Overlap of a case's [min, max] range with [low, high]: `max >= low AND min <= high`.
 * Cases without the figure never match a range.
 */
function overlaps(minAttribute: string, maxAttribute: string, low: number | null, high: number | null): string[] {
  const parts: string[] = [];
  if (low !== null) parts.push(`${maxAttribute} >= ${literal(low)}`);
  if (high !== null) parts.push(`${minAttribute} <= ${literal(high)}`);
  return parts;
}

/** The filter of `query` for `firmId`, optionally without one facet group (for its counts). */
export function searchFilter(firmId: string, query: PrecedentQuery, without?: FacetParam): string[] {
  const filter = [`firmId = ${quote(firmId)}`];
  filter.push(...overlaps('fr1Min', 'fr1Max', query.frMin, query.frMax));
  filter.push(...overlaps('dischargeMin', 'dischargeMax', query.dischargeMin, query.dischargeMax));
  for (const facet of FACET_PARAMS) {
    const selected = query.facets[facet];
    if (facet !== without && selected.length > 0) filter.push(anyOf(FACETS[facet], selected));
  }
  return filter;
}

const SORTS: Record<SearchSort, string[] | undefined> = {
  relevance: undefined,
  newest: ['publishedAt:desc'],
  'fr1-asc': ['fr1Min:asc'],
  'fr1-desc': ['fr1Max:desc'],
};

/** Attributes a result shows (the body is only needed for its snippet). */
export const RESULT_ATTRIBUTES = [
  'id',
  'title',
  'summary',
  'body',
  'structureType',
  'structureLabel',
  'sectionShapes',
  'calcKinds',
  'tags',
  'region',
  'projectReference',
  'authorName',
  'reviewerNames',
  'publishedAt',
  'revision',
  ...FIGURE_NAMES,
];

/** One query of a multi-search (the SDK's shape, without importing it into pure code). */
export interface SearchRequest {
  indexUid: string;
  q: string;
  filter: string[];
  facets?: string[];
  sort?: string[];
  limit: number;
  offset: number;
  attributesToRetrieve?: string[];
  attributesToHighlight?: string[];
  attributesToCrop?: string[];
  cropLength?: number;
  highlightPreTag?: string;
  highlightPostTag?: string;
}

/**
 * The multi-search of `query`: first the hits (with counts of the facet groups that have
 * no selection), then one count-only query per selected group.
 * Without words and with "best match", the newest come first.
 */
export function searchRequests(indexUid: string, firmId: string, query: PrecedentQuery): { requests: SearchRequest[]; groups: FacetParam[] } {
  const q = query.q.trim();
  const selectedGroups = FACET_PARAMS.filter((f) => query.facets[f].length > 0);
  const sort = SORTS[query.sort] ?? (q === '' ? SORTS.newest : undefined);
  const main: SearchRequest = {
    indexUid,
    q,
    filter: searchFilter(firmId, query),
    // Only the string facets: asking for numeric ones would count every distinct value.
    facets: FACET_PARAMS.filter((f) => query.facets[f].length === 0).map((f) => FACETS[f]),
    ...(sort ? { sort } : {}),
    limit: RESULTS_PER_PAGE,
    offset: (query.page - 1) * RESULTS_PER_PAGE,
    attributesToRetrieve: RESULT_ATTRIBUTES.filter((a) => a !== 'body'),
    attributesToHighlight: ['title', 'summary', 'body'],
    attributesToCrop: ['body'],
    cropLength: SNIPPET_WORDS,
    highlightPreTag: HIGHLIGHT_PRE,
    highlightPostTag: HIGHLIGHT_POST,
  };
  const counts = selectedGroups.map((group) => ({
    indexUid,
    q,
    filter: searchFilter(firmId, query, group),
    facets: [FACETS[group]],
    limit: 0,
    offset: 0,
  }));
  return { requests: [main, ...counts], groups: selectedGroups };
}
