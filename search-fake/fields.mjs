// @ts-check
// Document fields as Meilisearch sees them: nested objects flattened to dotted names
// (`{a: {b: 1}}` gives `a.b`), arrays flattened into their field, facet values normalised
// the way the engine compares them (trimmed, Unicode compatibility decomposition, lower
// case), attribute patterns (`*`, `prefix*`, `*suffix`, nested `a` covering `a.b`) and the
// selection of attributes to retrieve.

/**
 * One flattened field of a document.
 * @typedef {object} FlatField
 * @property {Array<string | number | boolean>} leaves  scalar values, arrays flattened
 * @property {boolean} isNull   the value (or an array element) is `null`
 * @property {boolean} isEmpty  the value is `""`, `[]` or `{}`
 */

/**
 * A field's values as the filter and facet code compare them.
 * @typedef {object} FacetValue
 * @property {number[]} nums      finite numbers
 * @property {string[]} strs      strings and booleans, normalised (see normalizeFacet)
 * @property {string[]} originals the same strings as written in the document
 * @property {boolean} exists
 * @property {boolean} isNull
 * @property {boolean} isEmpty
 */

/** @type {FacetValue} */
export const MISSING = Object.freeze({ nums: [], strs: [], originals: [], exists: false, isNull: false, isEmpty: false });

const NON_ASCII = /[^\x00-\x7f]/;

/**
 * A facet string as Meilisearch stores it for filtering: trimmed, NFKD, lower case.
 * @param {string} value
 */
export function normalizeFacet(value) {
  const trimmed = value.trim();
  return (NON_ASCII.test(trimmed) ? trimmed.normalize('NFKD') : trimmed).toLowerCase();
}

/**
 * Every field of `doc` under its dotted name (objects inside arrays too). Object parents are
 * listed (with no leaves) so that `EXISTS` sees them.
 * @param {Record<string, unknown>} doc
 * @returns {Map<string, FlatField>}
 */
export function flatten(doc) {
  /** @type {Map<string, FlatField>} */
  const out = new Map();
  /** @param {string} key */
  const entry = (key) => {
    let field = out.get(key);
    if (!field) {
      field = { leaves: [], isNull: false, isEmpty: false };
      out.set(key, field);
    }
    return field;
  };
  /** @param {string} key @param {unknown} value @param {boolean} inArray */
  const visit = (key, value, inArray) => {
    if (value === null || value === undefined) {
      entry(key).isNull = true;
    } else if (Array.isArray(value)) {
      const field = entry(key);
      if (value.length === 0 && !inArray) field.isEmpty = true;
      for (const item of value) visit(key, item, true);
    } else if (typeof value === 'object') {
      const keys = Object.keys(value);
      const field = entry(key);
      if (keys.length === 0 && !inArray) field.isEmpty = true;
      for (const k of keys) visit(`${key}.${k}`, /** @type {Record<string, unknown>} */ (value)[k], false);
    } else if (typeof value === 'string' || typeof value === 'number' || typeof value === 'boolean') {
      const field = entry(key);
      field.leaves.push(value);
      if (value === '' && !inArray) field.isEmpty = true;
    }
  };
  for (const key of Object.keys(doc)) visit(key, doc[key], false);
  return out;
}

/**
 * One flattened field of `doc` (what `flatten(doc).get(path)` gives), computed without
 * flattening the rest of the document.
 * @param {Record<string, unknown>} doc
 * @param {string} path
 * @returns {FlatField | undefined}
 */
export function fieldOf(doc, path) {
  /** @type {FlatField | undefined} */
  let field;
  const entry = () => (field ??= { leaves: [], isNull: false, isEmpty: false });
  /** @param {unknown} value @param {boolean} inArray */
  const atTarget = (value, inArray) => {
    if (value === null || value === undefined) {
      entry().isNull = true;
    } else if (Array.isArray(value)) {
      const f = entry();
      if (value.length === 0 && !inArray) f.isEmpty = true;
      for (const item of value) atTarget(item, true);
    } else if (typeof value === 'object') {
      const f = entry();
      if (Object.keys(value).length === 0 && !inArray) f.isEmpty = true;
    } else if (typeof value === 'string' || typeof value === 'number' || typeof value === 'boolean') {
      const f = entry();
      f.leaves.push(value);
      if (value === '' && !inArray) f.isEmpty = true;
    }
  };
  /** @param {unknown} value @param {string} rest path left to walk */
  const descend = (value, rest) => {
    if (Array.isArray(value)) {
      for (const item of value) descend(item, rest);
    } else if (value !== null && typeof value === 'object') {
      for (const k of Object.keys(value)) {
        const v = /** @type {Record<string, unknown>} */ (value)[k];
        if (k === rest) atTarget(v, false);
        else if (rest.startsWith(`${k}.`)) descend(v, rest.slice(k.length + 1));
      }
    }
  };
  descend(doc, path);
  return field;
}

/**
 * The facet values of one flattened field.
 * @param {FlatField | undefined} field
 * @returns {FacetValue}
 */
export function facetValueOf(field) {
  if (!field) return MISSING;
  /** @type {number[]} */
  const nums = [];
  /** @type {string[]} */
  const strs = [];
  /** @type {string[]} */
  const originals = [];
  for (const leaf of field.leaves) {
    if (typeof leaf === 'number') {
      if (Number.isFinite(leaf)) nums.push(leaf);
    } else {
      const original = typeof leaf === 'boolean' ? String(leaf) : leaf;
      strs.push(normalizeFacet(original));
      originals.push(original);
    }
  }
  return { nums, strs, originals, exists: true, isNull: field.isNull, isEmpty: field.isEmpty };
}

/**
 * Does the attribute pattern match `field`? `*` matches everything; one leading and/or
 * trailing `*` match a suffix, prefix or infix; a plain name matches itself and the fields
 * nested under it (`a` matches `a.b`).
 * @param {string} pattern
 * @param {string} field
 */
export function patternMatches(pattern, field) {
  if (pattern === '*') return true;
  const starts = pattern.startsWith('*');
  const ends = pattern.endsWith('*') && pattern.length > 1;
  if (!starts && !ends) return field === pattern || field.startsWith(`${pattern}.`);
  const core = pattern.slice(starts ? 1 : 0, ends ? -1 : undefined);
  if (starts && ends) return field.includes(core);
  if (starts) return field.endsWith(core);
  return field.startsWith(core);
}

/**
 * Is `field` equal to `name` or nested under it (`a.b` under `a`)?
 * @param {string} field
 * @param {string} name
 */
export function isUnder(field, name) {
  return field === name || field.startsWith(`${name}.`);
}

/**
 * The features a `filterableAttributes` entry gives to the fields it matches.
 * @typedef {object} FilterFeatures
 * @property {boolean} equality   `=`, `!=`, `IN`, `EXISTS`, `IS NULL`, `IS EMPTY` (and facets)
 * @property {boolean} comparison `<`, `<=`, `>`, `>=`, `TO`
 * @property {boolean} facetSearch
 * @property {number} rule        index of the entry in `filterableAttributes`
 */

/**
 * The first `filterableAttributes` rule matching `field`, or null when it is not filterable.
 * @param {string} field
 * @param {Array<string | {attributePatterns: string[], features?: any}>} rules
 * @returns {FilterFeatures | null}
 */
export function filterFeatures(field, rules) {
  for (let i = 0; i < rules.length; i += 1) {
    const rule = rules[i];
    if (typeof rule === 'string') {
      if (patternMatches(rule, field)) return { equality: true, comparison: true, facetSearch: true, rule: i };
    } else if (rule && Array.isArray(rule.attributePatterns)) {
      if (rule.attributePatterns.some((p) => patternMatches(p, field))) {
        const filter = rule.features?.filter ?? {};
        return {
          equality: filter.equality ?? true,
          comparison: filter.comparison ?? false,
          facetSearch: rule.features?.facetSearch ?? false,
          rule: i,
        };
      }
    }
  }
  return null;
}

/**
 * The patterns of all `filterableAttributes` rules, for error messages (sorted, like Meilisearch).
 * @param {Array<string | {attributePatterns: string[]}>} rules
 */
export function filterablePatterns(rules) {
  /** @type {Set<string>} */
  const patterns = new Set();
  for (const rule of rules) {
    if (typeof rule === 'string') patterns.add(rule);
    else if (rule && Array.isArray(rule.attributePatterns)) for (const p of rule.attributePatterns) patterns.add(p);
  }
  return [...patterns].sort();
}

/**
 * A copy of `doc` keeping only the attributes `selectors` select (`*` keeps all; `a` keeps
 * `a` and what is nested in it; `a.b` keeps only `b` inside `a`). Key order is the document's.
 * @param {Record<string, any>} doc
 * @param {string[] | null} selectors  null means everything
 * @returns {Record<string, any>}
 */
export function selectAttributes(doc, selectors) {
  if (!selectors || selectors.includes('*')) return { ...doc };
  /** @type {Record<string, any>} */
  const out = {};
  for (const key of Object.keys(doc)) {
    if (selectors.some((s) => s === key)) {
      out[key] = doc[key];
      continue;
    }
    const nested = selectors.filter((s) => s.startsWith(`${key}.`)).map((s) => s.slice(key.length + 1));
    if (nested.length === 0) continue;
    const value = doc[key];
    if (Array.isArray(value)) {
      const items = value
        .filter((item) => item && typeof item === 'object' && !Array.isArray(item))
        .map((item) => selectAttributes(item, nested))
        .filter((item) => Object.keys(item).length > 0);
      if (items.length > 0) out[key] = items;
    } else if (value && typeof value === 'object') {
      const inner = selectAttributes(value, nested);
      if (Object.keys(inner).length > 0) out[key] = inner;
    }
  }
  return out;
}
