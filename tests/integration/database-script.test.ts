import { execFile } from 'node:child_process';
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort } from '../../scripts/lib/ports.mjs';

const run = promisify(execFile);
let dataDir: string;
let env: NodeJS.ProcessEnv;

const db = (command: string) => run(process.execPath, ['scripts/db.mjs', command], { env, cwd: process.cwd() });

beforeAll(async () => {
  dataDir = await mkdtemp(path.join(tmpdir(), 'sequent-db-script-'));
  env = { ...process.env, SEQUENT_DATA_DIR: dataDir, SEQUENT_PG_PORT: String(await freePort()) };
});

afterAll(async () => {
  await db('stop').catch(() => {});
  await rm(dataDir, { recursive: true, force: true });
});

describe('scripts/db.mjs', () => {
  it('creates, starts and provisions the database, and is safe to run twice', async () => {
    const first = await db('start');
    expect(first.stdout).toContain('Created a PostgreSQL cluster');
    const second = await db('start');
    expect(second.stdout).not.toContain('Created a PostgreSQL cluster');
    expect(second.stdout).toContain('Database ready');

    const settings = await readFile(path.join(dataDir, 'sequent.env'), 'utf8');
    const url = /^DATABASE_URL=(.+)$/m.exec(settings)![1]!;
    expect(url).toContain(`@127.0.0.1:${env.SEQUENT_PG_PORT}/sequent`);
    const client = new pg.Client({ connectionString: url });
    await client.connect();
    const { rows } = await client.query("select current_user, current_setting('listen_addresses') as listen");
    await client.end();
    expect(rows[0]).toEqual({ current_user: 'sequent', listen: '127.0.0.1' });
  });

  it('reports status, stops, and stops again without error', async () => {
    expect((await db('status')).stdout).toContain('running on 127.0.0.1');
    expect((await db('stop')).stdout).toContain('PostgreSQL stopped.');
    expect((await db('stop')).stdout).toContain('PostgreSQL was not running.');
    await expect(db('status')).rejects.toMatchObject({ code: 3 });
  });

  it('starts an existing cluster again after a stop', async () => {
    const again = await db('start');
    expect(again.stdout).toContain('PostgreSQL is running');
    expect(again.stdout).not.toContain('Created a PostgreSQL cluster');
  });
});

describe('scripts/start.mjs --setup-only', () => {
  const start = () => run(process.execPath, ['scripts/start.mjs', '--setup-only'], { env, cwd: process.cwd() });

  it('migrates and seeds, and a second run changes nothing', async () => {
    const first = await start();
    expect(first.stdout).toContain('Migrations applied.');
    expect(first.stdout).toMatch(/Demo data: added 7 people and \d+ cases./);
    const second = await start();
    expect(second.stdout).toContain('Migrations applied.');
    expect(second.stdout).toContain('Demo data already present.');
  }, 60_000);
});

