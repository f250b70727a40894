// Runs in each test worker: points the app's modules at the throwaway test database.
import { inject } from 'vitest';

process.env.DATABASE_URL = inject('databaseUrl');
process.env.SEQUENT_BASE_URL = inject('appUrl');
process.env.SEQUENT_RATE_LIMIT = 'off';
// Services called from tests (a reindex, a drain) reach the same search fake as the app.
process.env.SEQUENT_SEARCH_URL = inject('searchUrl');
process.env.SEQUENT_SEARCH_KEY = inject('searchKey');

// Each test file closes the pool it opened, so workers exit promptly.
const { afterAll } = await import('vitest');
const { closeDb } = await import('../../src/db/client');
afterAll(closeDb);
