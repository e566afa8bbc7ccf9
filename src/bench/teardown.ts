/** The end of a bench that ran on its own throwaway PostgreSQL. */
import type { ThrowawayPg } from '@/db/pglocal';
import { closeDatabase } from '@/db/lifecycle';
import { stopBoss } from '@/db/jobs';
import { setEnv } from '@/src/settings';

/**
 * Runs everything on `stop` (last pushed first), stops the queue client, closes the pool, stops the
 * database server and puts DATABASE_URL back; a step that fails does not keep the next from running.
 */
export async function tearDownBench(
  stop: Array<() => Promise<void> | void>,
  pg: ThrowawayPg | null,
  previousUrl: string | undefined,
): Promise<void> {
  for (const f of stop.reverse())
    await Promise.resolve()
      .then(f)
      .catch(() => {});
  await stopBoss(5_000).catch(() => {});
  await closeDatabase().catch(() => {});
  await pg?.stop().catch(() => {});
  setEnv('DATABASE_URL', previousUrl);
}
