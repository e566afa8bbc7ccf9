import { afterAll, describe, expect, it } from 'vitest';
import postgres from 'postgres';
import { migrate } from '@/db/migrate';
import { resetDatabase, closeDatabase } from '../helpers/db';

// The globalSetup (or `npm test`) provides DATABASE_URL pointing at a loopback server.
describe('test database', () => {
  afterAll(closeDatabase);

  it('is a PostgreSQL server on 127.0.0.1 reachable with the exported URL', async () => {
    const url = new URL(process.env.DATABASE_URL!);
    expect(url.hostname).toBe('127.0.0.1');
    const sql = postgres(process.env.DATABASE_URL!, { max: 1 });
    try {
      const [row] = await sql<{ v: string }[]>`SELECT current_setting('server_version') AS v`;
      // PostgreSQL versions are "major.minor" since 10 (PostgreSQL release notes, common practice).
      expect(row.v).toMatch(/^\d{2,}\.\d+/);
    } finally {
      await sql.end();
    }
  });

  it('migrate() can be run again without error (idempotent)', async () => {
    await expect(migrate()).resolves.toBeGreaterThanOrEqual(0);
  });

  it('resetDatabase() empties an application table and leaves the schema in place', async () => {
    const sql = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
    await sql`CREATE TABLE IF NOT EXISTS infra_reset_probe (id serial primary key, label text)`;
    await sql`INSERT INTO infra_reset_probe (label) VALUES ('a'), ('b')`;
    await resetDatabase();
    const [{ n }] = await sql<{ n: number }[]>`SELECT count(*)::int AS n FROM infra_reset_probe`;
    expect(n).toBe(0);
    // RESTART IDENTITY: the serial starts again at 1 (PostgreSQL docs, TRUNCATE).
    const [{ id }] = await sql<{ id: number }[]>`INSERT INTO infra_reset_probe (label) VALUES ('c') RETURNING id`;
    expect(id).toBe(1);
    await sql`DROP TABLE infra_reset_probe`;
    await sql.end();
  });
});
