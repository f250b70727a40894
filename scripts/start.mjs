#!/usr/bin/env node
// `npm start`: everything from a fresh clone to a running Sequent with demo data.
// Installs npm dependencies if needed, starts PostgreSQL (installing it from Debian if
// missing), migrates, seeds the demo firms (idempotent), builds and serves on 127.0.0.1.
// Flags: --setup-only (stop before building), --no-build (serve the existing build).
import { spawn } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import { prepareDemo } from './db.mjs';
import { appHost, appPort, projectRoot, serverNodeFlags } from './lib/project.mjs';
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
  step('Serving');
  const server = spawn(process.execPath, [...serverNodeFlags, path.join(projectRoot, 'scripts/serve.mjs')], {
    cwd: projectRoot,
    stdio: 'inherit',
    env: { ...env, NODE_ENV: 'production', HOST: appHost, PORT: String(appPort) },
  });
  console.log(`\nSequent is running at ${env.SEQUENT_BASE_URL}  (Ctrl-C stops it; PostgreSQL keeps running: npm run db:stop)\n`);
  for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => server.kill(signal));
  server.on('exit', (code) => process.exit(code ?? 0));
} catch (error) {
  console.error(`\nnpm start failed: ${error instanceof Error ? error.message : error}`);
  process.exit(1);
}
