import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import { config } from '../lib/config';
import * as schema from './schema';

export type Database = NodePgDatabase<typeof schema>;

const globalForDb = globalThis as unknown as { sequentPool?: pg.Pool; sequentDb?: Database };

/** The process's one connection pool (kept on globalThis so dev reloads do not leak pools). */
export function pool(): pg.Pool {
  globalForDb.sequentPool ??= new pg.Pool({ connectionString: config().DATABASE_URL, max: 10 });
  return globalForDb.sequentPool;
}

/** The Drizzle client over {@link pool}. */
export function db(): Database {
  globalForDb.sequentDb ??= drizzle(pool(), { schema });
  return globalForDb.sequentDb;
}

/** Closes the pool (scripts and tests call this so the process can exit). */
export async function closeDb(): Promise<void> {
  const current = globalForDb.sequentPool;
  globalForDb.sequentPool = undefined;
  globalForDb.sequentDb = undefined;
  await current?.end();
}

/** Anything queries can run on: the client or a transaction. */
export type Queryable = Pick<Database, 'select' | 'insert' | 'update' | 'delete' | 'execute'>;

/**
 * A statement prepared once per Drizzle client: `prepared(build)` returns a function that
 * gives the statement `build` makes for a client, building it on first use. Named prepared
 * statements are parsed and planned once per connection, and Drizzle skips building the SQL.
 * Use for queries on every request's path.
 */
export function prepared<T>(build: (database: Database) => T): (database: Database) => T {
  const byClient = new WeakMap<Database, T>();
  return (database) => {
    let statement = byClient.get(database);
    if (statement === undefined) {
      statement = build(database);
      byClient.set(database, statement);
    }
    return statement;
  };
}
