// @ts-check
// The fake's state: its indexes, the task queue, experimental features, and their files.
// Write operations validate what Meilisearch validates at once (answering 400 before any
// task exists) and enqueue a task for the rest, which can still fail (unknown index, bad
// document id, attribute not filterable…). Each finished task schedules a debounced write of
// what it changed; flush() writes everything now; reload() starts again from the files.
import path from 'node:path';
import { badRequest, checkIndexUid, indexNotFound, invalidType, MeiliError } from './errors.mjs';
import { FilterError, FilterTypeError, parseFilterParam } from './filter.mjs';
import { documentsPayload, Index } from './index-store.mjs';
import { selectAttributes } from './fields.mjs';
import { indexFilter, sortCriteria } from './search.mjs';
import { applySettingsUpdate, defaultSettings, normalizeStoredSettings, validateSetting } from './settings.mjs';
import { folderSize, indexFiles, readJsonOrWarn, Saver, setAside } from './storage.mjs';
import { summarize, TaskQueue } from './tasks.mjs';

/** @typedef {import('./tasks.mjs').Task} Task */

/** The experimental features the fake knows (only `containsFilter` changes behaviour). */
export const DEFAULT_FEATURES = {
  metrics: false,
  logsRoute: false,
  editDocumentsByFunction: false,
  containsFilter: false,
  network: false,
  getTaskDocumentsRoute: false,
  compositeEmbedders: false,
  chatCompletions: false,
  multimodal: false,
  vectorStoreSetting: false,
};

export class Engine {
  /** @param {{ dir: string }} options */
  constructor({ dir }) {
    this.dir = dir;
    /** @type {Map<string, Index>} */
    this.indexes = new Map();
    this.saver = new Saver();
    this.queue = new TaskQueue({ onChange: () => this.saveTasks() });
    /** @type {Record<string, boolean>} */
    this.features = { ...DEFAULT_FEATURES };
    /** @type {string | null} */
    this.lastUpdate = null;
  }

  /** @param {string} uid */
  indexFile(uid) {
    return path.join(this.dir, 'indexes', `${uid}.json`);
  }

  get tasksFile() {
    return path.join(this.dir, 'tasks.json');
  }

  get featuresFile() {
    return path.join(this.dir, 'features.json');
  }

  saveTasks() {
    this.saver.schedule(this.tasksFile, () => JSON.stringify(this.queue));
  }

  /** @param {string} uid */
  saveIndex(uid) {
    this.saver.schedule(this.indexFile(uid), () => {
      const index = this.indexes.get(uid);
      return index ? JSON.stringify(index) : null;
    });
  }

  /** Loads the folder's files (an unreadable file is set aside with a warning). */
  async load() {
    this.indexes = new Map();
    const tasks = await readJsonOrWarn(this.tasksFile, 'the task log');
    if (tasks) {
      try {
        this.queue.load(tasks);
        const finished = [...this.queue.tasks.values()].map((t) => t.finishedAt).filter(Boolean).sort();
        this.lastUpdate = finished.at(-1) ?? null;
      } catch (error) {
        await setAside(this.tasksFile, 'the task log', error);
      }
    }
    const features = await readJsonOrWarn(this.featuresFile, 'the experimental features');
    if (features && typeof features === 'object') {
      for (const key of Object.keys(DEFAULT_FEATURES)) if (typeof features[key] === 'boolean') this.features[key] = features[key];
    }
    for (const name of await indexFiles(this.dir)) {
      const file = path.join(this.dir, 'indexes', name);
      const data = await readJsonOrWarn(file, `index \`${name.slice(0, -5)}\``);
      if (!data) continue;
      try {
        const index = Index.fromJSON(data, normalizeStoredSettings);
        if (`${index.uid}.json` !== name) throw new Error(`it holds index \`${index.uid}\``);
        this.indexes.set(index.uid, index);
      } catch (error) {
        await setAside(file, `index \`${name.slice(0, -5)}\``, error);
      }
    }
  }

  /** Processes the tasks still waiting, then writes every pending file. */
  async flush() {
    await this.queue.drain();
    await this.saver.flush();
  }

  /** Drops memory and reads the files again, as a restart would (after a flush). */
  async reload() {
    await this.flush();
    this.saver.cancel();
    this.queue = new TaskQueue({ onChange: () => this.saveTasks() });
    this.features = { ...DEFAULT_FEATURES };
    this.lastUpdate = null;
    await this.load();
  }

  /** @param {string} uid @returns {Index} */
  index(uid) {
    checkIndexUid(uid);
    const index = this.indexes.get(uid);
    if (!index) throw indexNotFound(uid);
    return index;
  }

  /**
   * Enqueues a task; `run` gets the task and returns details. Index files named in
   * `touches` are saved after it ran.
   * @param {{ indexUid: string | null, type: string, details?: Record<string, any>, customMetadata?: string }} spec
   * @param {(task: Task) => Record<string, any> | void} run
   * @param {string[]} [touches]
   */
  enqueue(spec, run, touches = spec.indexUid ? [spec.indexUid] : []) {
    const task = this.queue.enqueue(spec, (t) => {
      try {
        return run(t);
      } finally {
        for (const uid of touches) this.saveIndex(uid);
        this.lastUpdate = new Date().toISOString();
      }
    });
    return summarize(task);
  }

  /**
   * @param {string} uid
   * @param {string | null} primaryKey
   * @returns {{ index: Index, created: boolean }}
   */
  indexOrCreate(uid, primaryKey = null) {
    const existing = this.indexes.get(uid);
    if (existing) return { index: existing, created: false };
    const index = new Index({ uid, primaryKey, settings: defaultSettings() });
    this.indexes.set(uid, index);
    return { index, created: true };
  }

  // ---- indexes ---------------------------------------------------------------------------

  /** @param {unknown} body */
  createIndex(body) {
    if (!body || typeof body !== 'object' || Array.isArray(body)) throw invalidType('bad_request', '', 'an object', body);
    const b = /** @type {Record<string, unknown>} */ (body);
    for (const key of Object.keys(b)) {
      if (key !== 'uid' && key !== 'primaryKey') throw badRequest('bad_request', `Unknown field \`${key}\`: expected one of \`uid\`, \`primaryKey\``);
    }
    if (b.uid === undefined) throw badRequest('missing_index_uid', 'Missing field `uid`');
    const uid = checkIndexUid(b.uid);
    const primaryKey = b.primaryKey ?? null;
    if (primaryKey !== null && typeof primaryKey !== 'string') throw invalidType('invalid_index_primary_key', '.primaryKey', 'a string', primaryKey);
    return this.enqueue({ indexUid: uid, type: 'indexCreation', details: { primaryKey } }, () => {
      if (this.indexes.has(uid)) throw new MeiliError(409, 'index_already_exists', `Index \`${uid}\` already exists.`);
      this.indexes.set(uid, new Index({ uid, primaryKey, settings: defaultSettings() }));
    });
  }

  /** @param {string} uid @param {unknown} body */
  updateIndex(uid, body) {
    checkIndexUid(uid);
    if (!body || typeof body !== 'object' || Array.isArray(body)) throw invalidType('bad_request', '', 'an object', body);
    const b = /** @type {Record<string, unknown>} */ (body);
    for (const key of Object.keys(b)) {
      if (key !== 'uid' && key !== 'primaryKey') throw badRequest('bad_request', `Unknown field \`${key}\`: expected one of \`primaryKey\`, \`uid\``);
    }
    const primaryKey = b.primaryKey;
    if (primaryKey !== undefined && primaryKey !== null && typeof primaryKey !== 'string') throw invalidType('invalid_index_primary_key', '.primaryKey', 'a string', primaryKey);
    const newUid = b.uid === undefined || b.uid === null || b.uid === uid ? null : checkIndexUid(b.uid);
    /** @type {Record<string, any>} */
    const details = { primaryKey: primaryKey ?? null };
    if (newUid) Object.assign(details, { oldIndexUid: uid, newIndexUid: newUid });
    return this.enqueue(
      { indexUid: uid, type: 'indexUpdate', details },
      () => {
        const index = this.indexes.get(uid);
        if (!index) throw indexNotFound(uid);
        if (typeof primaryKey === 'string' && primaryKey !== index.primaryKey) {
          if (index.size > 0) {
            throw new MeiliError(400, 'index_primary_key_already_exists', `Index \`${uid}\`: Index already has a primary key: \`${index.primaryKey}\`.`);
          }
          index.primaryKey = primaryKey;
        }
        if (newUid) {
          if (this.indexes.has(newUid)) throw new MeiliError(409, 'index_already_exists', `Index \`${newUid}\` already exists.`);
          this.indexes.delete(uid);
          index.uid = newUid;
          this.indexes.set(newUid, index);
        }
        index.touch();
      },
      newUid ? [uid, newUid] : [uid],
    );
  }

  /** @param {string} uid */
  deleteIndex(uid) {
    checkIndexUid(uid);
    return this.enqueue({ indexUid: uid, type: 'indexDeletion', details: { deletedDocuments: null } }, () => {
      const index = this.indexes.get(uid);
      if (!index) throw indexNotFound(uid);
      this.indexes.delete(uid);
      return { deletedDocuments: index.size };
    });
  }

  /** @param {unknown} body */
  swapIndexes(body) {
    if (!Array.isArray(body)) throw invalidType('invalid_swap_indexes', '', 'an array', body);
    /** @type {Array<{ indexes: [string, string], rename: boolean }>} */
    const swaps = [];
    /** @type {Set<string>} */
    const seen = new Set();
    body.forEach((swap, i) => {
      if (!swap || typeof swap !== 'object' || Array.isArray(swap)) throw invalidType('invalid_swap_indexes', `[${i}]`, 'an object', swap);
      for (const key of Object.keys(swap)) {
        if (key !== 'indexes' && key !== 'rename') throw badRequest('bad_request', `Unknown field \`${key}\` inside \`[${i}]\`: expected one of \`indexes\`, \`rename\``);
      }
      const list = swap.indexes;
      if (!Array.isArray(list)) throw invalidType('invalid_swap_indexes', `[${i}].indexes`, 'an array', list);
      if (list.length !== 2) throw badRequest('invalid_swap_indexes', `Invalid value at \`[${i}].indexes\`: two indexes must be given for each swap, found ${list.length}`);
      const a = checkIndexUid(list[0]);
      const b = checkIndexUid(list[1]);
      const rename = swap.rename ?? false;
      if (typeof rename !== 'boolean') throw invalidType('invalid_swap_rename', `[${i}].rename`, 'a boolean', rename);
      for (const uid of [a, b]) {
        if (seen.has(uid)) throw badRequest('invalid_swap_duplicate_index_found', `Indexes must be declared only once during a swap. \`${uid}\` was specified several times.`);
        seen.add(uid);
      }
      swaps.push({ indexes: [a, b], rename });
    });
    return this.enqueue(
      { indexUid: null, type: 'indexSwap', details: { swaps } },
      () => {
        const missing = [];
        for (const { indexes: [a, b], rename } of swaps) {
          if (!this.indexes.has(a)) missing.push(a);
          if (!rename && !this.indexes.has(b)) missing.push(b);
        }
        if (missing.length > 0) {
          throw new MeiliError(404, 'index_not_found', missing.length === 1 ? `Index \`${missing[0]}\` not found.` : `Indexes ${missing.map((m) => `\`${m}\``).join(', ')} not found.`);
        }
        for (const { indexes: [a, b], rename } of swaps) {
          if (rename && this.indexes.has(b)) throw new MeiliError(409, 'index_already_exists', `Index \`${b}\` already exists.`);
        }
        for (const { indexes: [a, b], rename } of swaps) {
          const first = /** @type {Index} */ (this.indexes.get(a));
          if (rename) {
            this.indexes.delete(a);
            first.uid = b;
            first.touch();
            this.indexes.set(b, first);
            continue;
          }
          const second = /** @type {Index} */ (this.indexes.get(b));
          first.uid = b;
          second.uid = a;
          first.touch();
          second.touch();
          this.indexes.set(a, second);
          this.indexes.set(b, first);
        }
      },
      swaps.flatMap((s) => s.indexes),
    );
  }

  // ---- documents -------------------------------------------------------------------------

  /**
   * @param {string} uid @param {unknown} body
   * @param {{ primaryKey?: string | null, merge: boolean, skipCreation?: boolean, customMetadata?: string }} options
   */
  addDocuments(uid, body, options) {
    checkIndexUid(uid);
    const docs = documentsPayload(body);
    return this.enqueue(
      { indexUid: uid, type: 'documentAdditionOrUpdate', details: { receivedDocuments: docs.length, indexedDocuments: null }, customMetadata: options.customMetadata },
      () => {
        const { index, created } = this.indexOrCreate(uid);
        try {
          const indexed = index.addDocuments(docs, { primaryKey: options.primaryKey ?? null, merge: options.merge, skipCreation: options.skipCreation });
          return { indexedDocuments: indexed };
        } catch (error) {
          // The index the batch would have created does not survive the failed batch.
          if (created) this.indexes.delete(uid);
          throw error;
        }
      },
    );
  }

  /** @param {string} uid @param {unknown[]} ids @param {string} [customMetadata] */
  deleteDocuments(uid, ids, customMetadata) {
    checkIndexUid(uid);
    const list = ids.map((id, i) => {
      if (typeof id === 'string') return id;
      if (typeof id === 'number' && Number.isSafeInteger(id)) return String(id);
      throw invalidType('bad_request', `[${i}]`, 'a string or an integer', id);
    });
    return this.enqueue({ indexUid: uid, type: 'documentDeletion', details: { providedIds: list.length, deletedDocuments: null }, customMetadata }, () => {
      const index = this.index(uid);
      return { deletedDocuments: index.deleteDocuments(list) };
    });
  }

  /** @param {string} uid @param {unknown} body @param {string} [customMetadata] */
  deleteDocumentsByFilter(uid, body, customMetadata) {
    checkIndexUid(uid);
    if (!body || typeof body !== 'object' || Array.isArray(body)) throw invalidType('bad_request', '', 'an object', body);
    const b = /** @type {Record<string, unknown>} */ (body);
    for (const key of Object.keys(b)) if (key !== 'filter') throw badRequest('bad_request', `Unknown field \`${key}\`: expected one of \`filter\``);
    if (b.filter === undefined || b.filter === null) throw badRequest('missing_document_filter', 'Missing field `filter`');
    try {
      if (!parseFilterParam(b.filter)) throw badRequest('invalid_document_filter', 'Sending an empty filter is forbidden.');
    } catch (error) {
      if (error instanceof FilterError || error instanceof FilterTypeError) throw badRequest('invalid_document_filter', error.message);
      throw error;
    }
    const filter = b.filter;
    return this.enqueue(
      { indexUid: uid, type: 'documentDeletion', details: { providedIds: 0, deletedDocuments: null, originalFilter: JSON.stringify(filter) }, customMetadata },
      () => {
        const index = this.index(uid);
        const mask = /** @type {Uint8Array} */ (indexFilter(index, filter, 'invalid_document_filter', { containsFilter: Boolean(this.features.containsFilter) }));
        const ids = index.records().filter((rec) => mask[rec.seq] === 1).map((rec) => rec.id);
        return { deletedDocuments: index.deleteDocuments(ids) };
      },
    );
  }

  /** @param {string} uid @param {string} [customMetadata] */
  deleteAllDocuments(uid, customMetadata) {
    checkIndexUid(uid);
    return this.enqueue({ indexUid: uid, type: 'documentDeletion', details: { providedIds: 0, deletedDocuments: null, originalFilter: null }, customMetadata }, () => {
      const index = this.index(uid);
      const n = index.clear();
      index.touch();
      return { deletedDocuments: n };
    });
  }

  // ---- settings --------------------------------------------------------------------------

  /** @param {string} uid @param {unknown} body */
  updateSettings(uid, body) {
    checkIndexUid(uid);
    applySettingsUpdate(body, this.indexes.get(uid)?.settings ?? defaultSettings());
    const update = /** @type {Record<string, unknown>} */ (body);
    return this.enqueue({ indexUid: uid, type: 'settingsUpdate', details: structuredClone(update) }, () => {
      const { index } = this.indexOrCreate(uid);
      index.applySettings(applySettingsUpdate(update, index.settings));
    });
  }

  /** @param {string} uid @param {string} key @param {unknown} value (null resets) */
  updateSetting(uid, key, value) {
    checkIndexUid(uid);
    validateSetting(key, value, (this.indexes.get(uid)?.settings ?? defaultSettings())[key], '');
    return this.enqueue({ indexUid: uid, type: 'settingsUpdate', details: { [key]: value } }, () => {
      const { index } = this.indexOrCreate(uid);
      index.applySettings({ ...index.settings, [key]: validateSetting(key, value, index.settings[key], '') });
    });
  }

  /** @param {string} uid */
  resetSettings(uid) {
    checkIndexUid(uid);
    const defaults = defaultSettings();
    return this.enqueue({ indexUid: uid, type: 'settingsUpdate', details: structuredClone(defaults) }, () => {
      const { index } = this.indexOrCreate(uid);
      index.applySettings(defaultSettings());
    });
  }

  // ---- tasks -----------------------------------------------------------------------------

  /** @param {URLSearchParams} params */
  requireTaskFilters(params) {
    if ([...params.keys()].length === 0) {
      throw badRequest(
        'missing_task_filters',
        'Query parameters to filter the tasks to delete are missing. Available query parameters are: `uids`, `indexUids`, `statuses`, `types`, `canceledBy`, `beforeEnqueuedAt`, `afterEnqueuedAt`, `beforeStartedAt`, `afterStartedAt`, `beforeFinishedAt`, `afterFinishedAt`.',
      );
    }
  }

  /** @param {URLSearchParams} params */
  cancelTasks(params) {
    this.requireTaskFilters(params);
    this.queue.select(params, { paging: false });
    const query = params.toString();
    return this.enqueue({ indexUid: null, type: 'taskCancelation', details: { matchedTasks: null, canceledTasks: null, originalFilter: `?${query}` } }, (task) => {
      const matched = this.queue.select(params, { paging: false });
      return { matchedTasks: matched.length, canceledTasks: this.queue.cancel(matched, task.uid) };
    }, []);
  }

  /** @param {URLSearchParams} params */
  deleteTasks(params) {
    this.requireTaskFilters(params);
    this.queue.select(params, { paging: false });
    const query = params.toString();
    return this.enqueue({ indexUid: null, type: 'taskDeletion', details: { matchedTasks: null, deletedTasks: null, originalFilter: `?${query}` } }, (task) => {
      const matched = this.queue.select(params, { paging: false }).filter((t) => t.uid !== task.uid);
      return { matchedTasks: matched.length, deletedTasks: this.queue.remove(matched) };
    }, []);
  }

  // ---- reads -----------------------------------------------------------------------------

  /**
   * Documents of an index in internal order (`GET /documents`, `POST /documents/fetch`).
   * @param {string} uid
   * @param {{ offset: number, limit: number, fields: string[] | null, filter: unknown, ids: string[] | null, sort: string[] | null }} q
   */
  fetchDocuments(uid, q) {
    const index = this.index(uid);
    const mask = q.filter === null || q.filter === undefined ? null : indexFilter(index, q.filter, 'invalid_document_filter', { containsFilter: Boolean(this.features.containsFilter) });
    let recs = q.ids
      ? q.ids
          .map((id) => index.docs.get(String(id)))
          .filter((rec) => rec !== undefined)
          .sort((a, b) => a.seq - b.seq)
      : index.records();
    if (mask) recs = recs.filter((rec) => mask[rec.seq] === 1);
    if (q.sort && q.sort.length > 0) {
      const chain = sortCriteria(index, q.sort, 'invalid_document_sort');
      recs = [...recs].sort((a, b) => {
        for (const c of chain) {
          const r = c(a.seq, b.seq);
          if (r !== 0) return r;
        }
        return a.seq - b.seq;
      });
    }
    const displayed = index.settings.displayedAttributes.includes('*') ? null : index.settings.displayedAttributes;
    const fields = q.fields && !q.fields.includes('*') ? q.fields : null;
    const results = recs.slice(q.offset, q.offset + q.limit).map((rec) => selectAttributes(selectAttributes(rec.doc, displayed), fields));
    return { results, offset: q.offset, limit: q.limit, total: recs.length };
  }

  /** @param {string} uid @param {string} id @param {string[] | null} fields */
  document(uid, id, fields) {
    const index = this.index(uid);
    const rec = index.docs.get(id);
    if (!rec) throw new MeiliError(404, 'document_not_found', `Document \`${id}\` not found.`);
    const displayed = index.settings.displayedAttributes.includes('*') ? null : index.settings.displayedAttributes;
    return selectAttributes(selectAttributes(rec.doc, displayed), fields && !fields.includes('*') ? fields : null);
  }

  /** @param {string} uid */
  isIndexing(uid) {
    return this.queue.pending.some(({ task }) => task.indexUid === uid) || [...this.queue.tasks.values()].some((t) => t.status === 'processing' && t.indexUid === uid);
  }

  /** @param {Index} index */
  indexStats(index) {
    // The documents' size is measured once per version of the index.
    const holder = /** @type {Index & { _rawSize?: { version: number, bytes: number } }} */ (index);
    if (!holder._rawSize || holder._rawSize.version !== index.version) {
      holder._rawSize = { version: index.version, bytes: index.records().reduce((sum, rec) => sum + Buffer.byteLength(JSON.stringify(rec.doc)), 0) };
    }
    const raw = holder._rawSize.bytes;
    return {
      numberOfDocuments: index.size,
      rawDocumentDbSize: raw,
      avgDocumentSize: index.size === 0 ? 0 : Math.round(raw / index.size),
      isIndexing: this.isIndexing(index.uid),
      numberOfEmbeddings: 0,
      numberOfEmbeddedDocuments: 0,
      fieldDistribution: Object.fromEntries([...index.fieldDistribution].sort((a, b) => (a[0] < b[0] ? -1 : 1))),
    };
  }

  async stats() {
    const size = await folderSize(this.dir);
    /** @type {Record<string, ReturnType<Engine['indexStats']>>} */
    const indexes = {};
    for (const uid of [...this.indexes.keys()].sort()) indexes[uid] = this.indexStats(/** @type {Index} */ (this.indexes.get(uid)));
    return { databaseSize: size, usedDatabaseSize: size, lastUpdate: this.lastUpdate, indexes };
  }

  /** @param {unknown} body */
  updateFeatures(body) {
    if (!body || typeof body !== 'object' || Array.isArray(body)) throw invalidType('bad_request', '', 'an object', body);
    for (const [key, value] of Object.entries(body)) {
      if (!(key in DEFAULT_FEATURES)) {
        throw badRequest('bad_request', `Unknown field \`${key}\`: expected one of ${Object.keys(DEFAULT_FEATURES).map((k) => `\`${k}\``).join(', ')}`);
      }
      if (value !== null && typeof value !== 'boolean') throw invalidType('bad_request', `.${key}`, 'a boolean', value);
    }
    for (const [key, value] of Object.entries(body)) if (value !== null) this.features[key] = /** @type {boolean} */ (value);
    this.saver.schedule(this.featuresFile, () => JSON.stringify(this.features));
    return { ...this.features };
  }
}

