/**
 * The one database connection of a process. Only files under db/ import this;
 * everything else calls the functions in db/repo/*.
 */
import postgres from 'postgres';
import { drizzle, type PostgresJsDatabase } from 'drizzle-orm/postgres-js';
import * as schema from './schema';
import { databaseUrl, settings } from '@/src/settings';

export type Db = PostgresJsDatabase<typeof schema>;

let sql: postgres.Sql | null = null;
let db: Db | null = null;

/** Lazily opened drizzle handle over a small postgres.js pool. */
export function getDb(): Db {
  if (!db) {
    sql = postgres(databaseUrl(), { max: settings().DATABASE_POOL, onnotice: () => {} });
    db = drizzle(sql, { schema });
  }
  return db;
}

/** Raw postgres.js client, for the few places drizzle does not cover (LISTEN, COPY). */
export function getSql(): postgres.Sql {
  getDb();
  return sql!;
}

export async function closeDb(): Promise<void> {
  if (sql) await sql.end({ timeout: 5 });
  sql = null;
  db = null;
}
