#!/usr/bin/env node
// The demo database: `node scripts/db.mjs start|stop|status`. Safe to run again and again.
import { ensureDatabase, initCluster, isRunning, startCluster, stopCluster, clusterPaths } from './lib/postgres.mjs';
import { demoCluster, demoSettings } from './lib/project.mjs';
import { checkNode, ensureDependencies, run, step } from './lib/steps.mjs';

/** Initialises (first time), starts and provisions the demo database; returns its URL. */
export function startDemoDatabase(log = console.log) {
  if (initCluster(demoCluster, log)) log(`Created a PostgreSQL cluster in ${clusterPaths(demoCluster.root).data}.`);
  startCluster(demoCluster, log);
  const settings = demoSettings();
  ensureDatabase(demoCluster, { database: 'sequent', role: 'sequent', password: settings.SEQUENT_DB_PASSWORD });
  return settings.DATABASE_URL;
}

/**
 * Everything the demo installation needs before the app runs: Node and npm dependencies,
 * PostgreSQL, migrations, demo data. Returns the environment the app runs with.
 */
export async function prepareDemo({ printAccounts = false } = {}) {
  checkNode();
  ensureDependencies();
  step('Starting PostgreSQL');
  startDemoDatabase();
  const env = { ...process.env, ...demoSettings(), ASTRO_TELEMETRY_DISABLED: '1' };
  step('Applying migrations');
  run('npx', ['tsx', 'scripts/migrate.ts'], env);
  step('Seeding demo data');
  run('npx', ['tsx', 'scripts/seed.ts', ...(printAccounts ? ['--print'] : [])], env);
  return env;
}

const command = process.argv[2];
if (import.meta.url === `file://${process.argv[1]}`) {
  try {
    if (command === 'start') {
      startDemoDatabase();
      console.log(`Database ready: postgres://sequent:…@127.0.0.1:${demoCluster.port}/sequent`);
    } else if (command === 'stop') {
      console.log(stopCluster(demoCluster) ? 'PostgreSQL stopped.' : 'PostgreSQL was not running.');
    } else if (command === 'status') {
      const running = isRunning(demoCluster.root);
      console.log(running ? `running on 127.0.0.1:${demoCluster.port} (${clusterPaths(demoCluster.root).data})` : 'not running');
      process.exitCode = running ? 0 : 3;
    } else {
      console.error('usage: node scripts/db.mjs start|stop|status');
      process.exitCode = 2;
    }
  } catch (error) {
    console.error(error instanceof Error ? error.message : error);
    process.exitCode = 1;
  }
}
