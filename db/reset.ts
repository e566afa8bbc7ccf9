/**
 * Empties every application table (tests only). Tables are found in information_schema, so
 * new areas are covered without edits; drizzle's migration journal and pg-boss's own
 * schema are left alone.
 */
import { getSql } from './client';

const KEEP_SCHEMAS = ['pg_catalog', 'information_schema', 'drizzle', 'pgboss'];

export async function truncateAppTables(): Promise<string[]> {
  const sql = getSql();
  const rows = await sql<{ schema: string; name: string }[]>`
    SELECT table_schema AS schema, table_name AS name
      FROM information_schema.tables
     WHERE table_type = 'BASE TABLE'
       AND table_schema NOT IN ${sql(KEEP_SCHEMAS)}
       AND table_schema NOT LIKE 'pg_toast%'
       AND table_schema NOT LIKE 'pg_temp%'`;
  if (rows.length === 0) return [];
  const names = rows.map((r) => `"${r.schema.replace(/"/g, '""')}"."${r.name.replace(/"/g, '""')}"`);
  await sql.unsafe(`TRUNCATE ${names.join(', ')} RESTART IDENTITY CASCADE`);
  return rows.map((r) => `${r.schema}.${r.name}`);
}
