// Applies pending migrations to DATABASE_URL (the demo database by default). Exits 1 on failure.
import './lib/load-env';
import { migrateDatabase } from '../src/db/migrate';

try {
  await migrateDatabase(process.env.DATABASE_URL!);
  console.log('Migrations applied.');
} catch (error) {
  console.error('Migration failed:', error instanceof Error ? error.message : error);
  process.exit(1);
}
