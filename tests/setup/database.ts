/**
 * Vitest global setup: a throwaway PostgreSQL cluster for the run (in the system's temp
 * folder, on a free loopback port), migrated, and removed afterwards.
 */
import { randomBytes } from 'node:crypto';
import { mkdtemp } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { migrateDatabase } from '../../src/db/migrate';
import { freePort } from '../../scripts/lib/ports.mjs';
import { destroyCluster, ensureDatabase, initCluster, startCluster } from '../../scripts/lib/postgres.mjs';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
    appUrl: string;
  }
}

export default async function setup(project: TestProject) {
  const root = await mkdtemp(path.join(tmpdir(), 'sequent-test-pg-'));
  const cluster = { root, port: await freePort(), throwaway: true };
  const quiet = () => {};
  try {
    initCluster(cluster, quiet);
    startCluster(cluster, quiet);
    const url = ensureDatabase(cluster, { database: 'sequent_test', role: 'sequent', password: randomBytes(12).toString('hex') });
    await migrateDatabase(url);
    project.provide('databaseUrl', url);
    // The app-server setup runs in this process after this one and reads it from here.
    process.env.SEQUENT_TEST_DATABASE_URL = url;
  } catch (error) {
    destroyCluster(cluster);
    throw error;
  }
  return () => destroyCluster(cluster);
}
