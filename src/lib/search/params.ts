/**
 * A precedent search as a URL's query string and back, shared by the search page (the
 * whole query lives in the address bar, so a link can be shared) and the API route. Pure,
 * no zod: the island imports it as it is. The route still validates with
 * `PrecedentQuerySchema` (./validation).
 *
 *   ?q=culvert&frMin=4&frMax=6&structure=culvert-outlet&tag=apron&sort=newest&page=2
 *
 * Facet parameters repeat (`tag=a&tag=b`) and mean "any of these".
 */

/** The facets a search offers, by URL parameter, with the document attribute each filters. */
export const FACETS = {
  structure: 'structureType',
  shape: 'sectionShapes',
  kind: 'calcKinds',
  region: 'region',
  tag: 'tags',
} as const;

/** A facet's URL parameter. */
export type FacetParam = keyof typeof FACETS;

/** Every facet parameter, in the order the page shows them. */
export const FACET_PARAMS = Object.keys(FACETS) as FacetParam[];

/** Orders of the results. */
export const SEARCH_SORTS = ['relevance', 'newest', 'fr1-asc', 'fr1-desc'] as const;

/** An order of the results. */
export type SearchSort = (typeof SEARCH_SORTS)[number];

/** How each order reads on the page. */
export const SEARCH_SORT_LABELS: Record<SearchSort, string> = {
  relevance: 'Best match',
  newest: 'Newest first',
  'fr1-asc': 'Fr₁ low to high',
  'fr1-desc': 'Fr₁ high to low',
};

/** Results on one page. */
export const RESULTS_PER_PAGE = 20;

/** A precedent search as the page holds it (raw: numbers may still be out of range). */
export interface PrecedentQuery {
  q: string;
  /** Fr₁ range: a case matches when its own Fr₁ range overlaps this one. */
  frMin: number | null;
  frMax: number | null;
  /** Discharge range in m³/s, by overlap too. */
  dischargeMin: number | null;
  dischargeMax: number | null;
  facets: Record<FacetParam, string[]>;
  sort: SearchSort;
  /** From 1. */
  page: number;
}

/** The empty search: every published case, best match (newest first without words). */
export function emptyQuery(): PrecedentQuery {
  return {
    q: '',
    frMin: null,
    frMax: null,
    dischargeMin: null,
    dischargeMax: null,
    facets: { structure: [], shape: [], kind: [], region: [], tag: [] },
    sort: 'relevance',
    page: 1,
  };
}

const NUMBER_PARAMS = ['frMin', 'frMax', 'dischargeMin', 'dischargeMax'] as const;

function numberOrNull(text: string | null): number | null {
  if (text === null || text.trim() === '') return null;
  const value = Number(text);
  return Number.isFinite(value) ? value : Number.NaN;
}

/**
 * Reads a query string leniently (the page must open whatever link it is given): unknown
 * parameters are ignored, a number that does not read stays NaN for the validator to name.
 */
export function queryFromParams(params: URLSearchParams): PrecedentQuery {
  const query = emptyQuery();
  query.q = params.get('q') ?? '';
  for (const name of NUMBER_PARAMS) query[name] = numberOrNull(params.get(name));
  for (const facet of FACET_PARAMS) query.facets[facet] = [...new Set(params.getAll(facet).filter((v) => v !== ''))];
  const sort = params.get('sort');
  query.sort = SEARCH_SORTS.includes(sort as SearchSort) ? (sort as SearchSort) : 'relevance';
  const page = Number(params.get('page') ?? '1');
  query.page = Number.isSafeInteger(page) && page >= 1 ? page : 1;
  return query;
}

/** The query string of `query`, leaving defaults out so links stay short. */
export function paramsFromQuery(query: PrecedentQuery): URLSearchParams {
  const params = new URLSearchParams();
  if (query.q.trim()) params.set('q', query.q);
  for (const name of NUMBER_PARAMS) {
    const value = query[name];
    if (value !== null && Number.isFinite(value)) params.set(name, String(value));
  }
  for (const facet of FACET_PARAMS) for (const value of query.facets[facet]) params.append(facet, value);
  if (query.sort !== 'relevance') params.set('sort', query.sort);
  if (query.page > 1) params.set('page', String(query.page));
  return params;
}
