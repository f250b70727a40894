#!/usr/bin/env node
// `npm start`: everything from a fresh clone to a running Sequent with demo data.
// Installs npm dependencies if needed, starts PostgreSQL (installing it from Debian if
// missing), migrates, seeds the demo firms (idempotent), builds, starts the local SMTP fake
// (mail-fake/, messages readable at /dev/mailbox) and serves on 127.0.0.1.
// Flags: --setup-only (stop before building), --no-build (serve the existing build).
import { spawn } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import { prepareDemo } from './db.mjs';
import { waitForPort } from './lib/ports.mjs';
import { appHost, appPort, mailFake, projectRoot, serverNodeFlags } from './lib/project.mjs';
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
  for (const port of [mailFake.smtpPort, mailFake.httpPort]) {
    if (await portInUse(port)) {
      throw new Error(`Port ${port} on ${appHost} is taken, and the local mail fake needs it. Stop what uses it, or set SEQUENT_MAIL_SMTP_PORT / SEQUENT_MAIL_HTTP_PORT.`);
    }
  }
  step('Starting the local mail fake');
  // A child process after `npm ci`: it needs smtp-server and mailparser, which scripts/*.mjs may not import.
  const mail = spawn(process.execPath, [path.join(projectRoot, 'mail-fake/server.mjs')], {
    cwd: projectRoot,
    stdio: 'inherit',
    env: { ...process.env, MAIL_FAKE_DIR: mailFake.dir, MAIL_FAKE_SMTP_PORT: String(mailFake.smtpPort), MAIL_FAKE_HTTP_PORT: String(mailFake.httpPort) },
  });
  let mailRunning = true;
  mail.once('exit', () => {
    mailRunning = false;
  });
  await waitForPort(mailFake.httpPort, appHost, 15_000).catch(() => {
    mail.kill('SIGTERM');
    throw new Error('the local mail fake did not start (see above).');
  });
  if (!mailRunning) throw new Error('the local mail fake stopped at start (see above).');
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
  console.log(`Mail it sends lands in the local fake: read it at ${env.SEQUENT_BASE_URL}/dev/mailbox\n`);
  for (const signal of ['SIGINT', 'SIGTERM']) {
    process.on(signal, () => {
      server.kill(signal);
      mail.kill(signal);
    });
  }
  server.on('exit', (code) => {
    mail.kill('SIGTERM');
    process.exit(code ?? 0);
  });
} catch (error) {
  console.error(`\nnpm start failed: ${error instanceof Error ? error.message : error}`);
  process.exit(1);
}
