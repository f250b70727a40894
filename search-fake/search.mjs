// @ts-check
// Search: parameter validation (unknown or mistyped parameters are rejected with the codes
// Meilisearch uses), full-text matching with prefix and typo tolerance, bucket ranking in
// the order of the index's ranking rules, filters, sorting, distinct, facets, pagination and
// the formatting of hits.
//
// Ranking follows Meilisearch's rules with these measures per document: `words` = query words
// matched (with the `last` strategy, only leading words count: "a b c" ranks documents with
// a, b and c, then a and b, then a); `typo` = typos in the matches; `attribute` = position in
// `searchableAttributes` of the attributes matched; `exactness` = words matched exactly (not
// by prefix or typo); `proximity` is not measured. Within equal buckets a BM25-like score,
// then the insertion order, decide. `sort` (and custom `field:asc` rules) apply where they
// stand in `rankingRules`: by default after words/typo/proximity/attribute, so a sorted
// keyword search is sorted within those buckets, as in Meilisearch; put `sort` first in the
// ranking rules to sort strictly.
import { badRequest, invalidType, MeiliError } from './errors.mjs';
import { filterFeatures, filterablePatterns, flatten, isUnder } from './fields.mjs';
import { checkFilter, FilterError, FilterFeatureError, FilterTypeError, parseFilterParam, valueTest } from './filter.mjs';
import { formatHit } from './format.mjs';
import { TF_BITS } from './index-store.mjs';
import { normalizeText, queryWords, typoDistance } from './text.mjs';

/** @typedef {import('./index-store.mjs').Index} Index */
/** @typedef {import('./index-store.mjs').Rec} Rec */
/** @typedef {import('./fields.mjs').FacetValue} FacetValue */

export const SEARCH_PARAMS = [
  'q',
  'vector',
  'media',
  'offset',
  'limit',
  'page',
  'hitsPerPage',
  'attributesToRetrieve',
  'retrieveVectors',
  'attributesToCrop',
  'cropLength',
  'attributesToHighlight',
  'showMatchesPosition',
  'showRankingScore',
  'showRankingScoreDetails',
  'showPerformanceDetails',
  'filter',
  'sort',
  'distinct',
  'facets',
  'highlightPreTag',
  'highlightPostTag',
  'cropMarker',
  'matchingStrategy',
  'attributesToSearchOn',
  'hybrid',
  'rankingScoreThreshold',
  'locales',
  'personalize',
  'useNetwork',
];

const MAX_QUERY_WORDS = 10;
const TEXT_CACHE_SIZE = 32;

/**
 * Validated search parameters.
 * @typedef {object} SearchParams
 * @property {string | null} q
 * @property {number} offset
 * @property {number} limit
 * @property {number | null} page
 * @property {number | null} hitsPerPage
 * @property {string[] | null} attributesToRetrieve
 * @property {string[]} attributesToCrop
 * @property {number} cropLength
 * @property {string} cropMarker
 * @property {string[]} attributesToHighlight
 * @property {string} highlightPreTag
 * @property {string} highlightPostTag
 * @property {boolean} showMatchesPosition
 * @property {boolean} showRankingScore
 * @property {boolean} showRankingScoreDetails
 * @property {unknown} filter
 * @property {string[] | null} sort
 * @property {string | null} distinct
 * @property {string[] | null} facets
 * @property {'last' | 'all' | 'frequency'} matchingStrategy
 * @property {string[] | null} attributesToSearchOn
 * @property {number | null} rankingScoreThreshold
 */

/** @param {string} name */
const codeFor = (name) => `invalid_search_${name.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`)}`;

/**
 * Checks a search request body (POST form, or a query of a multi-search) and fills defaults.
 * @param {unknown} body
 * @param {string[]} [extraKeys] keys allowed besides the search parameters (`indexUid` in a multi-search)
 * @returns {SearchParams}
 */
export function validateSearchBody(body, extraKeys = []) {
  if (body === null || typeof body !== 'object' || Array.isArray(body)) throw invalidType('bad_request', '', 'an object', body);
  const b = /** @type {Record<string, unknown>} */ (body);
  const allowed = [...SEARCH_PARAMS, ...extraKeys];
  for (const key of Object.keys(b)) {
    if (!allowed.includes(key)) throw badRequest('bad_request', `Unknown field \`${key}\`: expected one of ${allowed.map((k) => `\`${k}\``).join(', ')}`);
  }
  /** @param {string} key @param {boolean} [nullable] */
  const count = (key, nullable = false) => {
    const v = b[key];
    if (v === undefined || (nullable && v === null)) return null;
    if (typeof v !== 'number' || !Number.isInteger(v) || v < 0) throw invalidType(codeFor(key), `.${key}`, 'a positive integer', v);
    return v;
  };
  /** @param {string} key */
  const strings = (key) => {
    const v = b[key];
    if (v === undefined || v === null) return null;
    if (!Array.isArray(v)) throw invalidType(codeFor(key), `.${key}`, 'an array', v);
    v.forEach((item, i) => {
      if (typeof item !== 'string') throw invalidType(codeFor(key), `.${key}[${i}]`, 'a string', item);
    });
    return /** @type {string[]} */ (v);
  };
  /** @param {string} key @param {string} fallback */
  const text = (key, fallback) => {
    const v = b[key];
    if (v === undefined) return fallback;
    if (v === null) return '';
    if (typeof v !== 'string') throw invalidType(codeFor(key), `.${key}`, 'a string', v);
    return v;
  };
  /** @param {string} key */
  const flag = (key) => {
    const v = b[key];
    if (v === undefined || v === null) return false;
    if (typeof v !== 'boolean') throw invalidType(codeFor(key), `.${key}`, 'a boolean', v);
    return v;
  };
  const q = b.q;
  if (q !== undefined && q !== null && typeof q !== 'string') throw invalidType('invalid_search_q', '.q', 'a string', q);
  const strategy = b.matchingStrategy ?? 'last';
  if (strategy !== 'last' && strategy !== 'all' && strategy !== 'frequency') {
    throw badRequest('invalid_search_matching_strategy', `Unknown value \`${String(strategy)}\` at \`.matchingStrategy\`: expected one of \`last\`, \`all\`, \`frequency\``);
  }
  const distinct = b.distinct;
  if (distinct !== undefined && distinct !== null && typeof distinct !== 'string') throw invalidType('invalid_search_distinct', '.distinct', 'a string', distinct);
  const threshold = b.rankingScoreThreshold;
  if (threshold !== undefined && threshold !== null && (typeof threshold !== 'number' || threshold < 0 || threshold > 1)) {
    throw badRequest('invalid_search_ranking_score_threshold', `Invalid value at \`.rankingScoreThreshold\`: the value of \`rankingScoreThreshold\` is invalid, expected a float between \`0.0\` and \`1.0\`.`);
  }
  for (const key of ['hybrid', 'vector', 'media', 'personalize']) {
    if (b[key] !== undefined && b[key] !== null) throw badRequest(codeFor(key), `The search fake does not implement \`${key}\` (vector, hybrid and personalised search).`);
  }
  for (const key of ['retrieveVectors', 'showPerformanceDetails', 'useNetwork']) flag(key);
  strings('locales');
  return {
    q: typeof q === 'string' ? q : null,
    offset: count('offset') ?? 0,
    limit: count('limit') ?? 20,
    page: count('page', true),
    hitsPerPage: count('hitsPerPage', true),
    attributesToRetrieve: strings('attributesToRetrieve'),
    attributesToCrop: strings('attributesToCrop') ?? [],
    cropLength: count('cropLength') ?? 10,
    cropMarker: text('cropMarker', '…'),
    attributesToHighlight: strings('attributesToHighlight') ?? [],
    highlightPreTag: text('highlightPreTag', '<em>'),
    highlightPostTag: text('highlightPostTag', '</em>'),
    showMatchesPosition: flag('showMatchesPosition'),
    showRankingScore: flag('showRankingScore'),
    showRankingScoreDetails: flag('showRankingScoreDetails'),
    filter: b.filter ?? null,
    sort: strings('sort'),
    distinct: typeof distinct === 'string' ? distinct : null,
    facets: strings('facets'),
    matchingStrategy: strategy,
    attributesToSearchOn: strings('attributesToSearchOn'),
    rankingScoreThreshold: typeof threshold === 'number' ? threshold : null,
  };
}

/**
 * The GET form: parameters in the query string, lists comma-separated.
 * @param {URLSearchParams} query
 * @returns {SearchParams}
 */
export function searchParamsFromQuery(query) {
  /** @type {Record<string, unknown>} */
  const body = {};
  const lists = ['attributesToRetrieve', 'attributesToCrop', 'attributesToHighlight', 'sort', 'facets', 'attributesToSearchOn', 'locales'];
  const counts = ['offset', 'limit', 'page', 'hitsPerPage', 'cropLength'];
  const flags = ['showMatchesPosition', 'showRankingScore', 'showRankingScoreDetails', 'retrieveVectors', 'showPerformanceDetails'];
  for (const [key, raw] of query) {
    if (counts.includes(key)) {
      if (!/^\d+$/.test(raw)) throw badRequest(codeFor(key), `Invalid value in parameter \`${key}\`: could not parse \`${raw}\` as a positive integer`);
      body[key] = Number(raw);
    } else if (flags.includes(key)) {
      if (raw !== 'true' && raw !== 'false') throw badRequest(codeFor(key), `Invalid value in parameter \`${key}\`: could not parse \`${raw}\` as a boolean, expected either \`true\` or \`false\``);
      body[key] = raw === 'true';
    } else if (lists.includes(key)) {
      body[key] = raw.split(',').map((s) => s.trim()).filter(Boolean);
    } else if (key === 'rankingScoreThreshold') {
      body[key] = Number(raw);
    } else if (key === 'vector' || key === 'hybridEmbedder' || key === 'hybridSemanticRatio') {
      throw badRequest('invalid_search_vector', 'The search fake does not implement vector and hybrid search.');
    } else {
      body[key] = raw;
    }
  }
  return validateSearchBody(body);
}

/**
 * Compiles a filter parameter for `index` into the set of documents it selects (a byte per
 * internal number), reporting problems under `code` (`invalid_search_filter`,
 * `invalid_document_filter`, …). Null when there is no filter.
 * @param {Index} index
 * @param {unknown} filter
 * @param {string} code
 * @param {{ containsFilter: boolean }} features
 * @returns {Uint8Array | null}
 */
export function indexFilter(index, filter, code, features) {
  let node;
  try {
    node = parseFilterParam(filter);
    if (!node) return null;
    checkFilter(node, { filterableAttributes: index.settings.filterableAttributes, containsFilter: features.containsFilter });
  } catch (error) {
    if (error instanceof FilterFeatureError) throw new MeiliError(400, 'feature_not_enabled', error.message);
    if (error instanceof FilterError || error instanceof FilterTypeError) throw badRequest(code, error.message);
    throw error;
  }
  const cache = maskCache(index);
  const key = `filter:${JSON.stringify(filter)}`;
  let mask = cache.get(key);
  if (!mask) {
    mask = filterMask(index, node);
    remember(cache, key, mask);
  }
  return mask;
}

/**
 * A per-index cache that empties itself when the index changes.
 * @template T @param {Index} index @param {string} name @returns {Map<string, T>}
 */
function versioned(index, name) {
  const holder = /** @type {Record<string, any>} */ (index);
  const slot = `_cache_${name}`;
  if (!holder[slot] || holder[slot].version !== index.version) holder[slot] = { version: index.version, entries: new Map() };
  return holder[slot].entries;
}

/** @param {Index} index @returns {Map<string, Uint8Array>} */
const maskCache = (index) => versioned(index, 'masks');

/** @template T @param {Map<string, T>} cache @param {string} key @param {T} value @param {number} [max] */
function remember(cache, key, value, max = 512) {
  if (cache.size >= max) cache.delete(/** @type {string} */ (cache.keys().next().value));
  cache.set(key, value);
}

/**
 * The documents a filter selects, as a byte per internal number (1 = selected). Each
 * condition's mask is computed once over all documents and cached until the index changes,
 * so the conditions a page's queries share (the firm, the ranges) cost nothing the next time.
 * @param {Index} index
 * @param {import('./filter.mjs').FilterNode} node
 * @returns {Uint8Array}
 */
function filterMask(index, node) {
  const N = index.nextSeq;
  if (node.type === 'cond') {
    const cache = maskCache(index);
    const key = JSON.stringify([node.field, node.op, node.value, node.from, node.to, node.values]);
    let mask = cache.get(key);
    if (!mask) {
      mask = new Uint8Array(N);
      const get = index.facetGetter(node.field);
      const test = valueTest(node);
      for (const seq of liveSeqs(index)) if (test(get(seq))) mask[seq] = 1;
      remember(cache, key, mask);
    }
    return mask;
  }
  if (node.type === 'not') {
    const inner = filterMask(index, node.child);
    const out = new Uint8Array(N);
    for (let i = 0; i < N; i += 1) out[i] = /** @type {number} */ (inner[i]) ^ 1;
    return out;
  }
  const masks = node.children.map((child) => filterMask(index, child));
  const out = Uint8Array.from(/** @type {Uint8Array} */ (masks[0]));
  for (let m = 1; m < masks.length; m += 1) {
    const mask = /** @type {Uint8Array} */ (masks[m]);
    if (node.type === 'and') for (let i = 0; i < N; i += 1) out[i] = /** @type {number} */ (out[i]) & /** @type {number} */ (mask[i]);
    else for (let i = 0; i < N; i += 1) out[i] = /** @type {number} */ (out[i]) | /** @type {number} */ (mask[i]);
  }
  return out;
}

/** The internal numbers of the documents, in order (cached per index version). @param {Index} index @returns {Int32Array} */
function liveSeqs(index) {
  const cache = versioned(index, 'seqs');
  let seqs = /** @type {Int32Array | undefined} */ (cache.get('all'));
  if (!seqs) {
    seqs = new Int32Array(index.size);
    let n = 0;
    for (const rec of index.bySeq) if (rec) seqs[n++] = rec.seq;
    cache.set('all', seqs);
  }
  return seqs;
}

/**
 * @typedef {object} TextResult
 * @property {Int32Array} seqs       matching documents (internal numbers), unordered
 * @property {Float64Array} key      per seq: the relevance rules packed in one number (bigger is better), plus a score fraction
 * @property {Uint8Array} words      per seq: query words matched (the `words` rule)
 * @property {Uint8Array} typos      per seq: typos in the matches
 * @property {Uint16Array} attribute per seq: sum of the attribute ranks of the matches
 * @property {Uint8Array} exact      per seq: words matched exactly
 * @property {Float32Array} score    per seq: BM25-like score (tie-break)
 * @property {Uint8Array} maxTypos   per seq: typos the counted words could have had
 * @property {number} queryLength
 * @property {Map<string, number>} matched  document words to highlight (prefix length or 0)
 */

/**
 * How many typos a query word may have (Meilisearch defaults: none under 5 characters, one
 * from 5, two from 9).
 * @param {string} word @param {Record<string, any>} typo typoTolerance settings
 */
function typoBudget(word, typo) {
  if (!typo.enabled) return 0;
  if ((typo.disableOnWords ?? []).some((/** @type {string} */ w) => normalizeText(w) === word)) return 0;
  if (typo.disableOnNumbers && /^\p{N}+$/u.test(word)) return 0;
  const length = [...word].length;
  if (length >= typo.minWordSizeForTypos.twoTypos) return 2;
  if (length >= typo.minWordSizeForTypos.oneTypo) return 1;
  return 0;
}

/**
 * The document words a query word matches, with the typos each costs and whether it is a
 * prefix match. A typo on the first letter counts as two (so needs a two-typo budget).
 * @param {Index} index @param {string} word @param {boolean} prefix
 * @returns {Map<string, { typos: number, prefix: boolean }>}
 */
function expand(index, word, prefix) {
  const s = index.settings;
  /** @type {Map<string, { typos: number, prefix: boolean }>} */
  const out = new Map();
  if (index.postings.has(word)) out.set(word, { typos: 0, prefix: false });
  for (const [key, list] of Object.entries(s.synonyms ?? {})) {
    if (normalizeText(key) !== word) continue;
    for (const synonym of /** @type {string[]} */ (list)) {
      const norm = normalizeText(synonym).trim();
      if (/^[\p{L}\p{N}]+$/u.test(norm) && index.postings.has(norm) && !out.has(norm)) out.set(norm, { typos: 0, prefix: false });
    }
  }
  if (prefix && s.prefixSearch !== 'disabled') {
    for (const [term] of index.dict.atPrefix(word)) if (!out.has(term)) out.set(term, { typos: 0, prefix: true });
  }
  const budget = typoBudget(word, s.typoTolerance);
  if (budget > 0) {
    /** @param {string} term */
    const consider = (term) => {
      if (out.has(term)) return;
      let d = typoDistance(word, term, budget);
      if (d > budget) return;
      if (term[0] !== word[0]) {
        if (budget < 2 || d !== 1) return;
        d = 2;
      }
      if (d > 0) out.set(term, { typos: d, prefix: false });
    };
    for (const [term] of index.dict.fuzzyGet(word, budget)) consider(term);
    if (budget === 1) {
      // A swap of two neighbouring letters is one typo, but two edits for the radix tree.
      for (let i = 0; i + 1 < word.length; i += 1) {
        const swapped = word.slice(0, i) + word[i + 1] + word[i] + word.slice(i + 2);
        if (index.postings.has(swapped)) consider(swapped);
      }
    }
  }
  return out;
}

/** Relevance rules, in order, packed into one number per document (bigger is better). */
const REL_RULES = new Set(['words', 'typo', 'proximity', 'attribute', 'exactness']);

/**
 * @param {TextResult} t @param {string[]} rules relevance rules of one group, in order
 * @returns {(seq: number) => number}
 */
function relevanceKey(t, rules) {
  // Rule codes: 0 words, 1 typo, 2 attribute, 3 exactness (proximity is not measured).
  const codes = Int8Array.from(rules.map((r) => ['words', 'typo', 'attribute', 'exactness'].indexOf(r)).filter((c) => c >= 0));
  const { words, typos, attribute, exact } = t;
  return (seq) => {
    let key = 0;
    for (let i = 0; i < codes.length; i += 1) {
      switch (codes[i]) {
        case 0:
          key = key * 16 + /** @type {number} */ (words[seq]);
          break;
        case 1:
          key = key * 64 + (63 - Math.min(/** @type {number} */ (typos[seq]), 63));
          break;
        case 2:
          key = key * 4096 + (4095 - Math.min(/** @type {number} */ (attribute[seq]), 4095));
          break;
        default:
          key = key * 16 + /** @type {number} */ (exact[seq]);
      }
    }
    return key;
  };
}

/**
 * Per-query working memory of textSearch, kept between queries (allocating it for every
 * query is what made the garbage collector pause searches). Clean between uses: every
 * matched bit 0, every slot's typos and attribute 255, exactness 0.
 */
const scratch = {
  size: 0,
  matchedBits: new Uint16Array(0),
  slotTypos: new Uint8Array(0),
  slotAttr: new Uint8Array(0),
  slotExact: new Uint8Array(0),
  touched: new Int32Array(0),
};

/** @param {number} N documents @param {number} n query words */
function scratchFor(N, n) {
  if (scratch.size < N * MAX_QUERY_WORDS || scratch.matchedBits.length < N) {
    const size = Math.max(N, 1024) * MAX_QUERY_WORDS * 2;
    scratch.size = size;
    scratch.matchedBits = new Uint16Array(size / MAX_QUERY_WORDS);
    scratch.slotTypos = new Uint8Array(size).fill(255);
    scratch.slotAttr = new Uint8Array(size).fill(255);
    scratch.slotExact = new Uint8Array(size);
    scratch.touched = new Int32Array(size / MAX_QUERY_WORDS);
  }
  void n;
  return scratch;
}

/**
 * Matches the query words against the inverted index (cached per index version and query).
 * @param {Index} index
 * @param {string[]} words
 * @param {boolean} lastIsPrefix
 * @param {SearchParams['matchingStrategy']} strategy
 * @param {number} mask field bits to search in (0 = all)
 * @returns {TextResult}
 */
function textSearch(index, words, lastIsPrefix, strategy, mask) {
  const cache = /** @type {Map<string, TextResult>} */ (versioned(index, 'text'));
  const cacheKey = `${words.join(' ')}\u0000${lastIsPrefix}\u0000${strategy}\u0000${mask}`;
  const cached = cache.get(cacheKey);
  if (cached) {
    cache.delete(cacheKey);
    cache.set(cacheKey, cached);
    return cached;
  }
  const n = words.length;
  const N = index.nextSeq;
  const total = index.size || 1;
  const typoSettings = index.settings.typoTolerance;
  const noTypoMask = index.maskOf(typoSettings.disableOnAttributes ?? []);
  const { matchedBits, slotTypos, slotAttr, slotExact, touched } = scratchFor(N, n);
  const score = new Float32Array(N);
  let touchedCount = 0;
  /** @type {Map<string, number>} */
  const matched = new Map();
  const budgets = words.map((w) => typoBudget(w, typoSettings));
  const searchAll = index.searchAll;
  for (let i = 0; i < n; i += 1) {
    const word = /** @type {string} */ (words[i]);
    const expansions = expand(index, word, lastIsPrefix && i === n - 1);
    for (const [term, how] of expansions) {
      const previous = matched.get(term);
      const prefixLength = how.prefix ? word.length : 0;
      if (previous === undefined || (previous > 0 && (prefixLength === 0 || prefixLength > previous))) matched.set(term, prefixLength);
      const posting = index.postings.get(term);
      if (!posting) continue;
      const df = posting.live;
      const idf = Math.log(1 + (total - df + 0.5) / (df + 0.5));
      const weight = how.typos === 0 ? (how.prefix ? 0.7 : 1) : how.typos === 1 ? 0.5 : 0.3;
      const exact = how.typos === 0 && !how.prefix ? 1 : 0;
      const typosHere = how.typos;
      const keepBits = (mask || -1) & (typosHere > 0 && noTypoMask !== 0 ? ~noTypoMask : -1);
      const bit = 1 << i;
      const { seqs: pSeqs, packed: pPacked, gens: pGens, length } = posting;
      const gens = index.gens;
      for (let e = 0; e < length; e += 1) {
        const seq = /** @type {number} */ (pSeqs[e]);
        if (pGens[e] !== gens[seq]) continue;
        const packed = /** @type {number} */ (pPacked[e]);
        const bits = (packed >>> TF_BITS) & keepBits;
        if (bits === 0) continue;
        if (matchedBits[seq] === 0) touched[touchedCount++] = seq;
        matchedBits[seq] = /** @type {number} */ (matchedBits[seq]) | bit;
        const slot = seq * n + i;
        if (typosHere < /** @type {number} */ (slotTypos[slot])) slotTypos[slot] = typosHere;
        const rank = searchAll ? 0 : 31 - Math.clz32(bits & -bits);
        if (rank < /** @type {number} */ (slotAttr[slot])) slotAttr[slot] = rank;
        if (exact) slotExact[slot] = 1;
        const tf = packed & 1023;
        score[seq] = /** @type {number} */ (score[seq]) + idf * weight * (tf / (tf + 1.2));
      }
    }
  }

  const wordsArr = new Uint8Array(N);
  const typos = new Uint8Array(N);
  const attribute = new Uint16Array(N);
  const exactArr = new Uint8Array(N);
  const maxTypos = new Uint8Array(N);
  const seqs = new Int32Array(touchedCount);
  const key = new Float64Array(N);
  let kept = 0;
  let maxScore = 0;
  const all = (1 << n) - 1;
  const last = strategy === 'last';
  for (let t = 0; t < touchedCount; t += 1) {
    const seq = /** @type {number} */ (touched[t]);
    const bits = /** @type {number} */ (matchedBits[seq]);
    let k = 0;
    let counted = bits;
    if (last) {
      while (k < n && bits & (1 << k)) k += 1;
      counted = (1 << k) - 1;
    } else {
      for (let j = 0; j < n; j += 1) if (bits & (1 << j)) k += 1;
      if (strategy === 'all' && bits !== all) k = 0;
    }
    if (k === 0) continue;
    let ty = 0;
    let a = 0;
    let e = 0;
    let m = 0;
    const base = seq * n;
    for (let j = 0; j < n; j += 1) {
      if (!(counted & (1 << j))) continue;
      ty += /** @type {number} */ (slotTypos[base + j]);
      a += /** @type {number} */ (slotAttr[base + j]);
      e += /** @type {number} */ (slotExact[base + j]);
      m += /** @type {number} */ (budgets[j]);
    }
    wordsArr[seq] = k;
    typos[seq] = ty > 255 ? 255 : ty;
    attribute[seq] = a;
    exactArr[seq] = e;
    maxTypos[seq] = m > 255 ? 255 : m;
    const sc = /** @type {number} */ (score[seq]);
    if (sc > maxScore) maxScore = sc;
    seqs[kept++] = seq;
  }
  // Leave the scratch buffers clean for the next query.
  for (let t = 0; t < touchedCount; t += 1) {
    const seq = /** @type {number} */ (touched[t]);
    matchedBits[seq] = 0;
    const base = seq * n;
    for (let j = 0; j < n; j += 1) {
      slotTypos[base + j] = 255;
      slotAttr[base + j] = 255;
      slotExact[base + j] = 0;
    }
  }
  /** @type {TextResult} */
  const result = { seqs: seqs.slice(0, kept), key, words: wordsArr, typos, attribute, exact: exactArr, score, maxTypos, queryLength: n, matched };
  // The relevance rules (without `sort`) packed with the score as a fraction: one number
  // orders the documents when the search is not sorted.
  const rel = relevanceKey(result, /** @type {string[]} */ (index.settings.rankingRules).filter((r) => REL_RULES.has(r)));
  const scale = maxScore > 0 ? 0.999 / maxScore : 0;
  for (let t = 0; t < kept; t += 1) {
    const seq = /** @type {number} */ (seqs[t]);
    key[seq] = rel(seq) + /** @type {number} */ (score[seq]) * scale;
  }
  remember(cache, cacheKey, result, TEXT_CACHE_SIZE);
  return result;
}

/**
 * One sort criterion's comparison of two documents (internal numbers): numbers before
 * strings, documents without the field last; an array field counts with its smallest value
 * ascending, its largest descending.
 * @param {(seq: number) => FacetValue} get @param {boolean} asc
 * @returns {(a: number, b: number) => number}
 */
function sortComparator(get, asc) {
  /** @param {FacetValue} v */
  const group = (v) => (v.nums.length > 0 ? 0 : v.strs.length > 0 ? 1 : 2);
  /** @param {any[]} list */
  const pick = (list) => {
    let best = list[0];
    for (let i = 1; i < list.length; i += 1) if (asc ? list[i] < best : list[i] > best) best = list[i];
    return best;
  };
  return (a, b) => {
    const va = get(a);
    const vb = get(b);
    const ga = group(va);
    const gb = group(vb);
    if (ga !== gb) return ga - gb;
    if (ga === 2) return 0;
    const xa = pick(ga === 0 ? va.nums : va.strs);
    const xb = pick(ga === 0 ? vb.nums : vb.strs);
    if (xa === xb) return 0;
    return (xa < xb ? -1 : 1) * (asc ? 1 : -1);
  };
}

/**
 * The `sort` parameter as comparators of internal numbers (validated against sortableAttributes).
 * @param {Index} index @param {string[]} sort @param {string} [code] error code
 */
export function sortCriteria(index, sort, code = 'invalid_search_sort') {
  const sortable = /** @type {string[]} */ (index.settings.sortableAttributes);
  if (code === 'invalid_search_sort' && !index.settings.rankingRules.includes('sort')) {
    throw badRequest(code, 'You must specify where `sort` is listed in the rankingRules setting to use the sort parameter at search time.');
  }
  return sort.map((expr) => {
    const m = /^(.+):(asc|desc)$/.exec(expr.trim());
    if (!m) throw badRequest(code, `Invalid syntax for the sort parameter: expected expression ending by \`:asc\` or \`:desc\`, found \`${expr}\`.`);
    const field = /** @type {string} */ (m[1]);
    if (/^_geoPoint\(/.test(field)) throw badRequest(code, 'The search fake does not implement sorting by `_geoPoint`.');
    if (!sortable.some((s) => isUnder(field, s))) {
      const available = sortable.length === 0 ? ' This index does not have configured sortable attributes.' : ` Available sortable attributes are: ${[...sortable].sort().map((s) => `\`${s}\``).join(', ')}.`;
      throw badRequest(code, `Attribute \`${field}\` is not sortable.${available}`);
    }
    return sortComparator(index.facetGetter(field), m[2] === 'asc');
  });
}

/**
 * The `k` best items of `items` under `cmp`, in order (a full sort when `k` is large).
 * @param {ArrayLike<number>} items @param {number} k @param {(a: number, b: number) => number} cmp @returns {number[]}
 */
function topK(items, k, cmp) {
  if (k >= items.length / 4) return Array.from(items).sort(cmp).slice(0, k);
  /** @type {number[]} */
  const best = [];
  for (let i = 0; i < items.length; i += 1) {
    const item = /** @type {number} */ (items[i]);
    if (best.length === k && cmp(item, /** @type {number} */ (best[k - 1])) >= 0) continue;
    let lo = 0;
    let hi = best.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (cmp(/** @type {number} */ (best[mid]), item) <= 0) lo = mid + 1;
      else hi = mid;
    }
    best.splice(lo, 0, item);
    if (best.length > k) best.pop();
  }
  return best;
}

/**
 * The facet distribution and stats of `fields` over the documents `seqs`.
 * @param {Index} index @param {string[]} fields @param {ArrayLike<number>} seqs
 */
function facetsOf(index, fields, seqs) {
  /** @type {Record<string, Record<string, number>>} */
  const distribution = {};
  /** @type {Record<string, { min: number, max: number }>} */
  const stats = {};
  const { maxValuesPerFacet, sortFacetValuesBy } = index.settings.faceting;
  for (const field of fields) {
    const get = index.facetGetter(field);
    /** @type {Map<string, { count: number, original: string, seq: number }>} */
    const strings = new Map();
    /** @type {Map<number, number>} */
    const numbers = new Map();
    let min = Infinity;
    let max = -Infinity;
    for (let r = 0; r < seqs.length; r += 1) {
      const seq = /** @type {number} */ (seqs[r]);
      const v = get(seq);
      const nums = v.nums;
      const strs = v.strs;
      for (let i = 0; i < nums.length; i += 1) {
        const num = /** @type {number} */ (nums[i]);
        if (i > 0 && nums.indexOf(num) !== i) continue;
        numbers.set(num, (numbers.get(num) ?? 0) + 1);
        if (num < min) min = num;
        if (num > max) max = num;
      }
      for (let i = 0; i < strs.length; i += 1) {
        const norm = /** @type {string} */ (strs[i]);
        if (i > 0 && strs.indexOf(norm) !== i) continue;
        const entry = strings.get(norm);
        if (entry) {
          entry.count += 1;
          if (seq < entry.seq) {
            entry.seq = seq;
            entry.original = /** @type {string} */ (v.originals[i]);
          }
        } else {
          strings.set(norm, { count: 1, original: /** @type {string} */ (v.originals[i]), seq });
        }
      }
    }
    const order = sortFacetValuesBy?.[field] ?? sortFacetValuesBy?.['*'] ?? 'alpha';
    /** @type {Array<[string, number]>} value as written, count; numbers first, then strings */
    const entries = [];
    for (const [num, c] of [...numbers].sort((a, b) => a[0] - b[0])) entries.push([String(num), c]);
    for (const [, e] of [...strings].sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0))) entries.push([e.original.trim(), e.count]);
    if (order === 'count') entries.sort((a, b) => b[1] - a[1]);
    /** @type {Record<string, number>} */
    const values = {};
    for (const [k, c] of entries.slice(0, maxValuesPerFacet)) values[k] = c;
    distribution[field] = values;
    if (numbers.size > 0) stats[field] = { min, max };
  }
  return { distribution, stats };
}

/**
 * Every flattened field name in the documents, sorted (cached per index version).
 * @param {Index} index
 * @returns {string[]}
 */
function knownFields(index) {
  const cache = /** @type {Map<string, string[]>} */ (versioned(index, 'fields'));
  let fields = cache.get('all');
  if (!fields) {
    /** @type {Set<string>} */
    const known = new Set();
    for (const rec of index.bySeq) {
      if (!rec) continue;
      for (const key of flatten(rec.doc).keys()) known.add(key);
    }
    fields = [...known].sort();
    cache.set('all', fields);
  }
  return fields;
}

/**
 * The facets to count: `*` means every filterable attribute found in the documents.
 * @param {Index} index @param {string[]} facets
 */
function facetFields(index, facets) {
  const rules = index.settings.filterableAttributes;
  /** @type {string[]} */
  const fields = [];
  for (const facet of facets) {
    if (facet === '*') {
      for (const key of knownFields(index)) {
        const f = filterFeatures(key, rules);
        if (f && f.equality && !fields.includes(key)) fields.push(key);
      }
      continue;
    }
    const f = filterFeatures(facet, rules);
    if (!f || !f.equality) {
      const patterns = filterablePatterns(rules);
      const available =
        patterns.length === 0
          ? 'this index does not have configured filterable attributes.'
          : `attribute \`${facet}\` is not filterable. The available filterable attribute pattern${patterns.length > 1 ? 's are' : ' is'} \`${patterns.join(', ')}\`.`;
      throw badRequest('invalid_search_facets', `Invalid facet distribution, ${available}`);
    }
    if (!fields.includes(facet)) fields.push(facet);
  }
  return fields;
}

/**
 * Runs one search on `index`.
 * @param {Index} index
 * @param {SearchParams} p
 * @param {{ containsFilter: boolean }} features
 */
export function search(index, p, features) {
  const started = performance.now();
  const s = index.settings;

  const filterMaskOrNull = p.filter === null ? null : indexFilter(index, p.filter, 'invalid_search_filter', features);
  const sorters = p.sort && p.sort.length > 0 ? sortCriteria(index, p.sort) : null;
  const facets = p.facets ? facetFields(index, p.facets) : null;

  const distinctField = p.distinct ?? s.distinctAttribute ?? null;
  if (p.distinct !== null) {
    const f = filterFeatures(p.distinct, s.filterableAttributes);
    if (!f || !f.equality) {
      const patterns = filterablePatterns(s.filterableAttributes);
      throw badRequest(
        'invalid_search_distinct',
        `Attribute \`${p.distinct}\` is not filterable and thus, cannot be used as distinct attribute. ${patterns.length === 0 ? 'This index does not have configured filterable attributes.' : `Available filterable attributes patterns are: ${patterns.map((x) => `\`${x}\``).join(', ')}.`}`,
      );
    }
  }

  let fieldMask = 0;
  if (p.attributesToSearchOn && !p.attributesToSearchOn.includes('*')) {
    const searchable = /** @type {string[]} */ (s.searchableAttributes);
    for (const attr of p.attributesToSearchOn) {
      if (!searchable.includes('*') && !searchable.some((a) => isUnder(attr, a))) {
        throw badRequest('invalid_search_attributes_to_search_on', `Attribute \`${attr}\` is not searchable. Available searchable attributes are: ${searchable.map((a) => `\`${a}\``).join(', ')}.`);
      }
    }
    fieldMask = index.maskOf(p.attributesToSearchOn);
    // Searchable but not (yet) in any document: a bit no field has, so nothing matches.
    if (fieldMask === 0) fieldMask = 1 << 30;
  }

  const { words: allWords, lastIsPrefix } = queryWords(p.q ?? '');
  const stop = new Set(/** @type {string[]} */ (s.stopWords).map(normalizeText));
  const words = allWords.slice(0, MAX_QUERY_WORDS).filter((w) => !stop.has(w));
  const text = words.length > 0 ? textSearch(index, words, lastIsPrefix && allWords.length <= MAX_QUERY_WORDS, p.matchingStrategy, fieldMask) : null;

  /** An approximation of Meilisearch's `_rankingScore` (1 for a placeholder search). @param {number} seq */
  const rankingScore = (seq) => {
    if (!text) return 1;
    const k = /** @type {number} */ (text.words[seq]);
    const wordsScore = k / text.queryLength;
    const maxT = /** @type {number} */ (text.maxTypos[seq]);
    const typoScore = maxT === 0 ? 1 : 1 - /** @type {number} */ (text.typos[seq]) / (maxT + 1);
    const exactScore = k === 0 ? 0 : /** @type {number} */ (text.exact[seq]) / k;
    const attrScore = 1 / (1 + /** @type {number} */ (text.attribute[seq]) / Math.max(k, 1));
    return Math.round(wordsScore * (0.6 + 0.2 * typoScore + 0.1 * attrScore + 0.1 * exactScore) * 1e4) / 1e4;
  };

  // The candidates: matching documents (or all, for a placeholder search), filtered.
  const source = text ? text.seqs : liveSeqs(index);
  /** @type {number[] | Int32Array} */
  let seqs = source;
  if (filterMaskOrNull || p.rankingScoreThreshold !== null) {
    /** @type {number[]} */
    const kept = [];
    const threshold = p.rankingScoreThreshold;
    for (let i = 0; i < source.length; i += 1) {
      const seq = /** @type {number} */ (source[i]);
      if (filterMaskOrNull && filterMaskOrNull[seq] !== 1) continue;
      if (threshold !== null && rankingScore(seq) < threshold) continue;
      kept.push(seq);
    }
    seqs = kept;
  }

  // Order: the ranking rules, with `sort` and custom `field:asc` rules where they stand.
  const rules = /** @type {string[]} */ (s.rankingRules);
  const custom = rules.some((r) => !REL_RULES.has(r) && r !== 'sort');
  /** @type {(a: number, b: number) => number} */
  let cmp;
  if (sorters || custom) {
    /** @type {Array<(a: number, b: number) => number>} */
    const chain = [];
    /** @type {string[]} */
    let group = [];
    const flush = () => {
      if (group.length > 0 && text) {
        const key = relevanceKey(text, group);
        chain.push((a, b) => key(b) - key(a));
      }
      group = [];
    };
    for (const rule of rules) {
      if (REL_RULES.has(rule)) group.push(rule);
      else if (rule === 'sort') {
        flush();
        if (sorters) chain.push(...sorters);
      } else {
        flush();
        const m = /^(.+):(asc|desc)$/.exec(rule);
        if (m) chain.push(sortComparator(index.facetGetter(/** @type {string} */ (m[1])), m[2] === 'asc'));
      }
    }
    flush();
    const score = text?.score;
    cmp = (a, b) => {
      for (let i = 0; i < chain.length; i += 1) {
        const r = /** @type {(a: number, b: number) => number} */ (chain[i])(a, b);
        if (r !== 0) return r;
      }
      if (score) {
        const d = /** @type {number} */ (score[b]) - /** @type {number} */ (score[a]);
        if (d !== 0) return d;
      }
      return a - b;
    };
  } else if (text) {
    const key = text.key;
    cmp = (a, b) => /** @type {number} */ (key[b]) - /** @type {number} */ (key[a]) || a - b;
  } else {
    cmp = (a, b) => a - b;
  }
  const naturalOrder = !text && !sorters && !custom;

  if (distinctField) {
    const ordered = naturalOrder ? Array.from(seqs) : Array.from(seqs).sort(cmp);
    const get = index.facetGetter(distinctField);
    /** @type {Set<string>} */
    const seen = new Set();
    seqs = ordered.filter((seq) => {
      const v = get(seq);
      const key = v.strs.length > 0 ? `s${v.strs[0]}` : v.nums.length > 0 ? `n${v.nums[0]}` : null;
      if (key === null) return true;
      if (seen.has(key)) return false;
      seen.add(key);
      return true;
    });
  }

  const maxTotalHits = s.pagination.maxTotalHits;
  const totalHits = Math.min(seqs.length, maxTotalHits);
  const finite = p.page !== null || p.hitsPerPage !== null;
  const hitsPerPage = p.hitsPerPage ?? 20;
  const page = p.page ?? 1;
  let offset = finite ? Math.max(page - 1, 0) * hitsPerPage : p.offset;
  let limit = finite ? (page === 0 ? 0 : hitsPerPage) : p.limit;
  offset = Math.min(offset, maxTotalHits);
  limit = Math.min(limit, maxTotalHits - offset);

  /** @type {number[]} */
  let window;
  if (limit === 0) window = [];
  else if (naturalOrder || distinctField) window = Array.from(seqs.slice(offset, offset + limit));
  else window = topK(seqs, offset + limit, cmp).slice(offset);

  const displayed = s.displayedAttributes.includes('*') ? null : /** @type {string[]} */ (s.displayedAttributes);
  const retrieve = p.attributesToRetrieve && !p.attributesToRetrieve.includes('*') ? p.attributesToRetrieve : null;
  const crop = p.attributesToCrop.map((attr) => {
    const m = /^(.*):(\d+)$/.exec(attr);
    return m ? { attribute: /** @type {string} */ (m[1]), length: Number(m[2]) } : { attribute: attr, length: p.cropLength };
  });
  /** @param {string} key @param {string} name */
  const related = (key, name) => name === '*' || isUnder(key, name) || isUnder(name, key);
  const topFields = [...index.fieldDistribution.keys()].filter((k) => !displayed || displayed.some((d) => related(k, d)));
  const formatted = topFields.some((k) => p.attributesToHighlight.some((h) => related(k, h)) || crop.some((c) => related(k, c.attribute)));
  const formatOptions = {
    matched: text ? text.matched : new Map(),
    retrieve,
    displayed,
    highlight: p.attributesToHighlight,
    crop,
    preTag: p.highlightPreTag,
    postTag: p.highlightPostTag,
    cropMarker: p.cropMarker,
    showMatchesPosition: p.showMatchesPosition,
    formatted,
  };
  const hits = window.map((seq) => {
    const rec = /** @type {Rec} */ (index.bySeq[seq]);
    const hit = formatHit(rec.doc, formatOptions);
    if (p.showRankingScore) hit._rankingScore = rankingScore(seq);
    if (p.showRankingScoreDetails) {
      hit._rankingScoreDetails = text
        ? {
            words: { order: 0, matchingWords: text.words[seq], maxMatchingWords: text.queryLength, score: /** @type {number} */ (text.words[seq]) / text.queryLength },
            typo: { order: 1, typoCount: text.typos[seq], maxTypoCount: text.maxTypos[seq], score: rankingScore(seq) },
          }
        : {};
    }
    return hit;
  });

  /** @type {Record<string, any>} */
  const response = { hits, query: p.q ?? '', processingTimeMs: 0 };
  if (finite) Object.assign(response, { hitsPerPage, page, totalPages: hitsPerPage === 0 ? 0 : Math.ceil(totalHits / hitsPerPage), totalHits });
  else Object.assign(response, { limit: p.limit, offset, estimatedTotalHits: totalHits });
  if (facets) {
    const { distribution, stats } = facetsOf(index, facets, seqs);
    response.facetDistribution = distribution;
    response.facetStats = stats;
  }
  response.processingTimeMs = Math.round(performance.now() - started);
  return response;
}
