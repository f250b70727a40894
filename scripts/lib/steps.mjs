// Small helpers shared by scripts/start.mjs and scripts/test.mjs (plain Node, no dependencies).
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import path from 'node:path';
import { projectRoot } from './project.mjs';

/** Prints a step heading. */
export function step(text) {
  console.log(`\n▸ ${text}`);
}

/** Runs a command in the project folder with inherited output; throws on a non-zero exit. */
export function run(cmd, args, env = process.env) {
  const result = spawnSync(cmd, args, { cwd: projectRoot, stdio: 'inherit', env });
  if (result.error) throw result.error;
  if (result.status !== 0) throw new Error(`${cmd} ${args.join(' ')} exited with ${result.status}`);
}

/** Fails early, and clearly, on a Node.js the stack does not run on. */
export function checkNode() {
  const [major, minor] = process.versions.node.split('.').map(Number);
  if (major < 20 || (major === 20 && minor < 19)) {
    throw new Error(`Sequent needs Node.js 20.19 or newer; this is ${process.versions.node}.`);
  }
}

/** Runs `npm ci` when node_modules is missing or older than package-lock.json. */
export function ensureDependencies() {
  const lock = path.join(projectRoot, 'package-lock.json');
  const installed = path.join(projectRoot, 'node_modules', '.package-lock.json');
  if (existsSync(installed) && statSync(installed).mtimeMs >= statSync(lock).mtimeMs) return;
  step('Installing npm dependencies (npm ci)');
  run('npm', ['ci', '--no-audit', '--no-fund']);
}

/** Installs Debian's Chromium for the browser tests when it is missing (needs root). */
export function ensureChromium() {
  if (existsSync('/usr/bin/chromium')) return;
  if (process.getuid?.() !== 0) {
    throw new Error('The browser tests need Debian\'s Chromium: sudo apt-get install -y --no-install-recommends chromium');
  }
  step('Installing Chromium from Debian for the browser tests');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '-qq', '--no-install-recommends', 'chromium', 'fonts-liberation'], { stdio: 'inherit', env });
}
