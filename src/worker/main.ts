/**
 * The worker process (`npm run worker`, also started by `npm start`): serves every job kind in
 * the registry until SIGINT/SIGTERM, then lets running jobs finish (up to 60 s; inversion runs
 * are handed back to the queue after their current interval) and exits.
 * Start as many as you like, on as many machines, against the same DATABASE_URL.
 */
import { jobs } from './registry';
import { serveJobs } from './run';
import { startRunSweep } from './sweep';
import { handOverRuns } from './jobs/run-inversion';
import { closeDatabase } from '@/db/lifecycle';
import { settings } from '@/src/settings';

async function main(): Promise<void> {
  if (!settings().DATABASE_URL) {
    console.error('[worker] DATABASE_URL is not set: point it at the Cavitas database (npm start sets it).');
    process.exit(2);
  }
  const handle = await serveJobs(jobs);
  const sweep = startRunSweep();
  let stopping = false;
  const shutdown = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`[worker] ${signal}: finishing running jobs…`);
    handOverRuns(); // runs go back to the queue after their current interval
    sweep
      .stop()
      .then(() => handle.stop(60_000))
      .then(() => closeDatabase())
      .then(() => {
        console.log('[worker] stopped');
        process.exit(0);
      })
      .catch((err) => {
        console.error(`[worker] shutdown error: ${err instanceof Error ? err.message : err}`);
        process.exit(1);
      });
  };
  // Handlers first, then the word that the worker is ready: whoever waits for it may stop it at once.
  process.on('SIGINT', () => shutdown('SIGINT'));
  process.on('SIGTERM', () => shutdown('SIGTERM'));
  console.log(`[worker] ready (pid ${process.pid}); queues: ${handle.queues.join(', ') || 'none registered'}`);
}

main().catch((err) => {
  console.error(`[worker] ${err instanceof Error ? (err.stack ?? err.message) : err}`);
  process.exit(1);
});
