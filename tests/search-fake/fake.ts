/**
 * Shared by the search fake's contract tests: a fake in its own temporary folder on a free
 * port, an SDK client for it, and small helpers around the SDK's errors and tasks.
 */
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Meilisearch, MeilisearchApiError, type Task } from 'meilisearch';
import { expect } from 'vitest';
import { startSearchFake, type SearchFake } from '../../search-fake/server.mjs';

export const API_KEY = 'contract-test-key';

export interface FakeHandle {
  fake: SearchFake;
  client: Meilisearch;
  dir: string;
  /** Stops the fake (if running) and removes its folder. */
  cleanup: () => Promise<void>;
}

/** Starts a fake (control routes on) in a new temporary folder, or in `dir`. */
export async function startFake(options: { dir?: string; control?: boolean } = {}): Promise<FakeHandle> {
  const dir = options.dir ?? (await mkdtemp(path.join(tmpdir(), 'sequent-search-fake-')));
  const fake = await startSearchFake({ dir, apiKey: API_KEY, control: options.control ?? true });
  const client = new Meilisearch({ host: fake.url, apiKey: API_KEY });
  return {
    fake,
    client,
    dir,
    cleanup: async () => {
      await fake.stop().catch(() => {});
      await rm(dir, { recursive: true, force: true });
    },
  };
}

/** A client for `url` with the right key, another key, or none (null). */
export const clientFor = (url: string, apiKey: string | null = API_KEY) => new Meilisearch({ host: url, apiKey: apiKey ?? undefined });

/**
 * Awaits `promise`, expects it to fail with a Meilisearch API error, and returns the error
 * body (`cause`) together with the HTTP status.
 */
export async function apiError(promise: Promise<unknown>): Promise<{ status: number; code: string; type: string; message: string; link: string }> {
  const error = await promise.then(
    () => {
      throw new Error('expected the request to fail');
    },
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(MeilisearchApiError);
  const api = error as MeilisearchApiError;
  expect(api.cause).toBeDefined();
  return { status: api.response.status, ...(api.cause as { code: string; type: string; message: string; link: string }) };
}

/** Expects a finished task to have succeeded, returning it. */
export function succeeded(task: Task): Task {
  expect(task.error, JSON.stringify(task.error)).toBeNull();
  expect(task.status).toBe('succeeded');
  return task;
}

/** The `id`s of search hits, in order. */
export const idsOf = (hits: Array<Record<string, unknown>>) => hits.map((h) => h.id);
