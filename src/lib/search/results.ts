/**
 * What the search API answers, and how a search service's response becomes it. Pure.
 * Highlighted text travels as segments (`{text, hit}`), never as HTML: the page renders
 * each segment as text, a match inside `<mark>`, so nothing a case contains is markup.
 */
import { pickFigures, type SearchFigures } from './figures';
import { FACET_PARAMS, FACETS, RESULTS_PER_PAGE, type FacetParam } from './params';
import { HIGHLIGHT_POST, HIGHLIGHT_PRE } from './requests';

/** A run of text; `hit` when it matched the search words. */
export interface TextSegment {
  text: string;
  hit: boolean;
}

/** One published case in the results. */
export interface PrecedentHit {
  id: string;
  title: TextSegment[];
  /** The body around the first match, or the summary when the words matched elsewhere. */
  snippet: TextSegment[];
  summary: string;
  structureType: string;
  structureLabel: string;
  sectionShapes: string[];
  calcKinds: string[];
  tags: string[];
  region: string | null;
  projectReference: string | null;
  authorName: string;
  reviewerNames: string[];
  /** ISO date of publication. */
  publishedAt: string;
  revision: number;
  figures: SearchFigures;
}

/** A facet value and how many results it would give. */
export interface FacetCount {
  value: string;
  /** How the page names it (a structure type's label, a calculation's title; else the value). */
  label: string;
  count: number;
}

/** Names a facet value for people. */
export type FacetLabeller = (facet: FacetParam, value: string) => string;

/** `GET /api/v1/search`. */
export interface PrecedentResults {
  hits: PrecedentHit[];
  /** Results in all (an estimate past a few thousand). */
  total: number;
  page: number;
  pages: number;
  perPage: number;
  facets: Record<FacetParam, FacetCount[]>;
  /** Changes waiting to reach the index (publications a few seconds old, or search was down). */
  pending: number;
  tookMs: number;
}

/** Splits text marked with the highlight sentinels into segments; unmatched sentinels are dropped. */
export function segments(marked: string): TextSegment[] {
  const out: TextSegment[] = [];
  let hit = false;
  let current = '';
  const flush = () => {
    if (current) {
      const last = out[out.length - 1];
      if (last && last.hit === hit) last.text += current;
      else out.push({ text: current, hit });
    }
    current = '';
  };
  for (const char of marked) {
    if (char === HIGHLIGHT_PRE || char === HIGHLIGHT_POST) {
      flush();
      hit = char === HIGHLIGHT_PRE;
    } else current += char;
  }
  flush();
  return out;
}

const hasHit = (parts: TextSegment[]) => parts.some((p) => p.hit);

/** Loosely typed search-service output: the SDK's hit and facet shapes. */
export type RawHit = Record<string, unknown> & { _formatted?: Record<string, unknown> };
export interface RawSearchResult {
  hits: RawHit[];
  estimatedTotalHits?: number;
  totalHits?: number;
  facetDistribution?: Record<string, Record<string, number>>;
  processingTimeMs?: number;
}

const text = (value: unknown): string => (typeof value === 'string' ? value : value === null || value === undefined ? '' : String(value));
const numberOrNull = (value: unknown): number | null => (typeof value === 'number' && Number.isFinite(value) ? value : null);
const stringList = (value: unknown): string[] => (Array.isArray(value) ? value.filter((v): v is string => typeof v === 'string') : []);

/** A hit as the page shows it. */
export function toHit(raw: RawHit): PrecedentHit {
  const formatted = raw._formatted ?? {};
  const title = segments(text(formatted.title ?? raw.title));
  const body = segments(text(formatted.body));
  const summary = segments(text(formatted.summary ?? raw.summary));
  const snippet = hasHit(body) && !hasHit(summary) ? body : summary.length > 0 ? summary : body;
  const publishedAt = numberOrNull(raw.publishedAt);
  return {
    id: text(raw.id),
    title,
    snippet,
    summary: text(raw.summary),
    structureType: text(raw.structureType),
    structureLabel: text(raw.structureLabel),
    sectionShapes: stringList(raw.sectionShapes),
    calcKinds: stringList(raw.calcKinds),
    tags: stringList(raw.tags),
    region: typeof raw.region === 'string' ? raw.region : null,
    projectReference: typeof raw.projectReference === 'string' ? raw.projectReference : null,
    authorName: text(raw.authorName),
    reviewerNames: stringList(raw.reviewerNames),
    publishedAt: publishedAt === null ? '' : new Date(publishedAt).toISOString(),
    revision: numberOrNull(raw.revision) ?? 0,
    figures: pickFigures(raw),
  };
}

function counts(facet: FacetParam, distribution: Record<string, number> | undefined, label: FacetLabeller): FacetCount[] {
  return Object.entries(distribution ?? {})
    .filter(([, count]) => count > 0)
    .map(([value, count]) => ({ value, label: label(facet, value), count }))
    .sort((a, b) => b.count - a.count || a.value.localeCompare(b.value));
}

/**
 * The API's answer from a multi-search made by `searchRequests`: the first result gives
 * the hits and the facets without a selection; each further one the counts of
 * the group at the same position in `groups`. Selected values with no result keep a 0.
 */
export function toResults(
  results: readonly RawSearchResult[],
  groups: readonly FacetParam[],
  selected: Record<FacetParam, string[]>,
  page: number,
  label: FacetLabeller = (_facet, value) => value,
): Omit<PrecedentResults, 'pending' | 'tookMs'> {
  const [main, ...rest] = results;
  const facets = {} as Record<FacetParam, FacetCount[]>;
  for (const facet of FACET_PARAMS) {
    const index = groups.indexOf(facet);
    const source = index >= 0 ? rest[index] : main;
    const found = counts(facet, source?.facetDistribution?.[FACETS[facet]], label);
    for (const value of selected[facet]) if (!found.some((f) => f.value === value)) found.push({ value, label: label(facet, value), count: 0 });
    facets[facet] = found;
  }
  const total = main?.totalHits ?? main?.estimatedTotalHits ?? 0;
  return {
    hits: (main?.hits ?? []).map(toHit),
    total,
    page,
    pages: Math.max(1, Math.ceil(total / RESULTS_PER_PAGE)),
    perPage: RESULTS_PER_PAGE,
    facets,
  };
}
