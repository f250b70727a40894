#!/usr/bin/env node
// `npm run dev`: the demo database plus Astro's dev server with hot reload on 127.0.0.1:4321.
import { spawn } from 'node:child_process';
import { prepareDemo } from './db.mjs';
import { step } from './lib/steps.mjs';

try {
  const env = await prepareDemo();
  step('Astro dev server');
  const dev = spawn('npx', ['astro', 'dev', '--host', '127.0.0.1', ...process.argv.slice(2)], { stdio: 'inherit', env });
  for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => dev.kill(signal));
  dev.on('exit', (code) => process.exit(code ?? 0));
} catch (error) {
  console.error(`\nnpm run dev failed: ${error instanceof Error ? error.message : error}`);
  process.exit(1);
}
