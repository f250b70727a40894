#!/usr/bin/env node
// `npm start`: everything from a fresh clone to a running Sequent with demo data.
// Installs npm dependencies if needed, starts PostgreSQL (installing it from Debian if
// missing), migrates, seeds the demo firms (idempotent), builds, starts the local SMTP fake
// (mail-fake/, messages readable at /dev/mailbox) and the local search fake (search-fake/,
// a stand-in for Meilisearch), and serves on 127.0.0.1. Published demo cases reach the
// search index through the outbox as soon as the server runs.
// Flags: --setup-only (stop before building), --no-build (serve the existing build).
import { spawn } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import { prepareDemo } from './db.mjs';
import { waitForPort } from './lib/ports.mjs';
import { appHost, appPort, mailFake, projectRoot, searchFake, serverNodeFlags } from './lib/project.mjs';
import { run, step } from './lib/steps.mjs';

const flags = new Set(process.argv.slice(2));

function portInUse(port) {
  return new Promise((resolve) => {
    const socket = net.connect(port, appHost, () => {
      socket.end();
      resolve(true);
    });
    socket.on('error', () => resolve(false));
  });
}

/**
 * Starts one of the local fakes as a child process and waits until `port` answers.
 * @param {string} what @param {string} script @param {number} port @param {Record<string, string>} extraEnv
 */
async function startService(what, script, port, extraEnv) {
  const child = spawn(process.execPath, [path.join(projectRoot, script)], { cwd: projectRoot, stdio: 'inherit', env: { ...process.env, ...extraEnv } });
  let running = true;
  child.once('exit', () => {
    running = false;
  });
  await waitForPort(port, appHost, 15_000).catch(() => {
    child.kill('SIGTERM');
    throw new Error(`${what} did not start (see above).`);
  });
  if (!running) throw new Error(`${what} stopped at start (see above).`);
  return child;
}

try {
  const env = await prepareDemo({ printAccounts: true });
  if (flags.has('--setup-only')) process.exit(0);
  if (!flags.has('--no-build')) {
    step('Building the app');
    run('npx', ['astro', 'build'], { ...env, NODE_ENV: 'production' });
  }
  if (await portInUse(appPort)) {
    throw new Error(`Port ${appPort} on ${appHost} is taken (is Sequent already running?). Stop it, or run with PORT=<other> npm start.`);
  }
  for (const [port, what, variable] of [
    [mailFake.smtpPort, 'the local mail fake', 'SEQUENT_MAIL_SMTP_PORT'],
    [mailFake.httpPort, 'the local mail fake', 'SEQUENT_MAIL_HTTP_PORT'],
    [searchFake.port, 'the local search fake', 'SEQUENT_SEARCH_PORT'],
  ]) {
    if (await portInUse(port)) {
      throw new Error(`Port ${port} on ${appHost} is taken, and ${what} needs it. Stop what uses it, or set ${variable}.`);
    }
  }
  // Child processes after `npm ci`: they need packages (smtp-server, minisearch…), which scripts/*.mjs may not import.
  step('Starting the local mail fake');
  const mail = await startService('the local mail fake', 'mail-fake/server.mjs', mailFake.httpPort, {
    MAIL_FAKE_DIR: mailFake.dir,
    MAIL_FAKE_SMTP_PORT: String(mailFake.smtpPort),
    MAIL_FAKE_HTTP_PORT: String(mailFake.httpPort),
  });
  step('Starting the local search fake');
  const search = await startService('the local search fake', 'search-fake/server.mjs', searchFake.port, {
    SEARCH_FAKE_DIR: searchFake.dir,
    SEARCH_FAKE_PORT: String(searchFake.port),
    SEARCH_FAKE_API_KEY: env.SEQUENT_SEARCH_KEY,
  }).catch((error) => {
    mail.kill('SIGTERM');
    throw error;
  });
  step('Rebuilding the search index');
  // Cheap for a demo library, and it makes the index match the database whatever happened
  // to either since the last run (a database seeded before search existed, a wiped .data/search).
  try {
    run('npx', ['tsx', 'scripts/reindex.ts', '--quiet'], env);
  } catch (error) {
    mail.kill('SIGTERM');
    search.kill('SIGTERM');
    throw error;
  }
  step('Serving');
  const server = spawn(process.execPath, [...serverNodeFlags, path.join(projectRoot, 'scripts/serve.mjs')], {
    cwd: projectRoot,
    stdio: 'inherit',
    env: {
      ...env,
      NODE_ENV: 'production',
      HOST: appHost,
      PORT: String(appPort),
      SEQUENT_SMTP_URL: `smtp://${appHost}:${mailFake.smtpPort}`,
      // The demo only: a real deployment leaves these unset and /dev/mailbox answers 404.
      SEQUENT_DEV_MAILBOX: 'on',
      SEQUENT_DEV_MAILBOX_URL: `http://${appHost}:${mailFake.httpPort}`,
    },
  });
  console.log(`\nSequent is running at ${env.SEQUENT_BASE_URL}  (Ctrl-C stops it; PostgreSQL keeps running: npm run db:stop)`);
  console.log(`Mail it sends lands in the local fake: read it at ${env.SEQUENT_BASE_URL}/dev/mailbox`);
  console.log(`Precedent search runs on the local search fake at http://${appHost}:${searchFake.port} (rebuild it: npm run reindex)\n`);
  for (const signal of ['SIGINT', 'SIGTERM']) {
    process.on(signal, () => {
      server.kill(signal);
      mail.kill(signal);
      search.kill(signal);
    });
  }
  server.on('exit', (code) => {
    mail.kill('SIGTERM');
    search.kill('SIGTERM');
    process.exit(code ?? 0);
  });
} catch (error) {
  console.error(`\nnpm start failed: ${error instanceof Error ? error.message : error}`);
  process.exit(1);
}
