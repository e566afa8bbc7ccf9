/**
 * Vitest globalSetup for the `db` project: when DATABASE_URL is unset (a single test file run
 * by hand), start a throwaway PostgreSQL on a free loopback port, apply the migrations and
 * export DATABASE_URL to the test forks; tear it all down afterwards. When `npm test` already
 * set DATABASE_URL (and migrated), this does nothing.
 */
import { startThrowawayPostgres } from '../../db/pglocal';
import { migrate } from '../../db/migrate';

export default async function setup(): Promise<(() => Promise<void>) | void> {
  if (process.env.DATABASE_URL) return;
  const pg = await startThrowawayPostgres();
  try {
    await migrate(pg.url);
  } catch (e) {
    await pg.stop();
    throw e;
  }
  process.env.DATABASE_URL = pg.url;
  return async () => {
    delete process.env.DATABASE_URL;
    await pg.stop();
  };
}
