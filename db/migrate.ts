/**
 * Applies the committed drizzle-kit migrations in `migrations/` to DATABASE_URL (or the URL
 * given). Safe to call from several processes at once: a PostgreSQL advisory lock serialises
 * them, and drizzle's journal table (schema `drizzle`) skips what is already applied.
 *
 * Run directly: `npx tsx db/migrate.ts`.
 */
import fs from 'node:fs';
import path from 'node:path';
import postgres from 'postgres';
import { drizzle } from 'drizzle-orm/postgres-js';
import { migrate as drizzleMigrate } from 'drizzle-orm/postgres-js/migrator';
import { projectRoot, runAsScript } from '@/src/ops/paths';
import { settings } from '@/src/settings';

export const migrationsFolder = path.join(projectRoot, 'migrations');

/** Arbitrary constant key for pg_advisory_lock ("cavitas migrate"). */
const MIGRATE_LOCK_KEY = 7_245_110_331;

/** Returns the number of migrations in the journal (0 when none have been generated yet). */
export async function migrate(url: string | undefined = settings().DATABASE_URL): Promise<number> {
  if (!url) throw new Error('DATABASE_URL is not set: cannot apply migrations');
  const journal = path.join(migrationsFolder, 'meta', '_journal.json');
  if (!fs.existsSync(journal)) return 0;
  const entries = (JSON.parse(fs.readFileSync(journal, 'utf8')) as { entries: unknown[] }).entries.length;
  const sql = postgres(url, { max: 1, onnotice: () => {} });
  try {
    await sql`SELECT pg_advisory_lock(${MIGRATE_LOCK_KEY})`;
    try {
      await drizzleMigrate(drizzle(sql), { migrationsFolder });
    } finally {
      await sql`SELECT pg_advisory_unlock(${MIGRATE_LOCK_KEY})`;
    }
  } finally {
    await sql.end({ timeout: 5 });
  }
  return entries;
}

if (runAsScript(import.meta.url)) {
  migrate()
    .then((n) => console.log(`migrations: ${n} in journal, database up to date`))
    .catch((e) => {
      console.error(e instanceof Error ? e.message : e);
      process.exit(1);
    });
}
