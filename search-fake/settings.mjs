// @ts-check
// Index settings: Meilisearch's defaults, validation of an update (with Meilisearch's error
// codes), PATCH semantics (a key set to null goes back to its default; nested objects such as
// `typoTolerance` are merged), and the `/settings/<kebab-name>` sub-routes with the HTTP
// method the SDK uses for each.
import { badRequest, invalidType } from './errors.mjs';

/** @typedef {Record<string, any>} Settings */

/** @returns {Settings} */
export function defaultSettings() {
  return {
    displayedAttributes: ['*'],
    searchableAttributes: ['*'],
    filterableAttributes: [],
    sortableAttributes: [],
    rankingRules: ['words', 'typo', 'proximity', 'attribute', 'sort', 'exactness'],
    stopWords: [],
    nonSeparatorTokens: [],
    separatorTokens: [],
    dictionary: [],
    synonyms: {},
    distinctAttribute: null,
    proximityPrecision: 'byWord',
    typoTolerance: {
      enabled: true,
      minWordSizeForTypos: { oneTypo: 5, twoTypos: 9 },
      disableOnWords: [],
      disableOnAttributes: [],
      disableOnNumbers: false,
    },
    faceting: { maxValuesPerFacet: 100, sortFacetValuesBy: { '*': 'alpha' } },
    pagination: { maxTotalHits: 1000 },
    embedders: {},
    searchCutoffMs: null,
    localizedAttributes: null,
    facetSearch: true,
    prefixSearch: 'indexingTime',
  };
}

const KEYS = Object.keys(defaultSettings());

/**
 * The sub-routes: kebab-case name → setting key and the method that updates it
 * (PATCH for the object-valued settings, PUT for the others, as the SDK calls them).
 * @type {Record<string, { key: string, method: 'PUT' | 'PATCH' }>}
 */
export const SETTING_ROUTES = Object.fromEntries(
  KEYS.map((key) => [
    key.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`),
    { key, method: ['typoTolerance', 'faceting', 'pagination', 'embedders'].includes(key) ? 'PATCH' : 'PUT' },
  ]),
);
// The SDK's name for the distinct attribute route.
SETTING_ROUTES['distinct-attribute'] = { key: 'distinctAttribute', method: 'PUT' };

/** @param {string} key */
const codeOf = (key) => `invalid_settings_${key.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`)}`;

/** @param {string} path @param {string} key */
const at = (path, key) => (path ? `${path}.${key}` : `.${key}`);

/** @param {unknown} value @param {string} code @param {string} path */
function stringArray(value, code, path) {
  if (!Array.isArray(value)) throw invalidType(code, path, 'an array', value);
  value.forEach((item, i) => {
    if (typeof item !== 'string') throw invalidType(code, `${path}[${i}]`, 'a string', item);
  });
  return [...new Set(/** @type {string[]} */ (value))];
}

/** @param {unknown} value @param {string} code @param {string} path */
function plainObject(value, code, path) {
  if (value === null || typeof value !== 'object' || Array.isArray(value)) throw invalidType(code, path, 'an object', value);
  return /** @type {Record<string, unknown>} */ (value);
}

/** @param {Record<string, unknown>} obj @param {string[]} allowed @param {string} code @param {string} path */
function onlyKeys(obj, allowed, code, path) {
  for (const k of Object.keys(obj)) {
    if (!allowed.includes(k)) {
      throw badRequest(code, `Unknown field \`${k}\` inside \`${path}\`: expected one of ${allowed.map((a) => `\`${a}\``).join(', ')}`);
    }
  }
}

/** @param {unknown} value @param {string} code @param {string} path */
function bool(value, code, path) {
  if (typeof value !== 'boolean') throw invalidType(code, path, 'a boolean', value);
  return value;
}

/** @param {unknown} value @param {string} code @param {string} path */
function count(value, code, path) {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < 0) throw invalidType(code, path, 'a positive integer', value);
  return value;
}

const RANKING_RULES = new Set(['words', 'typo', 'proximity', 'attribute', 'sort', 'exactness']);

/**
 * Validates one setting's new value (null = back to the default) and returns the value to store.
 * `current` is the setting's present value, for merging objects.
 * @param {string} key
 * @param {unknown} value
 * @param {any} current
 * @param {string} [path] how the value is named in messages (`.key` in a full update, `` in a sub-route)
 */
export function validateSetting(key, value, current, path = `.${key}`) {
  const code = codeOf(key);
  const defaults = defaultSettings();
  if (value === null) return structuredClone(defaults[key]);
  switch (key) {
    case 'displayedAttributes':
    case 'searchableAttributes': {
      const list = stringArray(value, code, path);
      return list.includes('*') ? ['*'] : list;
    }
    case 'sortableAttributes':
    case 'stopWords':
    case 'nonSeparatorTokens':
    case 'separatorTokens':
    case 'dictionary':
      return stringArray(value, code, path);
    case 'filterableAttributes': {
      if (!Array.isArray(value)) throw invalidType(code, path, 'an array', value);
      return value.map((rule, i) => {
        if (typeof rule === 'string') return rule;
        const obj = plainObject(rule, code, `${path}[${i}]`);
        onlyKeys(obj, ['attributePatterns', 'features'], code, `${path}[${i}]`);
        const patterns = stringArray(obj.attributePatterns ?? null, code, `${path}[${i}].attributePatterns`);
        const features = obj.features === undefined ? {} : plainObject(obj.features, code, `${path}[${i}].features`);
        onlyKeys(features, ['facetSearch', 'filter'], code, `${path}[${i}].features`);
        const filter = features.filter === undefined ? {} : plainObject(features.filter, code, `${path}[${i}].features.filter`);
        onlyKeys(filter, ['equality', 'comparison'], code, `${path}[${i}].features.filter`);
        return {
          attributePatterns: patterns,
          features: {
            facetSearch: features.facetSearch === undefined ? false : bool(features.facetSearch, code, `${path}[${i}].features.facetSearch`),
            filter: {
              equality: filter.equality === undefined ? true : bool(filter.equality, code, `${path}[${i}].features.filter.equality`),
              comparison: filter.comparison === undefined ? false : bool(filter.comparison, code, `${path}[${i}].features.filter.comparison`),
            },
          },
        };
      });
    }
    case 'rankingRules': {
      const list = stringArray(value, code, path);
      for (const rule of list) {
        if (!RANKING_RULES.has(rule) && !/^.+:(asc|desc)$/.test(rule)) {
          throw badRequest(code, `Invalid value at \`${path}\`: \`${rule}\` ranking rule is invalid. Valid ranking rules are words, typo, sort, proximity, attribute, exactness and custom ranking rules.`);
        }
      }
      return list;
    }
    case 'synonyms': {
      const obj = plainObject(value, code, path);
      /** @type {Record<string, string[]>} */
      const out = {};
      for (const [word, list] of Object.entries(obj)) out[word] = stringArray(list, code, `${path}.${word}`);
      return out;
    }
    case 'distinctAttribute':
      if (typeof value !== 'string') throw invalidType(code, path, 'a string', value);
      return value;
    case 'proximityPrecision':
      if (value !== 'byWord' && value !== 'byAttribute') {
        throw badRequest(code, `Unknown value \`${String(value)}\` at \`${path}\`: expected one of \`byWord\`, \`byAttribute\``);
      }
      return value;
    case 'prefixSearch':
      if (value !== 'indexingTime' && value !== 'disabled') {
        throw badRequest(code, `Unknown value \`${String(value)}\` at \`${path}\`: expected one of \`indexingTime\`, \`disabled\``);
      }
      return value;
    case 'facetSearch':
      return bool(value, code, path);
    case 'searchCutoffMs':
      return count(value, code, path);
    case 'localizedAttributes':
      if (!Array.isArray(value)) throw invalidType(code, path, 'an array', value);
      return structuredClone(value);
    case 'embedders': {
      const obj = plainObject(value, code, path);
      const merged = { ...(current ?? {}) };
      for (const [name, embedder] of Object.entries(obj)) {
        if (embedder === null) delete merged[name];
        else merged[name] = structuredClone(embedder);
      }
      return merged;
    }
    case 'typoTolerance': {
      const obj = plainObject(value, code, path);
      onlyKeys(obj, ['enabled', 'minWordSizeForTypos', 'disableOnWords', 'disableOnAttributes', 'disableOnNumbers'], code, path);
      const base = structuredClone(current ?? defaults.typoTolerance);
      const d = defaults.typoTolerance;
      if ('enabled' in obj) base.enabled = obj.enabled === null ? d.enabled : bool(obj.enabled, code, at(path, 'enabled'));
      if ('disableOnNumbers' in obj) base.disableOnNumbers = obj.disableOnNumbers === null ? d.disableOnNumbers : bool(obj.disableOnNumbers, code, at(path, 'disableOnNumbers'));
      if ('disableOnWords' in obj) base.disableOnWords = obj.disableOnWords === null ? [] : stringArray(obj.disableOnWords, code, at(path, 'disableOnWords'));
      if ('disableOnAttributes' in obj) base.disableOnAttributes = obj.disableOnAttributes === null ? [] : stringArray(obj.disableOnAttributes, code, at(path, 'disableOnAttributes'));
      if ('minWordSizeForTypos' in obj) {
        if (obj.minWordSizeForTypos === null) base.minWordSizeForTypos = { ...d.minWordSizeForTypos };
        else {
          const sizes = plainObject(obj.minWordSizeForTypos, code, at(path, 'minWordSizeForTypos'));
          onlyKeys(sizes, ['oneTypo', 'twoTypos'], code, at(path, 'minWordSizeForTypos'));
          for (const k of /** @type {const} */ (['oneTypo', 'twoTypos'])) {
            if (k in sizes) base.minWordSizeForTypos[k] = sizes[k] === null ? d.minWordSizeForTypos[k] : count(sizes[k], code, at(at(path, 'minWordSizeForTypos'), k));
          }
        }
        if (base.minWordSizeForTypos.oneTypo > base.minWordSizeForTypos.twoTypos) {
          throw badRequest(code, '`minWordSizeForTypos` setting is invalid. `oneTypo` and `twoTypos` fields should be between `0` and `255`, and `twoTypos` should be greater or equals to `oneTypo` but found `oneTypo: ' + base.minWordSizeForTypos.oneTypo + '` and twoTypos: ' + base.minWordSizeForTypos.twoTypos + '`.');
        }
      }
      return base;
    }
    case 'faceting': {
      const obj = plainObject(value, code, path);
      onlyKeys(obj, ['maxValuesPerFacet', 'sortFacetValuesBy'], code, path);
      const base = structuredClone(current ?? defaults.faceting);
      if ('maxValuesPerFacet' in obj) base.maxValuesPerFacet = obj.maxValuesPerFacet === null ? 100 : count(obj.maxValuesPerFacet, code, at(path, 'maxValuesPerFacet'));
      if ('sortFacetValuesBy' in obj) {
        if (obj.sortFacetValuesBy === null) base.sortFacetValuesBy = { '*': 'alpha' };
        else {
          const by = plainObject(obj.sortFacetValuesBy, code, at(path, 'sortFacetValuesBy'));
          /** @type {Record<string, string>} */
          const next = { '*': 'alpha' };
          for (const [attr, order] of Object.entries(by)) {
            if (order !== 'alpha' && order !== 'count') {
              throw badRequest(code, `Unknown value \`${String(order)}\` at \`${at(at(path, 'sortFacetValuesBy'), attr)}\`: expected one of \`alpha\`, \`count\``);
            }
            next[attr] = order;
          }
          base.sortFacetValuesBy = next;
        }
      }
      return base;
    }
    case 'pagination': {
      const obj = plainObject(value, code, path);
      onlyKeys(obj, ['maxTotalHits'], code, path);
      const base = structuredClone(current ?? defaults.pagination);
      if ('maxTotalHits' in obj) base.maxTotalHits = obj.maxTotalHits === null ? 1000 : count(obj.maxTotalHits, code, at(path, 'maxTotalHits'));
      return base;
    }
    default:
      throw badRequest('bad_request', `Unknown field \`${key}\``);
  }
}

/**
 * Validates a full settings update (the body of `PATCH /settings`) against `current`,
 * returning the complete new settings. Unknown keys are rejected as Meilisearch does.
 * @param {unknown} body
 * @param {Settings} current
 * @returns {Settings}
 */
export function applySettingsUpdate(body, current) {
  if (body === null || typeof body !== 'object' || Array.isArray(body)) throw invalidType('bad_request', '', 'an object', body);
  const next = structuredClone(current);
  for (const [key, value] of Object.entries(body)) {
    if (!KEYS.includes(key)) {
      throw badRequest('bad_request', `Unknown field \`${key}\`: expected one of ${KEYS.map((k) => `\`${k}\``).join(', ')}`);
    }
    next[key] = validateSetting(key, value, current[key]);
  }
  return next;
}

/**
 * Settings as stored on disk may come from an older fake: fill what is missing with defaults.
 * @param {unknown} stored
 * @returns {Settings}
 */
export function normalizeStoredSettings(stored) {
  const settings = defaultSettings();
  if (stored && typeof stored === 'object') {
    for (const key of KEYS) if (key in stored) settings[key] = /** @type {any} */ (stored)[key];
  }
  return settings;
}
