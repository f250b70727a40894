/**
 * The precedent search page's island: words, Fr₁ and discharge ranges, facets and order,
 * with results as you type. The whole query lives in the address bar (shareable links;
 * Back works), and every change fetches `GET /api/v1/search`, cancelling the one before.
 * The page renders the first results on the server, so nothing flashes on arrival.
 */
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { figure, figureRange } from '../../lib/search/format';
import {
  FACET_PARAMS,
  paramsFromQuery,
  queryFromParams,
  SEARCH_SORT_LABELS,
  SEARCH_SORTS,
  type FacetParam,
  type PrecedentQuery,
  type SearchSort,
} from '../../lib/search/params';
import type { PrecedentHit, PrecedentResults } from '../../lib/search/results';
import { BoundInput } from './BoundInput';
import { FroudeRange } from './FroudeRange';
import { Highlighted } from './Highlighted';

/** What a search gave: results, or a message to show instead. */
export type SearchOutcome = { ok: true; results: PrecedentResults } | { ok: false; message: string; retry: boolean };

export interface PrecedentSearchProps {
  initialQuery: PrecedentQuery;
  initial: SearchOutcome;
  /** Whether the viewer may start cases (engineers, reviewers, admins). */
  canCreate: boolean;
}

const FACET_TITLES: Record<FacetParam, string> = {
  structure: 'Structure',
  shape: 'Section',
  kind: 'Calculation',
  region: 'Region',
  tag: 'Tags',
};

/** Facet values shown before "Show all". */
const FACET_PREVIEW = 6;
const TYPING_DELAY_MS = 200;

async function fetchResults(query: PrecedentQuery, signal: AbortSignal): Promise<SearchOutcome> {
  let response: Response;
  try {
    response = await fetch(`/api/v1/search?${paramsFromQuery(query)}`, { signal, headers: { accept: 'application/json' } });
  } catch (error) {
    if (signal.aborted) throw error;
    return { ok: false, message: 'The server could not be reached. Check your connection and try again.', retry: true };
  }
  const body = (await response.json().catch(() => null)) as (PrecedentResults & { error?: { message?: string } }) | null;
  if (response.ok && body) return { ok: true, results: body };
  if (response.status === 401) return { ok: false, message: 'Your session has ended. Sign in again to search.', retry: false };
  return { ok: false, message: body?.error?.message ?? `The search failed (HTTP ${response.status}).`, retry: response.status >= 500 };
}

const hasFilters = (q: PrecedentQuery) =>
  q.frMin !== null || q.frMax !== null || q.dischargeMin !== null || q.dischargeMax !== null || FACET_PARAMS.some((f) => q.facets[f].length > 0);

const date = (iso: string) => (iso ? new Date(iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' }) : '—');

export default function PrecedentSearch({ initialQuery, initial, canCreate }: PrecedentSearchProps) {
  const [query, setQuery] = useState<PrecedentQuery>(initialQuery);
  const [text, setText] = useState(initialQuery.q);
  const [outcome, setOutcome] = useState<SearchOutcome>(initial);
  const [loading, setLoading] = useState(false);
  const [expanded, setExpanded] = useState<Partial<Record<FacetParam, boolean>>>({});
  const controller = useRef<AbortController | null>(null);
  const first = useRef(true);
  const [attempt, setAttempt] = useState(0);

  // Fetch whenever the query changes (not on arrival: the server rendered those results).
  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    const params = paramsFromQuery(query).toString();
    const url = `${window.location.pathname}${params ? `?${params}` : ''}`;
    if (url !== `${window.location.pathname}${window.location.search}`) window.history.pushState(null, '', url);
    controller.current?.abort();
    const current = new AbortController();
    controller.current = current;
    setLoading(true);
    fetchResults(query, current.signal)
      .then((found) => {
        if (!current.signal.aborted) setOutcome(found);
      })
      .catch(() => {})
      .finally(() => {
        if (!current.signal.aborted) setLoading(false);
      });
    return () => current.abort();
  }, [query, attempt]);

  // Back and Forward walk through earlier searches.
  useEffect(() => {
    const onPop = () => {
      const next = queryFromParams(new URLSearchParams(window.location.search));
      first.current = false;
      setText(next.q);
      setQuery(next);
    };
    window.addEventListener('popstate', onPop);
    return () => window.removeEventListener('popstate', onPop);
  }, []);

  // Results as you type, a moment after the last key.
  useEffect(() => {
    if (text === query.q) return;
    const timer = setTimeout(() => setQuery((q) => ({ ...q, q: text, page: 1 })), TYPING_DELAY_MS);
    return () => clearTimeout(timer);
  }, [text, query.q]);

  const update = useCallback((change: Partial<PrecedentQuery>) => setQuery((q) => ({ ...q, ...change, page: change.page ?? 1 })), []);
  const toggle = (facet: FacetParam, value: string) =>
    setQuery((q) => {
      const chosen = q.facets[facet];
      const next = chosen.includes(value) ? chosen.filter((v) => v !== value) : [...chosen, value];
      return { ...q, facets: { ...q.facets, [facet]: next }, page: 1 };
    });
  const clearAll = () => {
    setText('');
    setQuery((q) => ({ ...q, q: '', frMin: null, frMax: null, dischargeMin: null, dischargeMax: null, facets: { structure: [], shape: [], kind: [], region: [], tag: [] }, page: 1 }));
  };

  const results = outcome.ok ? outcome.results : null;
  const status = useMemo(() => {
    if (loading) return 'Searching…';
    if (!results) return '';
    return results.total === 1 ? '1 published case' : `${results.total.toLocaleString('en-GB')} published cases`;
  }, [loading, results]);

  return (
    <div className="grid gap-8 font-sans lg:grid-cols-[17rem_1fr]" data-testid="precedent-search">
      <form className="space-y-6" role="search" aria-label="Precedent search" onSubmit={(e) => e.preventDefault()}>
        <div>
          <label className="field-label" htmlFor="search-text">Words</label>
          <input
            id="search-text"
            name="q"
            type="search"
            className="field-input"
            placeholder="e.g. culvert apron, undular, Manning"
            autoComplete="off"
            value={text}
            onChange={(e) => setText(e.target.value)}
            onKeyDown={(e) => {
              if (e.key === 'Enter') update({ q: text });
            }}
          />
        </div>
        <FroudeRange low={query.frMin} high={query.frMax} onChange={(frMin, frMax) => update({ frMin, frMax })} />
        <fieldset>
          <legend className="field-label">Discharge Q (m³/s)</legend>
          <div className="flex items-center gap-2 text-sm">
            <BoundInput id="q-min" label="Lowest discharge" width="w-24" value={query.dischargeMin} onCommit={(dischargeMin) => update({ dischargeMin })} />
            <span aria-hidden="true">to</span>
            <BoundInput id="q-max" label="Highest discharge" width="w-24" value={query.dischargeMax} onCommit={(dischargeMax) => update({ dischargeMax })} />
          </div>
        </fieldset>
        {FACET_PARAMS.map((facet) => {
          const values = results?.facets[facet] ?? [];
          const chosen = query.facets[facet];
          if (values.length === 0 && chosen.length === 0) return null;
          const shown = expanded[facet] ? values : values.slice(0, FACET_PREVIEW);
          return (
            <fieldset key={facet} data-testid={`facet-${facet}`}>
              <legend className="field-label">{FACET_TITLES[facet]}</legend>
              <ul className="space-y-1 text-sm">
                {shown.map((v) => (
                  <li key={v.value}>
                    <label className="flex cursor-pointer items-baseline gap-2">
                      <input type="checkbox" checked={chosen.includes(v.value)} onChange={() => toggle(facet, v.value)} />
                      <span className="grow">{v.label}</span>
                      <span className="tabular-nums text-ink-faint" aria-label={`${v.count} cases`}>{v.count}</span>
                    </label>
                  </li>
                ))}
              </ul>
              {values.length > FACET_PREVIEW && (
                <button type="button" className="mt-1 text-sm text-tailwater underline" aria-expanded={!!expanded[facet]} onClick={() => setExpanded((x) => ({ ...x, [facet]: !x[facet] }))}>
                  {expanded[facet] ? 'Show fewer' : `Show all ${values.length}`}
                </button>
              )}
            </fieldset>
          );
        })}
        {(hasFilters(query) || query.q) && (
          <button type="button" className="btn btn-quiet" onClick={clearAll}>Clear the search</button>
        )}
      </form>

      <section aria-labelledby="results-heading">
        <div className="mb-3 flex flex-wrap items-baseline gap-4">
          <h2 id="results-heading" className="text-xl">Results</h2>
          <p className="text-sm text-ink-soft" role="status" aria-live="polite" data-testid="search-status">{status}</p>
          <label className="ml-auto flex items-center gap-2 text-sm">
            <span>Order</span>
            <select className="field-input w-auto py-1" value={query.sort} onChange={(e) => update({ sort: e.target.value as SearchSort })}>
              {SEARCH_SORTS.map((s) => <option key={s} value={s}>{SEARCH_SORT_LABELS[s]}</option>)}
            </select>
          </label>
        </div>
        {results && results.pending > 0 && (
          <p className="notice mb-3 text-sm" role="note" data-testid="search-pending">
            {results.pending === 1 ? 'One recent change is' : `${results.pending} recent changes are`} still on the way into the search index; they appear within moments once search is up.
          </p>
        )}
        {!outcome.ok && (
          <div className="notice notice-fault mb-3" role="alert" data-testid="search-error">
            <p>{outcome.message}</p>
            {outcome.retry && <button type="button" className="btn btn-quiet mt-2" onClick={() => setAttempt((n) => n + 1)}>Try again</button>}
          </div>
        )}
        {results && results.hits.length === 0 && (
          <div className="notice" data-testid="search-empty">
            {hasFilters(query) || query.q ? (
              <>
                <p>No published case matches {query.q ? <>“{query.q}”</> : 'this search'}{hasFilters(query) ? ' with these filters' : ''}.</p>
                <p className="mt-1 text-sm">Try fewer words, widen the Fr₁ range, or untick a filter. Only published cases are searched: drafts and cases in review are not.</p>
                <button type="button" className="btn btn-quiet mt-2" onClick={clearAll}>Clear the search</button>
              </>
            ) : (
              <p>Nothing is published in this firm’s casebook yet. Cases appear here once a reviewer approves them.</p>
            )}
          </div>
        )}
        {results && results.hits.length > 0 && (
          <ResultsTable hits={results.hits} canCreate={canCreate} busy={loading} />
        )}
        {results && results.pages > 1 && (
          <nav className="mt-4 flex items-center gap-3 text-sm" aria-label="Result pages">
            <button type="button" className="btn btn-quiet" disabled={query.page <= 1} onClick={() => update({ page: query.page - 1 })}>← Previous</button>
            <span>Page {results.page} of {results.pages}</span>
            <button type="button" className="btn btn-quiet" disabled={query.page >= results.pages} onClick={() => update({ page: query.page + 1 })}>Next →</button>
          </nav>
        )}
      </section>
    </div>
  );
}

function ResultsTable({ hits, canCreate, busy }: { hits: PrecedentHit[]; canCreate: boolean; busy: boolean }) {
  return (
    <div className="overflow-x-auto">
      <table className="sheet-table" data-testid="search-results" aria-busy={busy}>
        <caption className="sr-only">Published cases matching the search</caption>
        <thead>
          <tr>
            <th scope="col">Case</th>
            <th scope="col" className="num">Fr<sub>1</sub></th>
            <th scope="col" className="num">Q (m³/s)</th>
            <th scope="col" className="num">y<sub>1</sub> / y<sub>2</sub> (m)</th>
            <th scope="col" className="num">ΔE/E<sub>1</sub></th>
            <th scope="col">Published</th>
          </tr>
        </thead>
        <tbody>
          {hits.map((hit) => (
            <tr key={hit.id} data-testid="search-hit">
              <td className="max-w-xl">
                <a href={`/cases/${hit.id}`} className="font-serif font-bold no-underline" data-testid="hit-title"><Highlighted parts={hit.title} /></a>
                <span className="block text-xs text-ink-faint">
                  {[hit.structureLabel, hit.region, hit.projectReference].filter(Boolean).join(' · ')}
                  {hit.figures.surgeCelerity !== null && ` · front ${figure(hit.figures.surgeCelerity)} m/s`}
                </span>
                {hit.snippet.length > 0 && <p className="search-snippet mt-1 text-sm text-ink-soft"><Highlighted parts={hit.snippet} /></p>}
                {hit.tags.length > 0 && (
                  <ul className="mt-1 flex flex-wrap gap-1" aria-label="Tags">
                    {hit.tags.map((t) => <li key={t} className="rounded bg-paper-deep px-1.5 text-xs text-ink-soft">{t}</li>)}
                  </ul>
                )}
                {canCreate && (
                  <a className="mt-1 inline-block text-sm" href={`/cases/new?from=${encodeURIComponent(hit.id)}`} data-testid="start-from">
                    Start a new case from this one
                  </a>
                )}
              </td>
              <td className="num whitespace-nowrap">{figureRange(hit.figures.fr1Min, hit.figures.fr1Max)}</td>
              <td className="num whitespace-nowrap">{figureRange(hit.figures.dischargeMin, hit.figures.dischargeMax)}</td>
              <td className="num whitespace-nowrap">
                {hit.figures.y1 === null ? '—' : figure(hit.figures.y1)} / {hit.figures.y2 === null ? '—' : figure(hit.figures.y2)}
              </td>
              <td className="num whitespace-nowrap">{hit.figures.relativeLoss === null ? '—' : figure(hit.figures.relativeLoss)}</td>
              <td>
                {date(hit.publishedAt)}
                <span className="block text-xs text-ink-faint">
                  rev. {hit.revision}{hit.reviewerNames.length > 0 && `, checked by ${hit.reviewerNames.join(', ')}`}
                </span>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
