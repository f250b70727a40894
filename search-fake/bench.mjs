#!/usr/bin/env node
// @ts-check
// Timings of the search fake on a synthetic corpus shaped like Sequent's cases: 10,000
// documents of ~15 fields (title, a ~300-character summary, a ~3,000-character body, keyword
// arrays, ~10 numbers), added through the SDK in batches of 500; then the query the app
// sends for its search page (text + numeric range filter + 5 facets, as a multi-search of 3
// queries for disjunctive facet counts), measured in-process and over HTTP with 10
// concurrent clients; then a restart from disk.
//
//   node search-fake/bench.mjs [--docs 10000] [--requests 2000]
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { Meilisearch } from 'meilisearch';
import { Engine } from './engine.mjs';
import { search, validateSearchBody } from './search.mjs';
import { folderSize } from './storage.mjs';

const args = process.argv.slice(2);
/** @param {string} name @param {number} fallback */
const arg = (name, fallback) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? Number(args[i + 1]) : fallback;
};
const DOCS = arg('docs', 10_000);
const REQUESTS = arg('requests', 2_000);
const CONCURRENCY = 10;
const API_KEY = 'bench-key';

// A deterministic generator (xorshift) so every run indexes the same corpus.
let seed = 0x2545f491;
const rand = () => {
  seed ^= seed << 13;
  seed ^= seed >>> 17;
  seed ^= seed << 5;
  return (seed >>> 0) / 4294967296;
};
/** @template T @param {T[]} list @returns {T} */
const pick = (list) => /** @type {T} */ (list[Math.floor(rand() * list.length)]);

const DOMAIN = ['hydraulic', 'jump', 'bore', 'froude', 'channel', 'sluice', 'gate', 'weir', 'basin', 'stilling', 'tidal', 'undular', 'supercritical', 'subcritical', 'conjugate', 'depth', 'energy', 'momentum', 'discharge', 'spillway', 'culvert', 'apron', 'baffle', 'roller', 'aeration', 'tailwater', 'surge', 'estuary', 'flume', 'trapezoidal'];
const SYLLABLES = ['ka', 'lo', 'mi', 'ne', 'ra', 'tu', 'po', 'se', 'di', 'fa', 'gro', 'sta', 'ven', 'hel', 'mar', 'tor', 'lin', 'cas', 'ber', 'dun', 'vel', 'quo', 'zen', 'pri'];
const VOCAB = [...DOMAIN];
while (VOCAB.length < 20_000) {
  let w = '';
  const n = 2 + Math.floor(rand() * 3);
  for (let i = 0; i < n; i += 1) w += pick(SYLLABLES);
  VOCAB.push(w);
}
/** Zipf-like: frequent words early in the list. */
const word = () => /** @type {string} */ (VOCAB[Math.floor(rand() ** 2.2 * VOCAB.length)]);
/** @param {number} chars */
const text = (chars) => {
  const out = [];
  let length = 0;
  while (length < chars) {
    const w = rand() < 0.06 ? pick(DOMAIN) : word();
    out.push(out.length % 12 === 0 ? w[0]?.toUpperCase() + w.slice(1) : w);
    length += w.length + 1;
  }
  return `${out.join(' ')}.`;
};
export const FIRMS = Array.from({ length: 20 }, (_, i) => `firm-${i}`);
const TAGS = DOMAIN.slice(0, 20);
const METHODS = ['momentum', 'energy', 'empirical', 'numerical', 'physical-model', 'field-data'];
const REGIONS = ['north', 'south', 'east', 'west', 'coastal', 'upland'];
const STATUSES = ['draft', 'in-review', 'published', 'withdrawn'];

/** One synthetic case document. @param {number} i */
export function makeDoc(i) {
  return {
    id: `case-${i}`,
    firmId: pick(FIRMS),
    title: text(60),
    summary: text(300),
    body: text(3000),
    tags: [pick(TAGS), pick(TAGS), pick(TAGS)],
    methods: [pick(METHODS), pick(METHODS)],
    region: pick(REGIONS),
    status: pick(STATUSES),
    year: 1980 + Math.floor(rand() * 45),
    froude: Math.round(rand() * 900 + 100) / 100,
    upstreamDepth: Math.round(rand() * 500) / 100,
    downstreamDepth: Math.round(rand() * 800) / 100,
    discharge: Math.round(rand() * 50_000) / 100,
    width: Math.round(rand() * 4000) / 100,
    slope: Math.round(rand() * 1000) / 100_000,
    energyLoss: Math.round(rand() * 300) / 100,
    revision: 1 + Math.floor(rand() * 12),
    updatedAt: 1_600_000_000 + Math.floor(rand() * 150_000_000),
  };
}

/** @param {number[]} samples */
function summary(samples) {
  const sorted = [...samples].sort((a, b) => a - b);
  /** @param {number} q */
  const at = (q) => /** @type {number} */ (sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]);
  const mean = sorted.reduce((a, b) => a + b, 0) / sorted.length;
  return `mean ${mean.toFixed(2)} ms, p50 ${at(0.5).toFixed(2)}, p95 ${at(0.95).toFixed(2)}, p99 ${at(0.99).toFixed(2)}, max ${at(1).toFixed(2)}`;
}

export const QUERIES = ['hydraulic jump', 'tidal bore', 'stilling basin', 'sluice gate', 'froude', 'undular bore estuary', 'spillway apron', 'conjugate depth', 'hydrualic', 'jum', 'weir flume', 'tailwater surge', 'momentum', 'energy loss', 'baffle blocks', 'trapezoidal channel', 'roller aeration', 'supercritical', 'culvert', 'discharge'];

/**
 * The app's search page request: the full filter with all facets, and one query per
 * disjunctive facet with that facet's own condition left out.
 * @param {string} q @param {string} firm
 */
export function pageQueries(q, firm) {
  const scope = `firmId = "${firm}"`;
  const range = 'froude 2 TO 6';
  const tags = 'tags IN ["jump", "bore"]';
  const region = 'region = coastal';
  const common = { indexUid: 'cases', q, limit: 20, attributesToHighlight: ['title', 'summary'], highlightPreTag: '\u0001', highlightPostTag: '\u0002', attributesToCrop: ['body:30'], attributesToRetrieve: ['id', 'title', 'summary', 'year', 'froude', 'tags'] };
  return [
    { ...common, filter: [scope, range, tags, region], facets: ['tags', 'methods', 'region', 'status', 'year'] },
    { indexUid: 'cases', q, limit: 0, filter: [scope, range, region], facets: ['tags'] },
    { indexUid: 'cases', q, limit: 0, filter: [scope, range, tags], facets: ['region'] },
  ];
}

/**
 * Starts `node search-fake/server.mjs` as its own process (as `npm start` does) on a free port.
 * @param {string} dir
 * @returns {Promise<{ url: string, stop: () => Promise<void> }>}
 */
async function spawnFake(dir) {
  const child = spawn(process.execPath, [fileURLToPath(new URL('./server.mjs', import.meta.url))], {
    env: { ...process.env, SEARCH_FAKE_DIR: dir, SEARCH_FAKE_PORT: '0', SEARCH_FAKE_API_KEY: API_KEY },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const url = await new Promise((resolve, reject) => {
    let out = '';
    child.stdout.on('data', (chunk) => {
      out += chunk;
      const m = /(http:\/\/127\.0\.0\.1:\d+)/.exec(out);
      if (m) resolve(m[1]);
    });
    child.once('exit', (code) => reject(new Error(`the fake exited (${code}): ${out}`)));
  });
  return {
    url,
    stop: () =>
      new Promise((resolve) => {
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }),
  };
}

/** Per-search time inside the fake (no HTTP): the page's 3 queries against an in-process engine. */
async function inProcess() {
  const engine = new Engine({ dir: path.join(tmpdir(), 'search-fake-bench-unused') });
  // Memory only: nothing of this run is written.
  engine.saveIndex = () => {};
  engine.saveTasks = () => {};
  engine.updateSettings('cases', SETTINGS);
  for (let i = 0; i < DOCS; i += 500) engine.addDocuments('cases', Array.from({ length: Math.min(500, DOCS - i) }, (_, j) => makeDoc(i + j)), { merge: false, primaryKey: 'id' });
  await engine.queue.drain();
  const index = engine.index('cases');
  const features = { containsFilter: false };
  /** @param {Array<Record<string, any>>} queries */
  const run = (queries) => {
    const times = [];
    for (const q of queries) {
      const { indexUid: _, ...rest } = q;
      const s = performance.now();
      search(index, validateSearchBody(rest), features);
      times.push(performance.now() - s);
    }
    return times;
  };
  for (let i = 0; i < 60; i += 1) run(pageQueries(/** @type {string} */ (QUERIES[i % QUERIES.length]), /** @type {string} */ (FIRMS[i % FIRMS.length])));
  /** @type {number[]} */
  const warm = [];
  /** @type {number[]} */
  const pages = [];
  for (let i = 0; i < 1000; i += 1) {
    const times = run(pageQueries(/** @type {string} */ (QUERIES[i % QUERIES.length]), /** @type {string} */ (FIRMS[i % FIRMS.length])));
    warm.push(...times);
    pages.push(times.reduce((a, b) => a + b, 0));
  }
  /** @type {number[]} */
  const fresh = [];
  for (let i = 0; i < 300; i += 1) fresh.push(...run(pageQueries(`${pick(DOMAIN)} ${word()}`, /** @type {string} */ (FIRMS[i % FIRMS.length])).slice(0, 1)));
  console.log(`in-process, one search of the page's kind (filters seen before): ${summary(warm)}`);
  console.log(`in-process, the page's 3 queries together: ${summary(pages)}`);
  console.log(`in-process, one search with a query never seen before: ${summary(fresh)}`);
}

const SETTINGS = {
  searchableAttributes: ['title', 'summary', 'body', 'tags', 'methods'],
  filterableAttributes: ['firmId', 'tags', 'methods', 'region', 'status', 'year', 'froude', 'upstreamDepth', 'downstreamDepth', 'discharge'],
  sortableAttributes: ['year', 'updatedAt', 'froude'],
};

async function main() {
  console.log(`search fake bench: ${DOCS} documents, node ${process.version}`);
  await inProcess();
  const dir = await mkdtemp(path.join(tmpdir(), 'search-fake-bench-'));
  try {
    let fake = await spawnFake(dir);
    let client = new Meilisearch({ host: fake.url, apiKey: API_KEY });
    await client.createIndex('cases', { primaryKey: 'id' }).waitTask();
    await client.index('cases').updateSettings(SETTINGS).waitTask();

    let t = performance.now();
    const docs = Array.from({ length: DOCS }, (_, i) => makeDoc(i));
    const generateMs = performance.now() - t;
    t = performance.now();
    const summaries = await Promise.all(client.index('cases').addDocumentsInBatches(docs, 500));
    const tasks = await client.tasks.waitForTasks(summaries, { timeout: 120_000, interval: 50 });
    const addMs = performance.now() - t;
    const failed = tasks.filter((task) => task.status !== 'succeeded');
    if (failed.length > 0) throw new Error(`${failed.length} batches failed: ${JSON.stringify(failed[0]?.error)}`);
    console.log(`over HTTP (fake in its own process): add ${DOCS} docs in ${summaries.length} batches of 500 and wait for every task: ${(addMs / 1000).toFixed(2)} s (generating them: ${(generateMs / 1000).toFixed(2)} s)`);

    /** @param {number} i */
    const pageRequest = (i) => client.multiSearch({ queries: pageQueries(/** @type {string} */ (QUERIES[i % QUERIES.length]), pick(FIRMS)) });
    for (let i = 0; i < 100; i += 1) await pageRequest(i);
    /** @type {number[]} */
    const sequential = [];
    for (let i = 0; i < 300; i += 1) {
      const s = performance.now();
      await pageRequest(i);
      sequential.push(performance.now() - s);
    }
    console.log(`page multi-search (3 queries) over HTTP, one client: ${summary(sequential)}`);

    /** @type {number[]} */
    const concurrent = [];
    let next = 0;
    t = performance.now();
    await Promise.all(
      Array.from({ length: CONCURRENCY }, async () => {
        while (next < REQUESTS) {
          const i = next;
          next += 1;
          const s = performance.now();
          await pageRequest(i);
          concurrent.push(performance.now() - s);
        }
      }),
    );
    const wall = performance.now() - t;
    console.log(`page multi-search over HTTP, ${CONCURRENCY} concurrent clients, ${REQUESTS} requests: ${summary(concurrent)} (${Math.round(REQUESTS / (wall / 1000))} pages/s)`);

    /** @type {number[]} */
    const fresh = [];
    for (let i = 0; i < 100; i += 1) {
      const s = performance.now();
      await client.multiSearch({ queries: pageQueries(`${pick(DOMAIN)} ${word()}`, pick(FIRMS)) });
      fresh.push(performance.now() - s);
    }
    console.log(`page multi-search over HTTP with a query never seen before, one client: ${summary(fresh)}`);

    /** @type {number[]} */
    const sorted = [];
    for (let i = 0; i < 100; i += 1) {
      const s = performance.now();
      await client.index('cases').search('', { filter: `firmId = "${pick(FIRMS)}"`, sort: ['updatedAt:desc'], facets: ['tags', 'status'], limit: 20 });
      sorted.push(performance.now() - s);
    }
    console.log(`placeholder search sorted by updatedAt, firm filter, 2 facets, over HTTP: ${summary(sorted)}`);

    t = performance.now();
    await fake.stop();
    const stopMs = performance.now() - t;
    const bytes = await folderSize(dir);
    t = performance.now();
    fake = await spawnFake(dir);
    client = new Meilisearch({ host: fake.url, apiKey: API_KEY });
    const after = await client.index('cases').search('hydraulic jump', { limit: 1 });
    const startMs = performance.now() - t;
    console.log(`stop (SIGTERM, flush) ${(stopMs / 1000).toFixed(2)} s, files ${(bytes / 1e6).toFixed(1)} MB, start again from disk and answer a search ${(startMs / 1000).toFixed(2)} s, ${after.estimatedTotalHits} hits for "hydraulic jump" after the restart`);
    await fake.stop();
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) await main();
