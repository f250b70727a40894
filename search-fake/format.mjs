// @ts-check
// The `_formatted` and `_matchesPosition` parts of a hit. Matched words (the query's words,
// their typo and synonym matches, and for a prefix match only the matched prefix) are wrapped
// in the highlight tags; cropping keeps `cropLength` words around the best group of matches
// and marks cut ends with `cropMarker`.
//
// Nothing is HTML-escaped here (Meilisearch does not escape either): the tags are inserted
// into the raw text as given. An app that renders `_formatted` as HTML must escape the whole
// string and then turn its own (unusual, never-in-text) tags back into markup.
import { isUnder, selectAttributes } from './fields.mjs';
import { normalizeText, originalPrefixLength, wordSpans } from './text.mjs';

/**
 * What matched: normalised document word → length of the matched prefix of its normalised
 * form, or 0 when the whole word matched.
 * @typedef {Map<string, number>} MatchedWords
 */

/**
 * @typedef {object} FormatOptions
 * @property {MatchedWords} matched
 * @property {string[] | null} retrieve      attributes to retrieve (null = all displayed)
 * @property {string[] | null} displayed     displayed attributes (null = all)
 * @property {string[]} highlight            attributes to highlight (`*` = all retrieved)
 * @property {Array<{ attribute: string, length: number }>} crop  attributes to crop
 * @property {string} preTag
 * @property {string} postTag
 * @property {string} cropMarker
 * @property {boolean} showMatchesPosition
 * @property {boolean} [formatted]           whether hits get `_formatted` (default: when one of their attributes is formatted)
 */

/**
 * Per set of matched words: the lengths and first characters they have, to skip most words
 * of a text without building their normalised form.
 * @type {WeakMap<MatchedWords, { lengths: Set<number>, firsts: Set<number> }>}
 */
const matchIndex = new WeakMap();

/** @param {MatchedWords} matched */
function indexOfMatched(matched) {
  let entry = matchIndex.get(matched);
  if (!entry) {
    entry = { lengths: new Set(), firsts: new Set() };
    for (const word of matched.keys()) {
      entry.lengths.add(word.length);
      entry.firsts.add(word.charCodeAt(0));
    }
    matchIndex.set(matched, entry);
  }
  return entry;
}

/**
 * The words of `text` and which of them matched: [start, end) UTF-16 offsets of the
 * highlighted part (a prefix match highlights only the prefix).
 * @param {string} text
 * @param {MatchedWords} matched
 * @returns {{ count: number, starts: Int32Array, ends: Int32Array, hits: Array<{ word: number, start: number, end: number }> }}
 */
function findMatches(text, matched) {
  const spans = wordSpans(text);
  const hits = [];
  if (matched.size > 0) {
    const { lengths, firsts } = indexOfMatched(matched);
    const { lower, starts, ends } = spans;
    for (let i = 0; i < spans.count; i += 1) {
      const start = /** @type {number} */ (starts[i]);
      const end = /** @type {number} */ (ends[i]);
      let norm;
      if (lower !== null) {
        if (!lengths.has(end - start) || !firsts.has(lower.charCodeAt(start))) continue;
        norm = lower.slice(start, end);
      } else {
        norm = normalizeText(text.slice(start, end));
      }
      const prefix = matched.get(norm);
      if (prefix === undefined) continue;
      hits.push({ word: i, start, end: prefix > 0 ? start + originalPrefixLength(text.slice(start, end), prefix) : end });
    }
  }
  return { count: spans.count, starts: spans.starts, ends: spans.ends, hits };
}

/**
 * `text` with the matches wrapped in the tags.
 * @param {string} text @param {MatchedWords} matched @param {string} pre @param {string} post
 */
export function highlightText(text, matched, pre, post) {
  const { hits } = findMatches(text, matched);
  if (hits.length === 0) return text;
  let out = '';
  let at = 0;
  for (const hit of hits) {
    out += text.slice(at, hit.start) + pre + text.slice(hit.start, hit.end) + post;
    at = hit.end;
  }
  return out + text.slice(at);
}

/**
 * At most `length` words of `text`, around the group of matches with the most distinct
 * matched words (the first such group), centred on it; `marker` where text was cut.
 * @param {string} text @param {MatchedWords} matched @param {number} length @param {string} marker
 */
export function cropText(text, matched, length, marker) {
  const { count, starts, ends, hits } = findMatches(text, matched);
  if (count <= length) return text;
  if (length === 0) return marker;
  let start = 0;
  if (hits.length > 0) {
    let best = { distinct: -1, count: -1, first: 0, last: 0 };
    for (let i = 0; i < hits.length; i += 1) {
      const firstWord = /** @type {{ word: number }} */ (hits[i]).word;
      /** @type {Set<string>} */
      const seen = new Set();
      let lastWord = firstWord;
      let n = 0;
      for (let j = i; j < hits.length; j += 1) {
        const h = /** @type {{ word: number, start: number }} */ (hits[j]);
        if (h.word >= firstWord + length) break;
        seen.add(text.slice(h.start, /** @type {number} */ (ends[h.word])).toLowerCase());
        lastWord = h.word;
        n += 1;
      }
      if (seen.size > best.distinct || (seen.size === best.distinct && n > best.count)) {
        best = { distinct: seen.size, count: n, first: firstWord, last: lastWord };
      }
    }
    const slack = length - (best.last - best.first + 1);
    start = Math.max(0, Math.min(best.first - Math.floor(slack / 2), count - length));
  }
  const end = start + length - 1;
  const from = start === 0 ? 0 : /** @type {number} */ (starts[start]);
  const to = end >= count - 1 ? text.length : /** @type {number} */ (ends[end]);
  return (start > 0 ? marker : '') + text.slice(from, to) + (end < count - 1 ? marker : '');
}

/**
 * Byte offsets of the matches in `text` (`_matchesPosition` counts UTF-8 bytes, like Meilisearch).
 * @param {string} text @param {MatchedWords} matched
 */
function matchPositions(text, matched) {
  const { hits } = findMatches(text, matched);
  return hits.map((h) => ({ start: Buffer.byteLength(text.slice(0, h.start)), length: Buffer.byteLength(text.slice(h.start, h.end)) }));
}

/** @param {string} key @param {string[]} list */
const listed = (key, list) => list.some((name) => name === '*' || isUnder(key, name) || isUnder(name, key));

/**
 * The hit for one document: retrieved attributes, and `_formatted` / `_matchesPosition` when asked.
 * @param {Record<string, any>} doc
 * @param {FormatOptions} o
 * @returns {Record<string, any>}
 */
export function formatHit(doc, o) {
  const displayedDoc = selectAttributes(doc, o.displayed);
  const hit = selectAttributes(displayedDoc, o.retrieve);
  const cropFor = (/** @type {string} */ key) => {
    /** @type {number | null} */
    let length = null;
    for (const c of o.crop) if (c.attribute === '*' || isUnder(key, c.attribute) || isUnder(c.attribute, key)) length = c.length;
    return length;
  };
  const formats = (/** @type {string} */ key) => listed(key, o.highlight) || o.crop.some((c) => listed(key, [c.attribute]));
  // Like Meilisearch: `_formatted` only when some displayed attribute of the index is
  // highlighted or cropped (the caller decides that once per search: `o.formatted`).
  if (o.formatted ?? Object.keys(displayedDoc).some(formats)) {
    const formattedKeys = Object.keys(displayedDoc).filter((key) => key in hit || formats(key));
    /** @type {Record<string, any>} */
    const formatted = {};
    for (const key of formattedKeys) formatted[key] = formatValue(displayedDoc[key], key, o, cropFor);
    hit._formatted = formatted;
  }
  if (o.showMatchesPosition) {
    /** @type {Record<string, Array<{ start: number, length: number, indices?: number[] }>>} */
    const positions = {};
    collectPositions(displayedDoc, '', [], o.matched, positions);
    hit._matchesPosition = positions;
  }
  return hit;
}

/**
 * @param {unknown} value @param {string} key dotted path @param {FormatOptions} o
 * @param {(key: string) => number | null} cropFor
 * @returns {unknown}
 */
function formatValue(value, key, o, cropFor) {
  if (Array.isArray(value)) return value.map((item) => formatValue(item, key, o, cropFor));
  if (value !== null && typeof value === 'object') {
    /** @type {Record<string, unknown>} */
    const out = {};
    for (const [k, v] of Object.entries(value)) out[k] = formatValue(v, `${key}.${k}`, o, cropFor);
    return out;
  }
  if (typeof value !== 'string' && typeof value !== 'number') return value;
  let text = String(value);
  const crop = cropFor(key);
  if (crop !== null) text = cropText(text, o.matched, crop, o.cropMarker);
  if (listed(key, o.highlight)) text = highlightText(text, o.matched, o.preTag, o.postTag);
  return text;
}

/**
 * @param {unknown} value @param {string} key @param {number[]} indices
 * @param {MatchedWords} matched
 * @param {Record<string, Array<{ start: number, length: number, indices?: number[] }>>} out
 */
function collectPositions(value, key, indices, matched, out) {
  if (Array.isArray(value)) {
    value.forEach((item, i) => collectPositions(item, key, [...indices, i], matched, out));
    return;
  }
  if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) collectPositions(v, key ? `${key}.${k}` : k, indices, matched, out);
    return;
  }
  if (typeof value !== 'string' && typeof value !== 'number') return;
  const found = matchPositions(String(value), matched);
  if (found.length === 0) return;
  const list = out[key] ?? (out[key] = []);
  for (const f of found) list.push(indices.length > 0 ? { ...f, indices } : f);
}
