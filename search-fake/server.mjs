#!/usr/bin/env node
// @ts-check
// The local stand-in for a Meilisearch server: the part of Meilisearch's HTTP API that the
// official `meilisearch` SDK (0.62) calls, on loopback, so Sequent can talk to it through
// the SDK exactly as it would to a real server. Indexes, documents, settings, asynchronous
// tasks, search with filters, sorting, facets, highlighting and cropping, multi-search and
// index swaps; state persisted under a folder and kept across restarts. See README.md for
// what is implemented, what is not, and the storage format.
//
// Every route but `GET /health` needs `Authorization: Bearer <apiKey>` (like a Meilisearch
// started with a master key): a missing header answers 401 `missing_authorization_header`,
// a wrong key 403 `invalid_api_key`. Every answer, errors included, is JSON.
//
// Test-only control routes (only with `control: true` or SEARCH_FAKE_CONTROL=on, and with
// the API key too):
//   POST /_fake/outage  {"down": true|false}  while down, every other request has its socket
//                                             destroyed (the SDK sees a network error, as
//                                             with a stopped server)
//   POST /_fake/reload                        processes waiting tasks, writes the files, drops
//                                             memory and loads the folder again (a restart)
//   GET  /_fake/state                         {"down": bool, "indexes": [...], "pendingTasks": n}
//
// Started by `npm start` (as a process) and by tests (programmatically, through
// startSearchFake). Never for production: it is an in-memory toy with one key.
import { timingSafeEqual } from 'node:crypto';
import { mkdir } from 'node:fs/promises';
import http from 'node:http';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Engine } from './engine.mjs';
import { badRequest, checkIndexUid, errorBody, errorStatus, invalidType, MeiliError } from './errors.mjs';
import { search, searchParamsFromQuery, validateSearchBody } from './search.mjs';
import { SETTING_ROUTES } from './settings.mjs';
import { listenOn } from '../scripts/lib/ports.mjs';

const HOST = '127.0.0.1';
const MAX_PAYLOAD = 100 * 1024 * 1024;
const VERSION = { commitSha: 'sequent-search-fake', commitDate: '2025-01-01T00:00:00Z', pkgVersion: '1.16.0' };

/**
 * @typedef {object} SearchFake
 * @property {string} url       e.g. http://127.0.0.1:54332 (give it to the SDK as `host`)
 * @property {number} port
 * @property {string} apiKey    the key every request but /health must carry
 * @property {string} dir       where the state is stored
 * @property {() => Promise<void>} stop     processes waiting tasks, writes the files, closes every connection
 * @property {() => Promise<void>} flush    processes waiting tasks and writes the files now
 * @property {(down: boolean) => void} setOutage  programmatic form of POST /_fake/outage
 * @property {() => Promise<void>} reload   programmatic form of POST /_fake/reload
 */

/**
 * @typedef {object} Request
 * @property {string} method
 * @property {string[]} params   decoded path parameters
 * @property {URLSearchParams} query
 * @property {unknown} body      parsed JSON (or documents), undefined when there was none
 * @property {string} contentType
 */

/** @typedef {'none' | 'json' | 'optional' | 'documents'} BodyKind */

/**
 * @typedef {object} Route
 * @property {string} method
 * @property {RegExp} pattern
 * @property {BodyKind} body
 * @property {(r: Request) => unknown | Promise<unknown>} handle  returns the JSON answer (status 200)
 * @property {number} [status]  status of a successful answer (202 for enqueued tasks)
 */

/** @param {http.ServerResponse} res @param {number} status @param {unknown} body */
function sendJson(res, status, body) {
  const text = JSON.stringify(body);
  res.writeHead(status, { 'content-type': 'application/json', 'content-length': Buffer.byteLength(text) });
  res.end(text);
}

/** @param {http.IncomingMessage} req @returns {Promise<Buffer>} */
function readBody(req) {
  return new Promise((resolve, reject) => {
    /** @type {Buffer[]} */
    const chunks = [];
    let size = 0;
    req.on('data', (/** @type {Buffer} */ chunk) => {
      size += chunk.length;
      if (size > MAX_PAYLOAD) {
        reject(new MeiliError(413, 'payload_too_large', 'The provided payload reached the size limit. The maximum accepted payload size is 100 MiB.'));
        req.destroy();
        return;
      }
      chunks.push(chunk);
    });
    req.on('end', () => resolve(Buffer.concat(chunks)));
    req.on('error', reject);
  });
}

/**
 * @param {Buffer} raw @param {BodyKind} kind @param {string} contentType
 * @returns {unknown}
 */
function parseBody(raw, kind, contentType) {
  const text = raw.toString('utf8');
  if (kind === 'none') return undefined;
  if (text.trim() === '') {
    if (kind === 'optional') return undefined;
    throw badRequest('missing_payload', `A ${kind === 'documents' && contentType.includes('ndjson') ? 'ndjson' : 'json'} payload is missing.`);
  }
  if (kind === 'documents') {
    if (contentType.startsWith('application/x-ndjson')) {
      try {
        return text
          .split(/\r?\n/)
          .filter((line) => line.trim() !== '')
          .map((line) => JSON.parse(line));
      } catch (error) {
        throw badRequest('malformed_payload', `The \`ndjson\` payload provided is malformed. \`${error instanceof Error ? error.message : error}\`.`);
      }
    }
    if (contentType !== '' && !contentType.startsWith('application/json')) {
      throw new MeiliError(
        415,
        'invalid_content_type',
        `The Content-Type \`${contentType}\` is invalid. Accepted values for the Content-Type header are: \`application/json\`, \`application/x-ndjson\` (the search fake does not read CSV).`,
      );
    }
    try {
      return JSON.parse(text);
    } catch (error) {
      throw badRequest('malformed_payload', `The \`json\` payload provided is malformed. \`${error instanceof Error ? error.message : error}\`.`);
    }
  }
  try {
    return JSON.parse(text);
  } catch (error) {
    throw badRequest('bad_request', `Json deserialize error: ${error instanceof Error ? error.message : error}`);
  }
}

/** @param {URLSearchParams} query @param {string} name @param {string} code @param {number} fallback */
function queryCount(query, name, code, fallback) {
  const raw = query.get(name);
  if (raw === null) return fallback;
  if (!/^\d+$/.test(raw)) throw badRequest(code, `Invalid value in parameter \`${name}\`: could not parse \`${raw}\` as a positive integer`);
  return Number(raw);
}

/** @param {URLSearchParams} query @param {string[]} allowed */
function onlyParams(query, allowed) {
  for (const key of query.keys()) {
    if (!allowed.includes(key)) throw badRequest('bad_request', `Unknown parameter \`${key}\`: expected one of ${allowed.map((a) => `\`${a}\``).join(', ')}`);
  }
}

/** Task options every document write accepts. @param {URLSearchParams} query */
function customMetadata(query) {
  return query.get('customMetadata') ?? undefined;
}

/**
 * The routes, in the SDK's terms.
 * @param {Engine} engine
 * @param {{ control: boolean, setOutage: (down: boolean) => void, isDown: () => boolean }} control
 * @returns {Route[]}
 */
function routes(engine, control) {
  const uid = '([^/]+)';
  /** @param {string} method @param {string} pattern @param {BodyKind} body @param {Route['handle']} handle @param {number} [status] @returns {Route} */
  const r = (method, pattern, body, handle, status = 200) => ({ method, pattern: new RegExp(`^${pattern}$`), body, handle, status });
  const features = () => ({ containsFilter: Boolean(engine.features.containsFilter) });
  /** @param {string} id */
  const idx = (id) => engine.index(id);

  /** @type {Route[]} */
  const list = [
    r('GET', '/health', 'none', () => ({ status: 'available' })),
    r('GET', '/version', 'none', () => VERSION),
    r('GET', '/stats', 'none', () => engine.stats()),

    r('GET', '/indexes', 'none', ({ query }) => {
      onlyParams(query, ['offset', 'limit']);
      const offset = queryCount(query, 'offset', 'invalid_index_offset', 0);
      const limit = queryCount(query, 'limit', 'invalid_index_limit', 20);
      const all = [...engine.indexes.values()].sort((a, b) => (a.uid < b.uid ? -1 : 1)).map((i) => i.info());
      return { results: all.slice(offset, offset + limit), offset, limit, total: all.length };
    }),
    r('POST', '/indexes', 'json', ({ body }) => engine.createIndex(body), 202),
    r('GET', `/indexes/${uid}`, 'none', ({ params }) => idx(/** @type {string} */ (params[0])).info()),
    r('PATCH', `/indexes/${uid}`, 'json', ({ params, body }) => engine.updateIndex(/** @type {string} */ (params[0]), body), 202),
    r('DELETE', `/indexes/${uid}`, 'none', ({ params }) => engine.deleteIndex(/** @type {string} */ (params[0])), 202),
    r('GET', `/indexes/${uid}/stats`, 'none', ({ params }) => engine.indexStats(idx(/** @type {string} */ (params[0])))),
    r('POST', '/swap-indexes', 'json', ({ body }) => engine.swapIndexes(body), 202),

    r('GET', `/indexes/${uid}/settings`, 'none', ({ params }) => idx(/** @type {string} */ (params[0])).settings),
    r('PATCH', `/indexes/${uid}/settings`, 'json', ({ params, body }) => engine.updateSettings(/** @type {string} */ (params[0]), body), 202),
    r('DELETE', `/indexes/${uid}/settings`, 'none', ({ params }) => engine.resetSettings(/** @type {string} */ (params[0])), 202),

    r('GET', `/indexes/${uid}/documents`, 'none', ({ params, query }) => {
      onlyParams(query, ['offset', 'limit', 'fields', 'filter', 'ids', 'sort', 'retrieveVectors']);
      /** @param {string} name */
      const csv = (name) => {
        const raw = query.get(name);
        return raw === null ? null : raw.split(',').map((s) => s.trim()).filter(Boolean);
      };
      return engine.fetchDocuments(/** @type {string} */ (params[0]), {
        offset: queryCount(query, 'offset', 'invalid_document_offset', 0),
        limit: queryCount(query, 'limit', 'invalid_document_limit', 20),
        fields: csv('fields'),
        filter: query.get('filter'),
        ids: csv('ids'),
        sort: csv('sort'),
      });
    }),
    r('POST', `/indexes/${uid}/documents/fetch`, 'optional', ({ params, body }) => {
      const b = /** @type {Record<string, any>} */ (body ?? {});
      if (typeof b !== 'object' || Array.isArray(b)) throw invalidType('bad_request', '', 'an object', b);
      for (const key of Object.keys(b)) {
        if (!['offset', 'limit', 'fields', 'filter', 'ids', 'sort', 'retrieveVectors'].includes(key)) {
          throw badRequest('bad_request', `Unknown field \`${key}\`: expected one of \`offset\`, \`limit\`, \`fields\`, \`retrieveVectors\`, \`ids\`, \`filter\`, \`sort\``);
        }
      }
      /** @param {string} key @param {string} code @param {number} fallback */
      const n = (key, code, fallback) => {
        const v = b[key];
        if (v === undefined || v === null) return fallback;
        if (typeof v !== 'number' || !Number.isInteger(v) || v < 0) throw invalidType(code, `.${key}`, 'a positive integer', v);
        return v;
      };
      /** @param {string} key @param {string} code */
      const strings = (key, code) => {
        const v = b[key];
        if (v === undefined || v === null) return null;
        if (!Array.isArray(v)) throw invalidType(code, `.${key}`, 'an array', v);
        return v.map(String);
      };
      return engine.fetchDocuments(/** @type {string} */ (params[0]), {
        offset: n('offset', 'invalid_document_offset', 0),
        limit: n('limit', 'invalid_document_limit', 20),
        fields: strings('fields', 'invalid_document_fields'),
        filter: b.filter ?? null,
        ids: strings('ids', 'invalid_document_ids'),
        sort: strings('sort', 'invalid_document_sort'),
      });
    }),
    r('POST', `/indexes/${uid}/documents`, 'documents', (req) => addDocuments(engine, req, false), 202),
    r('PUT', `/indexes/${uid}/documents`, 'documents', (req) => addDocuments(engine, req, true), 202),
    r('DELETE', `/indexes/${uid}/documents`, 'none', ({ params, query }) => engine.deleteAllDocuments(/** @type {string} */ (params[0]), customMetadata(query)), 202),
    r(
      'POST',
      `/indexes/${uid}/documents/delete-batch`,
      'json',
      ({ params, body, query }) => {
        if (!Array.isArray(body)) throw invalidType('bad_request', '', 'an array', body);
        return engine.deleteDocuments(/** @type {string} */ (params[0]), body, customMetadata(query));
      },
      202,
    ),
    r('POST', `/indexes/${uid}/documents/delete`, 'json', ({ params, body, query }) => engine.deleteDocumentsByFilter(/** @type {string} */ (params[0]), body, customMetadata(query)), 202),
    r('GET', `/indexes/${uid}/documents/([^/]+)`, 'none', ({ params, query }) => {
      onlyParams(query, ['fields', 'retrieveVectors']);
      const fields = query.get('fields');
      return engine.document(/** @type {string} */ (params[0]), /** @type {string} */ (params[1]), fields === null ? null : fields.split(',').map((s) => s.trim()));
    }),
    r('DELETE', `/indexes/${uid}/documents/([^/]+)`, 'none', ({ params, query }) => engine.deleteDocuments(/** @type {string} */ (params[0]), [params[1]], customMetadata(query)), 202),

    r('POST', `/indexes/${uid}/search`, 'optional', ({ params, body }) => search(idx(/** @type {string} */ (params[0])), validateSearchBody(body ?? {}), features())),
    r('GET', `/indexes/${uid}/search`, 'none', ({ params, query }) => search(idx(/** @type {string} */ (params[0])), searchParamsFromQuery(query), features())),
    r('POST', '/multi-search', 'json', ({ body }) => multiSearch(engine, body, features())),

    r('GET', '/tasks', 'none', ({ query }) => engine.queue.list(query)),
    r('POST', '/tasks/cancel', 'optional', ({ query }) => engine.cancelTasks(query), 202),
    r('DELETE', '/tasks', 'none', ({ query }) => engine.deleteTasks(query), 202),
    r('GET', '/tasks/([^/]+)', 'none', ({ params }) => {
      const raw = /** @type {string} */ (params[0]);
      if (!/^\d+$/.test(raw)) throw badRequest('invalid_task_uids', `Invalid value in parameter \`taskUid\`: could not parse \`${raw}\` as a positive integer`);
      return engine.queue.get(Number(raw));
    }),

    r('GET', '/experimental-features', 'none', () => ({ ...engine.features })),
    r('PATCH', '/experimental-features', 'json', ({ body }) => engine.updateFeatures(body)),
  ];

  for (const [name, { key, method }] of Object.entries(SETTING_ROUTES)) {
    const pattern = `/indexes/${uid}/settings/${name}`;
    list.push(r('GET', pattern, 'none', ({ params }) => idx(/** @type {string} */ (params[0])).settings[key]));
    list.push(r(method, pattern, 'json', ({ params, body }) => engine.updateSetting(/** @type {string} */ (params[0]), key, body), 202));
    list.push(r('DELETE', pattern, 'none', ({ params }) => engine.updateSetting(/** @type {string} */ (params[0]), key, null), 202));
  }

  if (control.control) {
    list.push(
      r('POST', '/_fake/outage', 'json', ({ body }) => {
        const down = /** @type {Record<string, unknown>} */ (body)?.down;
        if (typeof down !== 'boolean') throw invalidType('bad_request', '.down', 'a boolean', down);
        control.setOutage(down);
        return { down };
      }),
      r('POST', '/_fake/reload', 'optional', async () => {
        await engine.reload();
        return { reloaded: true, indexes: [...engine.indexes.keys()].sort() };
      }),
      r('GET', '/_fake/state', 'none', () => ({ down: control.isDown(), indexes: [...engine.indexes.keys()].sort(), pendingTasks: engine.queue.pending.length })),
    );
  }
  return list;
}

/** @param {Engine} engine @param {Request} req @param {boolean} merge */
function addDocuments(engine, { params, query, body }, merge) {
  onlyParams(query, ['primaryKey', 'csvDelimiter', 'customMetadata', 'skipCreation']);
  const skip = query.get('skipCreation');
  if (skip !== null && skip !== 'true' && skip !== 'false') {
    throw badRequest('invalid_skip_creation', `Invalid value in parameter \`skipCreation\`: could not parse \`${skip}\` as a boolean, expected either \`true\` or \`false\``);
  }
  return engine.addDocuments(/** @type {string} */ (params[0]), body, {
    primaryKey: query.get('primaryKey'),
    merge,
    skipCreation: skip === 'true',
    customMetadata: customMetadata(query),
  });
}

/**
 * `POST /multi-search` (non-federated): every query is checked and run; an error in one
 * fails the request, its message prefixed with the query's place, as in Meilisearch.
 * @param {Engine} engine @param {unknown} body @param {{ containsFilter: boolean }} features
 */
function multiSearch(engine, body, features) {
  if (!body || typeof body !== 'object' || Array.isArray(body)) throw invalidType('bad_request', '', 'an object', body);
  const b = /** @type {Record<string, unknown>} */ (body);
  for (const key of Object.keys(b)) {
    if (key !== 'queries' && key !== 'federation') throw badRequest('bad_request', `Unknown field \`${key}\`: expected one of \`queries\`, \`federation\``);
  }
  if (b.federation !== undefined && b.federation !== null) {
    throw badRequest('bad_request', 'The search fake does not implement federated multi-search (`federation`).');
  }
  if (!Array.isArray(b.queries)) throw invalidType('bad_request', '.queries', 'an array', b.queries);
  const results = b.queries.map((query, i) => {
    try {
      const q = /** @type {Record<string, unknown>} */ (query);
      if (!q || typeof q !== 'object' || Array.isArray(q)) throw invalidType('bad_request', '', 'an object', q);
      if (q.indexUid === undefined) throw badRequest('missing_index_uid', 'Missing field `indexUid`');
      if ('federationOptions' in q) throw badRequest('invalid_multi_search_federation_options', 'Using `federationOptions` is not allowed in a non-federated search.');
      const indexUid = checkIndexUid(q.indexUid);
      const { indexUid: _ignored, ...rest } = q;
      const params = validateSearchBody(rest);
      return { indexUid, ...search(engine.index(indexUid), params, features) };
    } catch (error) {
      if (error instanceof MeiliError) throw new MeiliError(error.status, error.code, `Inside \`.queries[${i}]\`: ${error.message}`, error.type);
      throw error;
    }
  });
  return { results };
}

/** @param {unknown} a @param {string} b */
function sameKey(a, b) {
  if (typeof a !== 'string') return false;
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

/** @param {import('node:net').Server} server @param {number} port */
const listen = (server, port) => listenOn(server, port, HOST);

/**
 * Starts the fake on loopback (port 0 picks a free port), keeping its state in `dir`
 * (created if missing; what is there is loaded, so a restart loses nothing that was
 * flushed). `apiKey` is required. With `control`, the test-only `/_fake/*` routes exist.
 * @param {{ dir: string, port?: number, apiKey: string, control?: boolean }} options
 * @returns {Promise<SearchFake>}
 */
export async function startSearchFake({ dir, port = 0, apiKey, control = false }) {
  if (typeof apiKey !== 'string' || apiKey === '') throw new Error('The search fake needs an API key (apiKey / SEARCH_FAKE_API_KEY).');
  await mkdir(dir, { recursive: true });
  const engine = new Engine({ dir });
  await engine.load();

  let down = false;
  const table = routes(engine, { control, setOutage: (d) => (down = d), isDown: () => down });

  const server = http.createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://localhost');
    const pathname = url.pathname.length > 1 ? url.pathname.replace(/\/+$/, '') : url.pathname;
    if (down && !pathname.startsWith('/_fake/')) {
      req.socket.destroy();
      return;
    }
    handle(req, res, pathname, url.searchParams).catch((error) => {
      if (!(error instanceof MeiliError)) console.error('search fake: request failed:', error);
      if (!res.headersSent) sendJson(res, errorStatus(error), errorBody(error));
      else res.destroy();
    });
  });
  server.keepAliveTimeout = 5_000;

  /**
   * @param {http.IncomingMessage} req @param {http.ServerResponse} res
   * @param {string} pathname @param {URLSearchParams} query
   */
  async function handle(req, res, pathname, query) {
    const method = req.method ?? 'GET';
    const matching = table.filter((route) => route.pattern.test(pathname));
    const route = matching.find((rt) => rt.method === method);
    if (!route) {
      // Drain what was sent so the connection stays usable.
      await readBody(req).catch(() => Buffer.alloc(0));
      if (matching.length > 0) {
        throw new MeiliError(405, 'method_not_allowed', `Method \`${method}\` is not allowed on \`${pathname}\`; allowed: ${[...new Set(matching.map((m) => m.method))].join(', ')}.`);
      }
      throw new MeiliError(404, 'not_found', `The search fake has no route \`${method} ${pathname}\`.`);
    }
    if (!(method === 'GET' && pathname === '/health')) {
      const header = req.headers.authorization;
      if (!header) {
        await readBody(req).catch(() => Buffer.alloc(0));
        throw new MeiliError(401, 'missing_authorization_header', 'The Authorization header is missing. It must use the bearer authorization method.', 'auth');
      }
      const m = /^Bearer\s+(.*)$/i.exec(header);
      if (!m || !sameKey(m[1]?.trim(), apiKey)) {
        await readBody(req).catch(() => Buffer.alloc(0));
        throw new MeiliError(403, 'invalid_api_key', 'The provided API key is invalid.', 'auth');
      }
    }
    const raw = await readBody(req);
    const contentType = String(req.headers['content-type'] ?? '').toLowerCase();
    const body = parseBody(raw, route.body, contentType);
    const params = /** @type {string[]} */ (route.pattern.exec(pathname)?.slice(1) ?? []).map((p) => {
      try {
        return decodeURIComponent(p);
      } catch {
        return p;
      }
    });
    const answer = await route.handle({ method, params, query, body, contentType });
    sendJson(res, route.status ?? 200, answer);
  }

  const bound = await listen(server, port);
  let stopped = false;
  return {
    url: `http://${HOST}:${bound}`,
    port: bound,
    apiKey,
    dir,
    async stop() {
      if (stopped) return;
      stopped = true;
      const closed = new Promise((resolve) => server.close(() => resolve(null)));
      server.closeAllConnections();
      await closed;
      await engine.flush();
    },
    flush: () => engine.flush(),
    setOutage(value) {
      down = value;
    },
    reload: () => engine.reload(),
  };
}

// As a process: `node search-fake/server.mjs` (folder, port and key from the environment).
if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const apiKey = process.env.SEARCH_FAKE_API_KEY ?? '';
  if (apiKey === '') {
    console.error('The search fake needs an API key: set SEARCH_FAKE_API_KEY (every request but GET /health must send it as "Authorization: Bearer <key>").');
    process.exit(1);
  }
  const dir = path.resolve(process.env.SEARCH_FAKE_DIR ?? path.join(process.cwd(), '.data', 'search'));
  const fake = await startSearchFake({
    dir,
    port: Number(process.env.SEARCH_FAKE_PORT ?? 54332),
    apiKey,
    control: process.env.SEARCH_FAKE_CONTROL === 'on',
  }).catch((/** @type {unknown} */ error) => {
    console.error(`The search fake could not start: ${error instanceof Error ? error.message : error}`);
    process.exit(1);
  });
  console.log(`Search fake (Meilisearch API): ${fake.url}, state in ${dir}${process.env.SEARCH_FAKE_CONTROL === 'on' ? ', test-only control routes on' : ''}`);
  let stopping = false;
  for (const signal of ['SIGINT', 'SIGTERM']) {
    process.on(signal, () => {
      if (stopping) return;
      stopping = true;
      fake.stop().then(
        () => process.exit(0),
        (error) => {
          console.error('search fake: could not stop cleanly:', error);
          process.exit(1);
        },
      );
    });
  }
}
