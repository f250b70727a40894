// @ts-check
// Words as the full-text side of the fake sees them: maximal runs of letters, digits and
// combining marks; compared in lower case with diacritics removed (so "Écoulement" matches
// "ecoulement"), the way Meilisearch's tokenizer normalises Latin text. Also the typo
// distance (optimal string alignment: a swap of two neighbouring letters is one typo).

const WORD = /[\p{L}\p{N}\p{M}]+/gu;
const NON_ASCII = /[^\x00-\x7f]/;
const MARKS = /\p{M}/gu;

/** Lower case, compatibility-decomposed, without combining marks. @param {string} text */
export function normalizeText(text) {
  return NON_ASCII.test(text) ? text.normalize('NFKD').replace(MARKS, '').toLowerCase() : text.toLowerCase();
}

/**
 * Calls `visit` with every normalised word of `text`.
 * @param {string} text
 * @param {(word: string) => void} visit
 */
export function forEachWord(text, visit) {
  const normalized = normalizeText(text);
  WORD.lastIndex = 0;
  for (let m = WORD.exec(normalized); m !== null; m = WORD.exec(normalized)) {
    const word = m[0];
    if (word.length <= 250) visit(word);
  }
}

/** Reused by wordSpans (valid until its next call). */
const spanScratch = { starts: new Int32Array(4096), ends: new Int32Array(4096) };

/** @param {number} c a UTF-16 code unit of ASCII text */
const isAsciiWordChar = (c) => (c >= 97 && c <= 122) || (c >= 48 && c <= 57) || (c >= 65 && c <= 90);

/**
 * Where the words of `text` are, without allocating per word: `starts[i]`/`ends[i]` for
 * `i < count` (UTF-16 offsets; read only: for short texts the arrays are reused by the next
 * call, for long ones they are cached). `lower` is the text
 * in lower case when it is plain ASCII (then a word's normalised form is a slice of it).
 * @param {string} text
 * @returns {{ count: number, starts: Int32Array, ends: Int32Array, lower: string | null }}
 */
export function wordSpans(text) {
  if (text.length < CACHED_TEXT_LENGTH) return scanWordSpans(text);
  // Long texts (bodies) are highlighted and cropped again and again as searches repeat:
  // keep their spans, as a search engine keeps word positions in its index. A Map keyed by
  // the string: V8 hashes a string once, and a stored document's text is the same string.
  const cached = spanCache.get(text);
  if (cached) return cached;
  const found = scanWordSpans(text);
  const kept = { count: found.count, starts: found.starts.slice(0, found.count), ends: found.ends.slice(0, found.count), lower: found.lower };
  if (spanCache.size >= SPAN_CACHE_ENTRIES) spanCache.delete(/** @type {string} */ (spanCache.keys().next().value));
  spanCache.set(text, kept);
  return kept;
}

/** Texts at least this long have their spans cached. */
const CACHED_TEXT_LENGTH = 512;
/** At most this many texts' spans are kept (the oldest go first): a few MB. */
const SPAN_CACHE_ENTRIES = 2048;
/** @type {Map<string, { count: number, starts: Int32Array, ends: Int32Array, lower: string | null }>} */
const spanCache = new Map();

/** @param {string} text */
function scanWordSpans(text) {
  let { starts, ends } = spanScratch;
  let count = 0;
  /** @param {number} start @param {number} end */
  const push = (start, end) => {
    if (count === starts.length) {
      const s2 = new Int32Array(starts.length * 2);
      const e2 = new Int32Array(starts.length * 2);
      s2.set(starts);
      e2.set(ends);
      starts = spanScratch.starts = s2;
      ends = spanScratch.ends = e2;
    }
    starts[count] = start;
    ends[count] = end;
    count += 1;
  };
  if (!NON_ASCII.test(text)) {
    let start = -1;
    for (let i = 0; i < text.length; i += 1) {
      if (isAsciiWordChar(text.charCodeAt(i))) {
        if (start < 0) start = i;
      } else if (start >= 0) {
        push(start, i);
        start = -1;
      }
    }
    if (start >= 0) push(start, text.length);
    return { count, starts, ends, lower: text.toLowerCase() };
  }
  const re = new RegExp(WORD.source, 'gu');
  for (let m = re.exec(text); m !== null; m = re.exec(text)) push(m.index, m.index + m[0].length);
  return { count, starts, ends, lower: null };
}

/**
 * How many characters of the original `word` make up the first `normLength` characters of
 * its normalised form (used to highlight only the matched prefix of a word).
 * @param {string} word
 * @param {number} normLength
 */
export function originalPrefixLength(word, normLength) {
  if (!NON_ASCII.test(word)) return Math.min(normLength, word.length);
  let taken = 0;
  let i = 0;
  for (const ch of word) {
    if (taken >= normLength) break;
    taken += normalizeText(ch).length;
    i += ch.length;
  }
  return i;
}

/**
 * The query's words, normalised, and whether the query ends inside its last word (then that
 * word is searched as a prefix, as Meilisearch does while a user is typing).
 * @param {string} q
 */
export function queryWords(q) {
  /** @type {string[]} */
  const words = [];
  forEachWord(q, (w) => words.push(w));
  const trimmedEnd = q.length > 0 && /[\p{L}\p{N}\p{M}]$/u.test(q);
  return { words, lastIsPrefix: trimmedEnd };
}

/**
 * Optimal string alignment distance, or `max + 1` as soon as it must exceed `max`.
 * @param {string} a
 * @param {string} b
 * @param {number} max
 */
export function typoDistance(a, b, max) {
  if (Math.abs(a.length - b.length) > max) return max + 1;
  const n = a.length;
  const m = b.length;
  /** @type {any} */
  let prev2 = new Array(m + 1).fill(0);
  /** @type {any} */
  let prev = Array.from({ length: m + 1 }, (_, j) => j);
  /** @type {any} */
  let cur = new Array(m + 1).fill(0);
  for (let i = 1; i <= n; i += 1) {
    cur[0] = i;
    let rowMin = cur[0];
    for (let j = 1; j <= m; j += 1) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let v = Math.min(prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) v = Math.min(v, prev2[j - 2] + 1);
      cur[j] = v;
      if (v < rowMin) rowMin = v;
    }
    if (rowMin > max) return max + 1;
    [prev2, prev, cur] = [prev, cur, prev2];
  }
  return /** @type {number} */ (prev[m]);
}
