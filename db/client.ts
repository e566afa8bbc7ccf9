/**
 * The one database connection of a process. Only files under db/ import this;
 * everything else calls the functions in db/repo/*.
 */
import postgres from 'postgres';
import { drizzle, type PostgresJsDatabase } from 'drizzle-orm/postgres-js';
import * as schema from './schema';

export type Db = PostgresJsDatabase<typeof schema>;

let sql: postgres.Sql | null = null;
let db: Db | null = null;

/** The connection string: DATABASE_URL, set by `npm start`, `npm test` or the operator. */
export function databaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url)
    throw new Error('DATABASE_URL is not set: start Cavitas with `npm start`, or point DATABASE_URL at a PostgreSQL server');
  return url;
}

/** Lazily opened drizzle handle over a small postgres.js pool. */
export function getDb(): Db {
  if (!db) {
    sql = postgres(databaseUrl(), { max: Number(process.env.DATABASE_POOL ?? 10), onnotice: () => {} });
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
