import { defineConfig } from 'drizzle-kit';

// Migrations are generated from src/db/schema into drizzle/ and committed;
// scripts/migrate.ts applies them at start and in the tests.
export default defineConfig({
  dialect: 'postgresql',
  schema: './src/db/schema/index.ts',
  out: './drizzle',
  dbCredentials: { url: process.env.DATABASE_URL ?? 'postgres://127.0.0.1:54329/sequent' },
  strict: true,
  verbose: true,
});
