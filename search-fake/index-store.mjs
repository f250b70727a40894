// @ts-check
// One index in memory: its documents (by external id and by an internal sequence number that
// gives the stable placeholder order), its settings, an inverted index for full-text search
// (term → document → fields and term frequency) whose term dictionary is MiniSearch's radix
// tree (prefix and typo lookups), and per-field caches of facet values for filters, facets
// and sorting. Writes go through the methods here, which keep all of that consistent.
import SearchableMap from 'minisearch/SearchableMap';
import { badRequest, MeiliError } from './errors.mjs';
import { facetValueOf, fieldOf, flatten, isUnder } from './fields.mjs';
import { defaultSettings } from './settings.mjs';
import { forEachWord } from './text.mjs';

/** @typedef {import('./fields.mjs').FacetValue} FacetValue */
/** @typedef {import('./fields.mjs').FlatField} FlatField */

/**
 * A stored document.
 * @typedef {object} Rec
 * @property {string} id        external id as a string
 * @property {number} seq       internal number (insertion order; kept when the document is replaced)
 * @property {Record<string, any>} doc
 */

/**
 * The documents containing one term, as parallel typed arrays (no per-entry objects for the
 * garbage collector to walk). An entry is current while its generation equals the
 * document's (`Index.gens`); replaced or removed documents leave stale entries behind, which
 * are skipped and compacted away once they are the majority.
 * @typedef {object} Posting
 * @property {Int32Array} seqs
 * @property {Int32Array} packed  field bits << TF_BITS | term frequency
 * @property {Int32Array} gens
 * @property {number} length      entries in use
 * @property {number} live        current entries
 */

/** Bits for fields in a posting: the term frequency takes the low 10 bits. */
export const TF_BITS = 10;
const TF_MAX = (1 << TF_BITS) - 1;
/** Field bits 0..20; fields beyond share the last bit. */
export const MAX_FIELD_BIT = 20;

const ID_PATTERN = /^[A-Za-z0-9_-]{1,511}$/;

/**
 * The document id as a string, or a `invalid_document_id` error.
 * @param {unknown} value
 * @returns {string}
 */
export function documentIdOf(value) {
  if (typeof value === 'number' && Number.isSafeInteger(value)) return String(value);
  if (typeof value === 'string' && ID_PATTERN.test(value) && Buffer.byteLength(value) <= 511) return value;
  throw new MeiliError(
    400,
    'invalid_document_id',
    `Document identifier \`${JSON.stringify(value)}\` is invalid. A document identifier can be of type integer or string, only composed of alphanumeric characters (a-z A-Z 0-9), hyphens (-) and underscores (_), and can not be more than 511 bytes.`,
  );
}

export class Index {
  /**
   * @param {{ uid: string, primaryKey?: string | null, createdAt?: string, updatedAt?: string, settings?: Record<string, any> }} init
   */
  constructor({ uid, primaryKey = null, createdAt, updatedAt, settings }) {
    const now = new Date().toISOString();
    this.uid = uid;
    /** @type {string | null} */
    this.primaryKey = primaryKey;
    this.createdAt = createdAt ?? now;
    this.updatedAt = updatedAt ?? now;
    this.settings = settings ?? defaultSettings();
    /** @type {Map<string, Rec>} */
    this.docs = new Map();
    /** @type {Array<Rec | undefined>} */
    this.bySeq = [];
    this.nextSeq = 0;
    /** Bumped on every change; search caches are keyed on it. */
    this.version = 0;
    /** Number of documents per top-level field (index stats). */
    /** @type {Map<string, number>} */
    this.fieldDistribution = new Map();
    /** @type {Map<string, Posting>} */
    this.postings = new Map();
    /** @type {SearchableMap<true>} term dictionary (prefix and typo lookups) */
    this.dict = new SearchableMap();
    /** @type {Map<string, number>} searchable flattened field → bit */
    this.fieldBits = new Map();
    this.searchAll = this.settings.searchableAttributes.includes('*');
    /** @type {Map<string, Array<FacetValue | undefined>>} */
    this.columns = new Map();
    /** Generation of each internal number: bumped when its document is replaced or removed. */
    this.gens = new Int32Array(1024);
  }

  /** @param {number} seq */
  bumpGen(seq) {
    if (seq >= this.gens.length) {
      const grown = new Int32Array(Math.max(this.gens.length * 2, seq + 1));
      grown.set(this.gens);
      this.gens = grown;
    }
    this.gens[seq] = /** @type {number} */ (this.gens[seq]) + 1;
  }

  resetText() {
    /** @type {Map<string, Posting>} */
    this.postings = new Map();
    /** @type {SearchableMap<true>} */
    this.dict = new SearchableMap();
    /** @type {Map<string, number>} searchable flattened field → bit */
    this.fieldBits = new Map();
    this.searchAll = this.settings.searchableAttributes.includes('*');
  }

  get size() {
    return this.docs.size;
  }

  info() {
    return { uid: this.uid, createdAt: this.createdAt, updatedAt: this.updatedAt, primaryKey: this.primaryKey };
  }

  touch() {
    this.version += 1;
    this.updatedAt = new Date().toISOString();
  }

  /** Documents in internal order. @returns {Rec[]} */
  records() {
    /** @type {Rec[]} */
    const out = [];
    for (const rec of this.bySeq) if (rec) out.push(rec);
    return out;
  }

  /**
   * A function giving the facet values of `field` for the document with internal number
   * `seq` (which must exist), cached per document.
   * @param {string} field
   * @returns {(seq: number) => FacetValue}
   */
  facetGetter(field) {
    let column = this.columns.get(field);
    if (!column) {
      // Allocated at full length: filling a sparse array out of order would turn it into a
      // slow dictionary-backed array.
      column = new Array(this.nextSeq).fill(undefined);
      this.columns.set(field, column);
    }
    const col = column;
    return (seq) => {
      let value = col[seq];
      if (value === undefined) {
        value = facetValueOf(fieldOf(/** @type {Rec} */ (this.bySeq[seq]).doc, field));
        col[seq] = value;
      }
      return value;
    };
  }

  /** The field bit for a flattened field, or -1 when it is not searchable. @param {string} field */
  fieldBit(field) {
    const known = this.fieldBits.get(field);
    if (known !== undefined) return known;
    let bit = -1;
    if (this.searchAll) bit = Math.min(this.fieldBits.size, MAX_FIELD_BIT);
    else {
      const list = /** @type {string[]} */ (this.settings.searchableAttributes);
      const rank = list.findIndex((attr) => isUnder(field, attr));
      if (rank >= 0) bit = Math.min(rank, MAX_FIELD_BIT);
    }
    this.fieldBits.set(field, bit);
    return bit;
  }

  /** The importance rank of a field bit (0 is best): the position in searchableAttributes. @param {number} bits */
  attributeRank(bits) {
    if (this.searchAll) return 0;
    return 31 - Math.clz32(bits & -bits);
  }

  /**
   * The field-bit mask of some searchable attributes (for `attributesToSearchOn` and typo
   * settings); attributes that are not searchable are ignored.
   * @param {string[]} attributes
   */
  maskOf(attributes) {
    let mask = 0;
    if (this.searchAll) {
      for (const [field, bit] of this.fieldBits) if (bit >= 0 && attributes.some((a) => isUnder(field, a))) mask |= 1 << bit;
    } else {
      const list = /** @type {string[]} */ (this.settings.searchableAttributes);
      attributes.forEach((a) => {
        const rank = list.findIndex((attr) => isUnder(a, attr));
        if (rank >= 0) mask |= 1 << Math.min(rank, MAX_FIELD_BIT);
      });
    }
    return mask;
  }

  /**
   * The searchable words of a document with, for each, its field bits and frequency.
   * @param {Rec} rec
   * @returns {Map<string, number>} word → packed (field bits << TF_BITS | term frequency)
   */
  wordsOf(rec) {
    /** @type {Map<string, number>} */
    const local = new Map();
    for (const [field, flat] of flatten(rec.doc)) {
      if (flat.leaves.length === 0) continue;
      const bit = this.fieldBit(field);
      if (bit < 0) continue;
      const fieldFlag = 1 << (bit + TF_BITS);
      for (const leaf of flat.leaves) {
        if (typeof leaf === 'boolean') continue;
        forEachWord(typeof leaf === 'number' ? String(leaf) : leaf, (word) => {
          const cur = local.get(word);
          if (cur === undefined) local.set(word, fieldFlag | 1);
          else local.set(word, (cur | fieldFlag) + ((cur & TF_MAX) < TF_MAX ? 1 : 0));
        });
      }
    }
    return local;
  }

  /** @param {Rec} rec */
  indexText(rec) {
    const local = this.wordsOf(rec);
    const seq = rec.seq;
    const gen = /** @type {number} */ (this.gens[seq]);
    for (const [word, packed] of local) {
      let posting = this.postings.get(word);
      if (!posting) {
        posting = { seqs: new Int32Array(4), packed: new Int32Array(4), gens: new Int32Array(4), length: 0, live: 0 };
        this.postings.set(word, posting);
        this.dict.set(word, true);
      }
      if (posting.length === posting.seqs.length) {
        const size = posting.length * 2;
        const seqs = new Int32Array(size);
        const packs = new Int32Array(size);
        const gens = new Int32Array(size);
        seqs.set(posting.seqs);
        packs.set(posting.packed);
        gens.set(posting.gens);
        posting.seqs = seqs;
        posting.packed = packs;
        posting.gens = gens;
      }
      posting.seqs[posting.length] = seq;
      posting.packed[posting.length] = packed;
      posting.gens[posting.length] = gen;
      posting.length += 1;
      posting.live += 1;
    }
  }

  /**
   * Drops a document's entries from the postings (lazily: they become stale). Its words are
   * found again from the document (keeping every document's word list would cost more
   * memory, and garbage-collection time, than re-reading the rare replaced document).
   * @param {Rec} rec
   */
  unindexText(rec) {
    for (const word of this.wordsOf(rec).keys()) {
      const posting = this.postings.get(word);
      if (!posting) continue;
      posting.live -= 1;
      if (posting.live <= 0) {
        this.postings.delete(word);
        this.dict.delete(word);
      } else if (posting.length > 32 && posting.live * 2 < posting.length) {
        this.compact(posting, rec.seq);
      }
    }
  }

  /**
   * Removes stale entries (and those of `dropping`, being unindexed now) from a posting.
   * @param {Posting} posting @param {number} dropping
   */
  compact(posting, dropping) {
    const { seqs, packed, gens } = posting;
    let w = 0;
    for (let i = 0; i < posting.length; i += 1) {
      const seq = /** @type {number} */ (seqs[i]);
      if (seq === dropping || gens[i] !== this.gens[seq]) continue;
      seqs[w] = seq;
      packed[w] = /** @type {number} */ (packed[i]);
      gens[w] = /** @type {number} */ (gens[i]);
      w += 1;
    }
    posting.length = w;
  }

  /** @param {Rec} rec @param {1 | -1} delta */
  countFields(rec, delta) {
    for (const key of Object.keys(rec.doc)) {
      const n = (this.fieldDistribution.get(key) ?? 0) + delta;
      if (n > 0) this.fieldDistribution.set(key, n);
      else this.fieldDistribution.delete(key);
    }
  }

  /** @param {number} seq */
  forgetFacets(seq) {
    for (const column of this.columns.values()) {
      while (column.length < seq) column.push(undefined);
      column[seq] = undefined;
    }
  }

  /**
   * Stores a document under `id` (replacing any previous one, which keeps its place).
   * @param {string} id
   * @param {Record<string, any>} doc
   */
  put(id, doc) {
    const old = this.docs.get(id);
    let seq;
    if (old) {
      this.unindexText(old);
      this.countFields(old, -1);
      seq = old.seq;
    } else {
      seq = this.nextSeq;
      this.nextSeq += 1;
    }
    this.bumpGen(seq);
    /** @type {Rec} */
    const rec = { id, seq, doc };
    this.docs.set(id, rec);
    this.bySeq[seq] = rec;
    this.forgetFacets(seq);
    this.indexText(rec);
    this.countFields(rec, 1);
  }

  /** @param {string} id @returns {boolean} whether there was such a document */
  remove(id) {
    const rec = this.docs.get(id);
    if (!rec) return false;
    this.unindexText(rec);
    this.countFields(rec, -1);
    this.bumpGen(rec.seq);
    this.docs.delete(id);
    this.bySeq[rec.seq] = undefined;
    this.forgetFacets(rec.seq);
    return true;
  }

  clear() {
    const n = this.docs.size;
    for (const rec of this.bySeq) if (rec) this.bumpGen(rec.seq);
    this.docs = new Map();
    this.bySeq = [];
    this.nextSeq = 0;
    this.fieldDistribution = new Map();
    this.columns = new Map();
    this.resetText();
    return n;
  }

  /** Rebuilds the inverted index (after searchableAttributes changed). */
  reindexText() {
    this.resetText();
    for (const rec of this.bySeq) {
      if (!rec) continue;
      this.indexText(rec);
    }
  }

  /**
   * Applies new settings; rebuilds what depends on them.
   * @param {Record<string, any>} settings
   */
  applySettings(settings) {
    const searchableChanged = JSON.stringify(settings.searchableAttributes) !== JSON.stringify(this.settings.searchableAttributes);
    this.settings = settings;
    if (searchableChanged) this.reindexText();
    this.touch();
  }

  /**
   * The primary key to use for a batch of documents: the index's, the one given with the
   * request, or the one inferred from the first document (the only field ending in `id`).
   * @param {Array<Record<string, any>>} docs
   * @param {string | null | undefined} requested
   */
  resolvePrimaryKey(docs, requested) {
    if (this.primaryKey) {
      if (requested && requested !== this.primaryKey) {
        throw new MeiliError(400, 'index_primary_key_already_exists', `Index \`${this.uid}\`: Index already has a primary key: \`${this.primaryKey}\`.`);
      }
      return this.primaryKey;
    }
    if (requested) return requested;
    const first = docs[0];
    if (!first) return null;
    const candidates = Object.keys(first).filter((k) => k.toLowerCase().endsWith('id'));
    if (candidates.length === 1) return /** @type {string} */ (candidates[0]);
    if (candidates.length === 0) {
      throw new MeiliError(
        400,
        'index_primary_key_no_candidate_found',
        `Index \`${this.uid}\`: The primary key inference failed as the engine did not find any field ending with \`id\` in its name. Please specify the primary key manually using the \`primaryKey\` query parameter.`,
      );
    }
    throw new MeiliError(
      400,
      'index_primary_key_multiple_candidates_found',
      `Index \`${this.uid}\`: The primary key inference failed as the engine found ${candidates.length} fields ending with \`id\` in their names: '${candidates[0]}' and '${candidates[1]}'. Please specify the primary key manually using the \`primaryKey\` query parameter.`,
    );
  }

  /**
   * Adds documents, replacing (`merge` false) or updating (`merge` true: top-level fields of
   * the new document over the old one) those with the same id. All documents are checked
   * before any is stored, so a bad one fails the whole batch, as in Meilisearch.
   * @param {Array<Record<string, any>>} docs
   * @param {{ primaryKey?: string | null, merge?: boolean, skipCreation?: boolean }} options
   * @returns {number} documents indexed
   */
  addDocuments(docs, { primaryKey, merge = false, skipCreation = false }) {
    const key = this.resolvePrimaryKey(docs, primaryKey);
    if (!key) return 0;
    /** @type {Array<[string, Record<string, any>]>} */
    const checked = [];
    for (const doc of docs) {
      const value = key.includes('.') ? key.split('.').reduce((/** @type {any} */ o, k) => (o && typeof o === 'object' ? o[k] : undefined), doc) : doc[key];
      if (value === undefined || value === null) {
        throw new MeiliError(400, 'missing_document_id', `Document doesn't have a \`${key}\` attribute: \`${JSON.stringify(doc)}\`.`);
      }
      checked.push([documentIdOf(value), doc]);
    }
    this.primaryKey = key;
    /** @type {Map<string, Record<string, any>>} */
    const batch = new Map();
    for (const [id, doc] of checked) {
      const previous = batch.get(id) ?? this.docs.get(id)?.doc;
      if (!previous && skipCreation) continue;
      batch.set(id, merge && previous ? { ...previous, ...doc } : doc);
    }
    for (const [id, doc] of batch) this.put(id, doc);
    this.touch();
    return batch.size;
  }

  /** @param {string[]} ids @returns {number} removed */
  deleteDocuments(ids) {
    let removed = 0;
    for (const id of ids) if (this.remove(id)) removed += 1;
    this.touch();
    return removed;
  }

  /**
   * The full snapshot written to disk.
   * @returns {object}
   */
  toJSON() {
    return {
      format: 'sequent-search-fake-index',
      version: 1,
      uid: this.uid,
      primaryKey: this.primaryKey,
      createdAt: this.createdAt,
      updatedAt: this.updatedAt,
      settings: this.settings,
      nextSeq: this.nextSeq,
      documents: this.records().map((rec) => [rec.seq, rec.doc]),
    };
  }

  /**
   * Rebuilds an index from its snapshot (the inverted index is recomputed).
   * @param {any} data
   * @param {(stored: unknown) => Record<string, any>} normalizeSettings
   */
  static fromJSON(data, normalizeSettings) {
    if (!data || data.format !== 'sequent-search-fake-index' || typeof data.uid !== 'string' || !Array.isArray(data.documents)) {
      throw new Error('not an index snapshot of the search fake');
    }
    const index = new Index({
      uid: data.uid,
      primaryKey: typeof data.primaryKey === 'string' ? data.primaryKey : null,
      createdAt: data.createdAt,
      updatedAt: data.updatedAt,
      settings: normalizeSettings(data.settings),
    });
    const key = index.primaryKey;
    // Internal numbers are renumbered densely, keeping the stored order (they are never shown).
    const entries = [...data.documents].sort((a, b) => (Array.isArray(a) && Array.isArray(b) ? a[0] - b[0] : 0));
    for (const entry of entries) {
      if (!Array.isArray(entry) || typeof entry[0] !== 'number' || !entry[1] || typeof entry[1] !== 'object') {
        throw new Error('a document entry is malformed');
      }
      const doc = entry[1];
      if (!key) throw new Error('documents without a primary key');
      const id = documentIdOf(doc[key]);
      if (index.docs.has(id)) throw new Error(`document \`${id}\` appears twice`);
      const seq = index.nextSeq;
      index.nextSeq += 1;
      /** @type {Rec} */
      const rec = { id, seq, doc };
      index.docs.set(id, rec);
      index.bySeq[seq] = rec;
      index.bumpGen(seq);
      index.indexText(rec);
      index.countFields(rec, 1);
    }
    return index;
  }
}

/** @param {unknown} body */
export function documentsPayload(body) {
  const docs = Array.isArray(body) ? body : body && typeof body === 'object' ? [body] : null;
  if (!docs) throw badRequest('malformed_payload', `The \`json\` payload provided is malformed. \`Couldn't serialize document value: invalid type: ${typeof body}, expected a sequence of documents\`.`);
  docs.forEach((doc, i) => {
    if (!doc || typeof doc !== 'object' || Array.isArray(doc)) {
      throw badRequest('malformed_payload', `The \`json\` payload provided is malformed. \`Couldn't serialize document value: invalid type: ${JSON.stringify(doc)} at index ${i}, expected a map\`.`);
    }
  });
  return /** @type {Array<Record<string, any>>} */ (docs);
}
