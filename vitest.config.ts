import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const alias = { '@': fileURLToPath(new URL('./src', import.meta.url)) };

/**
 * Three projects, so pure logic runs in milliseconds without a database:
 * - unit: pure modules under src/lib (solver, calc, validation), no I/O;
 * - contract: the local search fake (search-fake/) through the meilisearch SDK, on loopback;
 * - integration: services and API routes against a throwaway PostgreSQL cluster;
 * - e2e: the built app in Debian's headless Chromium through playwright-core.
 */
export default defineConfig({
  resolve: { alias },
  test: {
    reporters: ['default', './tests/setup/summary-reporter.ts'],
    // Integration files share one database (each makes its own firms); e2e shares one app server.
    fileParallelism: false,
    projects: [
      {
        resolve: { alias },
        test: { name: 'unit', include: ['tests/lib/**/*.test.ts'], environment: 'node' },
      },
      {
        // The search fake driven through the official meilisearch SDK (search-fake/, no database).
        resolve: { alias },
        test: { name: 'contract', include: ['tests/search-fake/**/*.test.ts'], environment: 'node', testTimeout: 30_000 },
      },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          globalSetup: ['tests/setup/database.ts', 'tests/setup/app-server.ts'],
          setupFiles: ['tests/setup/worker-env.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          globalSetup: ['tests/setup/database.ts', 'tests/setup/app-server.ts'],
          setupFiles: ['tests/setup/worker-env.ts'],
          testTimeout: 60_000,
          hookTimeout: 180_000,
        },
      },
    ],
  },
});
