/**
 * Vitest global setup: the built app (rebuilt when sources are newer than the build),
 * seeded with the demo firms and served on a free loopback port against the test database.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, rmSync, statSync } from 'node:fs';
import { mkdtemp } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { startMailFake } from '../../mail-fake/server.mjs';
import { startSearchFake } from '../../search-fake/server.mjs';
import { randomBytes } from 'node:crypto';
import { projectRoot } from '../../scripts/lib/project.mjs';
import { startApp } from '../helpers/appProcess';

declare module 'vitest' {
  export interface ProvidedContext {
    /** The HTTP API of the SMTP fake the test app sends its mail to (mail-fake/server.mjs). */
    mailboxUrl: string;
    /** The search fake the test app indexes into (search-fake/server.mjs, test-only control routes on). */
    searchUrl: string;
    searchKey: string;
    /** The folder of the test app's file store (SEQUENT_FILES_DIR), for tests that look inside it. */
    filesDir: string;
  }
}

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
  const mailDir = await mkdtemp(path.join(tmpdir(), 'sequent-test-mail-'));
  const mail = await startMailFake({ dir: mailDir, control: true });
  const searchDir = await mkdtemp(path.join(tmpdir(), 'sequent-test-search-'));
  const search = await startSearchFake({ dir: searchDir, apiKey: randomBytes(12).toString('hex'), control: true });
  const filesDir = await mkdtemp(path.join(tmpdir(), 'sequent-test-files-'));
  const stopMail = async () => {
    rmSync(filesDir, { recursive: true, force: true });
    await mail.stop();
    await search.stop();
    rmSync(mailDir, { recursive: true, force: true });
    rmSync(searchDir, { recursive: true, force: true });
  };
  try {
    const app = await startApp(
      databaseUrl,
      'off',
      (env) => {
        env.SEQUENT_FILES_DIR = filesDir;
        const seed = spawnSync('npx', ['tsx', 'scripts/seed.ts'], { cwd: projectRoot, env, encoding: 'utf8', timeout: 180_000 });
        if (seed.status !== 0) throw new Error(`seeding the test database failed (status ${seed.status}, signal ${seed.signal}${seed.error ? `, ${seed.error.message}` : ""}):\n${seed.stdout}\n${seed.stderr}`);
      },
      { smtpUrl: mail.smtpUrl, mailboxUrl: mail.apiUrl },
      { url: search.url, apiKey: search.apiKey },
    );
    project.provide('appUrl', app.url);
    project.provide('mailboxUrl', mail.apiUrl);
    project.provide('searchUrl', search.url);
    project.provide('searchKey', search.apiKey);
    project.provide('filesDir', filesDir);
    return async () => {
      await app.stop();
      await stopMail();
    };
  } catch (error) {
    await stopMail();
    throw error;
  }
}
