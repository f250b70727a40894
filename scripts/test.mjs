#!/usr/bin/env node
// `npm test`: the whole suite. Installs what is missing (npm dependencies, Debian's
// PostgreSQL and Chromium), then runs Vitest: unit, integration (a throwaway PostgreSQL
// cluster and the built app) and end-to-end (headless Chromium). Exits non-zero on any
// failure; the last line is `N passed, N failed`. Extra arguments go to Vitest.
import { spawnSync } from 'node:child_process';
import { ensurePostgresInstalled } from './lib/postgres.mjs';
import { projectRoot } from './lib/project.mjs';
import { checkNode, ensureChromium, ensureDependencies, step } from './lib/steps.mjs';

try {
  checkNode();
  ensureDependencies();
  ensurePostgresInstalled();
  ensureChromium();
} catch (error) {
  console.error(`\nnpm test could not prepare the machine: ${error instanceof Error ? error.message : error}`);
  console.log('\n0 passed, 1 failed');
  process.exit(1);
}

step('Running the test suite');
const result = spawnSync('npx', ['vitest', 'run', ...process.argv.slice(2)], {
  cwd: projectRoot,
  stdio: 'inherit',
  env: { ...process.env, NO_COLOR: '1', ASTRO_TELEMETRY_DISABLED: '1' },
});
process.exit(result.status ?? 1);
