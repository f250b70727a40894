/**
 * Vitest global setup: the built app (rebuilt when sources are newer than the build),
 * seeded with the demo firms and served on a free loopback port against the test database.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { freePort, waitForPort } from '../../scripts/lib/ports.mjs';
import { projectRoot } from '../../scripts/lib/project.mjs';

const entry = path.join(projectRoot, 'dist', 'server', 'entry.mjs');

function newestMtime(target: string): number {
  if (!existsSync(target)) return 0;
  const stat = statSync(target);
  if (!stat.isDirectory()) return stat.mtimeMs;
  return Math.max(stat.mtimeMs, ...readdirSync(target).map((name) => newestMtime(path.join(target, name))));
}

function buildIfStale(): void {
  const sources = ['src', 'content', 'public', 'astro.config.mjs', 'package-lock.json'].map((p) => path.join(projectRoot, p));
  const builtAt = existsSync(entry) ? statSync(entry).mtimeMs : 0;
  if (builtAt && Math.max(...sources.map(newestMtime)) < builtAt) return;
  const result = spawnSync('npx', ['astro', 'build'], {
    cwd: projectRoot,
    // Vitest sets NODE_ENV=test; a build must be a production build (else React's
    // development JSX runtime is compiled in and fails against the production runtime).
    env: { ...process.env, NODE_ENV: 'production', ASTRO_TELEMETRY_DISABLED: '1' },
    encoding: 'utf8',
  });
  if (result.status !== 0) throw new Error(`astro build failed:\n${result.stdout}\n${result.stderr}`);
}

export default async function setup(project: TestProject) {
  const databaseUrl = process.env.SEQUENT_TEST_DATABASE_URL;
  if (!databaseUrl) throw new Error('tests/setup/database.ts must run before app-server.ts');
  buildIfStale();
  const port = await freePort();
  const appUrl = `http://127.0.0.1:${port}`;
  const env = {
    ...process.env,
    DATABASE_URL: databaseUrl,
    SEQUENT_BASE_URL: appUrl,
    SEQUENT_RATE_LIMIT: 'off',
    BETTER_AUTH_SECRET: 'test-secret-that-is-long-enough-for-better-auth',
    NODE_ENV: 'production',
    HOST: '127.0.0.1',
    PORT: String(port),
  };
  const seed = spawnSync('npx', ['tsx', 'scripts/seed.ts'], { cwd: projectRoot, env, encoding: 'utf8' });
  if (seed.status !== 0) throw new Error(`seeding the test database failed:\n${seed.stdout}\n${seed.stderr}`);

  const server: ChildProcess = spawn(process.execPath, [path.join(projectRoot, 'scripts', 'serve.mjs')], { cwd: projectRoot, env, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  server.stdout?.on('data', (d) => (output += d));
  server.stderr?.on('data', (d) => (output += d));
  try {
    await waitForPort(port);
  } catch (error) {
    server.kill();
    throw new Error(`the app server did not start:\n${output}`, { cause: error });
  }
  project.provide('appUrl', appUrl);
  return async () => {
    server.kill('SIGTERM');
    await new Promise((resolve) => (server.exitCode !== null ? resolve(null) : server.once('exit', resolve)));
  };
}
