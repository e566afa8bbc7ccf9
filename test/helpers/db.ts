/**
 * Database helpers for integration tests.
 *
 * Test files in the `db` project (everything outside test/engine and test/cli) run one file at
 * a time (fileParallelism: false in test/vitest.config.ts), so a file may call
 * `resetDatabase()` in beforeAll/beforeEach without disturbing another file.
 */
import { truncateAppTables } from '@/db/reset';
import { closeDatabase as closeDb } from '@/db/lifecycle';
import { stopBoss } from '@/db/jobs';

/** Truncates all application tables (not drizzle's journal, not pg-boss's schema). */
export async function resetDatabase(): Promise<void> {
  await truncateAppTables();
}

/** Closes this test file's pool; call in afterAll so the fork exits promptly. */
export async function closeDatabase(): Promise<void> {
  await closeDb();
}

/** Stops this file's queue client (pg-boss) and closes its pool; call in afterAll. */
export async function closeQueueAndDatabase(timeoutMs = 5000): Promise<void> {
  await stopBoss(timeoutMs);
  await closeDb();
}
