/**
 * The search fake's state on disk and its test-only control routes: a stop and a start
 * (or POST /_fake/reload) give back the same indexes, settings, documents, search results
 * and task log; unreadable files are set aside with a warning; an outage makes the SDK
 * fail as with a stopped server, then it works again; run as a process it needs its key
 * and stops cleanly on SIGTERM.
 */
import { spawn } from 'node:child_process';
import { mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { MeilisearchRequestError } from 'meilisearch';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { API_KEY, apiError, clientFor, idsOf, startFake, succeeded, type FakeHandle } from './fake';

const SERVER = fileURLToPath(new URL('../../search-fake/server.mjs', import.meta.url));

const handles: FakeHandle[] = [];
afterEach(async () => {
  while (handles.length > 0) await handles.pop()?.cleanup();
  vi.restoreAllMocks();
});

async function fresh(options: { dir?: string; control?: boolean } = {}) {
  const h = await startFake(options);
  handles.push(h);
  return h;
}

/** Fills an index the way the app would, and returns what a few searches give. */
async function seed(h: FakeHandle) {
  const index = h.client.index('cases');
  succeeded(await index.updateSettings({ searchableAttributes: ['title', 'body'], filterableAttributes: ['firmId', 'year'], sortableAttributes: ['year'] }).waitTask());
  const docs = Array.from({ length: 60 }, (_, i) => ({
    id: `case-${i}`,
    firmId: `firm-${i % 3}`,
    title: i % 2 === 0 ? `Hydraulic jump study ${i}` : `Tidal bore note ${i}`,
    body: `Measured depth ${i} upstream and downstream.`,
    year: 1990 + (i % 30),
  }));
  const tasks = await h.client.tasks.waitForTasks(await Promise.all(index.addDocumentsInBatches(docs, 20, { primaryKey: 'id' })));
  tasks.forEach(succeeded);
  return snapshot(h);
}

async function snapshot(h: FakeHandle) {
  const index = h.client.index('cases');
  return {
    settings: await index.getSettings(),
    jump: await index.search('hydraulic jum', { filter: 'firmId = firm-0', sort: ['year:desc'], facets: ['year'], attributesToHighlight: ['title'] }),
    all: idsOf((await index.search('', { limit: 100 })).hits),
    documents: await index.getDocuments({ limit: 100 }),
    tasks: (await h.client.tasks.getTasks({ limit: 100 })).results.map((t) => [t.uid, t.status, t.type]),
  };
}

/** Search answers minus the time they took. */
const comparable = (s: Awaited<ReturnType<typeof snapshot>>) => ({ ...s, jump: { ...s.jump, processingTimeMs: 0 } });

async function control(h: FakeHandle, route: string, body?: unknown, key: string | null = API_KEY) {
  const res = await fetch(`${h.fake.url}/_fake/${route}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', ...(key ? { authorization: `Bearer ${key}` } : {}) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  return { status: res.status, body: (await res.json()) as Record<string, unknown> };
}

describe('persistence', () => {
  it('gives the same state after a stop and a start on the same folder', async () => {
    const first = await fresh();
    const before = await seed(first);
    expect(before.jump.estimatedTotalHits).toBe(10);
    await first.fake.stop();
    const files = await readdir(path.join(first.dir, 'indexes'));
    expect(files).toEqual(['cases.json']);
    expect((await readdir(first.dir)).filter((f) => f.includes('.tmp-'))).toEqual([]);

    const second = await fresh({ dir: first.dir });
    const after = await snapshot(second);
    expect(comparable(after)).toEqual(comparable(before));
    const next = await second.client.index('cases').addDocuments([{ id: 'case-new', firmId: 'firm-0', title: 'Hydraulic jump', year: 2030 }]).waitTask();
    expect(next.uid).toBeGreaterThan(Math.max(...before.tasks.map((t) => t[0] as number)));
    expect(idsOf((await second.client.index('cases').search('hydraulic', { filter: 'firmId = firm-0', sort: ['year:desc'], limit: 1 })).hits)).toEqual(['case-new']);
  });

  it('gives the same state after POST /_fake/reload (with the key)', async () => {
    const h = await fresh();
    const before = await seed(h);
    expect(await control(h, 'reload', undefined, null)).toMatchObject({ status: 401, body: { code: 'missing_authorization_header' } });
    expect(await control(h, 'reload')).toEqual({ status: 200, body: { reloaded: true, indexes: ['cases'] } });
    expect(comparable(await snapshot(h))).toEqual(comparable(before));
  });

  it('remembers deletions, swaps and experimental features', async () => {
    const first = await fresh();
    await seed(first);
    await first.client.index('cases').deleteDocuments({ filter: 'firmId = firm-1' }).waitTask();
    await first.client.index('other').addDocuments([{ id: 1, title: 'other' }]).waitTask();
    succeeded(await first.client.swapIndexes([{ indexes: ['cases', 'other'], rename: false }]).waitTask());
    await first.client.deleteIndex('cases').waitTask();
    await first.client.updateExperimentalFeatures({ containsFilter: true });
    await first.fake.stop();
    const second = await fresh({ dir: first.dir });
    expect((await second.client.getRawIndexes()).results.map((i) => i.uid)).toEqual(['other']);
    expect((await second.client.index('other').getDocuments({ limit: 100 })).total).toBe(40);
    expect((await second.client.getExperimentalFeatures()).containsFilter).toBe(true);
  });

  it('writes whole JSON files that name their format', async () => {
    const h = await fresh();
    await seed(h);
    await h.fake.flush();
    const snapshot = JSON.parse(await readFile(path.join(h.dir, 'indexes', 'cases.json'), 'utf8'));
    expect(snapshot).toMatchObject({ format: 'sequent-search-fake-index', version: 1, uid: 'cases', primaryKey: 'id' });
    expect(snapshot.documents).toHaveLength(60);
    const tasks = JSON.parse(await readFile(path.join(h.dir, 'tasks.json'), 'utf8'));
    expect(tasks).toMatchObject({ format: 'sequent-search-fake-tasks', nextTaskUid: tasks.tasks.length });
  });

  it('starts without an unreadable index (and keeps the file aside), warning, the others intact', async () => {
    const first = await fresh();
    await seed(first);
    await first.client.index('kept').addDocuments([{ id: 1 }]).waitTask();
    await first.fake.stop();
    await writeFile(path.join(first.dir, 'indexes', 'cases.json'), '{"format": "sequent-search-fake-index", "documents": [');
    await writeFile(path.join(first.dir, 'tasks.json'), 'not json');
    const warn = vi.spyOn(console, 'warn').mockImplementation(() => {});
    const second = await fresh({ dir: first.dir });
    expect(warn).toHaveBeenCalledTimes(2);
    expect(String(warn.mock.calls.map((c) => c[0]).join('\n'))).toMatch(/index `cases`[\s\S]*unreadable/);
    expect(await apiError(second.client.getIndex('cases'))).toMatchObject({ code: 'index_not_found' });
    expect((await second.client.index('kept').getDocuments()).total).toBe(1);
    expect((await second.client.tasks.getTasks()).total).toBe(0);
    const names = await readdir(path.join(first.dir, 'indexes'));
    expect(names.some((n) => /^cases\.json\.corrupt-\d+$/.test(n))).toBe(true);
    succeeded(await second.client.index('cases').addDocuments([{ id: 'again' }]).waitTask());
  });
});

describe('the outage control', () => {
  it('makes the SDK fail with a request error while down, and work again after', async () => {
    const h = await fresh();
    await seed(h);
    expect(await control(h, 'outage', { down: true })).toEqual({ status: 200, body: { down: true } });
    const error = await h.client.index('cases').search('jump').catch((e: unknown) => e);
    expect(error).toBeInstanceOf(MeilisearchRequestError);
    expect(await h.client.isHealthy()).toBe(false);
    await expect(h.client.index('cases').addDocuments([{ id: 'x' }])).rejects.toBeInstanceOf(MeilisearchRequestError);
    expect(await control(h, 'outage', { down: false })).toEqual({ status: 200, body: { down: false } });
    expect(await h.client.isHealthy()).toBe(true);
    expect((await h.client.index('cases').search('jump')).estimatedTotalHits).toBeGreaterThan(0);
    expect(await control(h, 'outage', { down: 'yes' })).toMatchObject({ status: 400, body: { code: 'bad_request' } });
  });

  it('has no control routes unless asked for', async () => {
    const h = await fresh({ control: false });
    expect(await control(h, 'outage', { down: true })).toMatchObject({ status: 404, body: { code: 'not_found' } });
    expect(await h.client.isHealthy()).toBe(true);
  });
});

describe('as a process', () => {
  it('refuses to start without an API key', async () => {
    const dir = await mkdtemp(path.join(tmpdir(), 'sequent-search-fake-proc-'));
    try {
      const child = spawn(process.execPath, [SERVER], { env: { ...process.env, SEARCH_FAKE_DIR: dir, SEARCH_FAKE_PORT: '0', SEARCH_FAKE_API_KEY: '' }, stdio: ['ignore', 'pipe', 'pipe'] });
      let stderr = '';
      child.stderr.on('data', (d) => (stderr += d));
      const code = await new Promise((resolve) => child.once('exit', resolve));
      expect(code).toBe(1);
      expect(stderr).toMatch(/needs an API key: set SEARCH_FAKE_API_KEY/);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });

  it('serves with the key from the environment, keeps its state and stops on SIGTERM', async () => {
    const dir = await mkdtemp(path.join(tmpdir(), 'sequent-search-fake-proc-'));
    try {
      const child = spawn(process.execPath, [SERVER], {
        env: { ...process.env, SEARCH_FAKE_DIR: dir, SEARCH_FAKE_PORT: '0', SEARCH_FAKE_API_KEY: 'process-key', SEARCH_FAKE_CONTROL: 'on' },
        stdio: ['ignore', 'pipe', 'inherit'],
      });
      const url = await new Promise<string>((resolve, reject) => {
        let out = '';
        child.stdout.on('data', (d) => {
          out += d;
          const m = /(http:\/\/127\.0\.0\.1:\d+)/.exec(out);
          if (m) resolve(m[1] as string);
        });
        child.once('exit', () => reject(new Error(out)));
      });
      const client = clientFor(url, 'process-key');
      succeeded(await client.index('proc').addDocuments([{ id: 1, title: 'kept' }]).waitTask());
      const exited = new Promise((resolve) => child.once('exit', resolve));
      child.kill('SIGTERM');
      expect(await exited).toBe(0);
      const stored = JSON.parse(await readFile(path.join(dir, 'indexes', 'proc.json'), 'utf8'));
      expect(stored.documents).toEqual([[0, { id: 1, title: 'kept' }]]);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});
