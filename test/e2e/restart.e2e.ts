/**
 * The running stack survives a worker crash: the worker is killed with SIGKILL in the middle of
 * a run; the supervisor restarts it, the web server answers throughout, and the new worker
 * continues the run (its sweep finds the lapsed lease of the chunk the killed worker held) until
 * every interval is stored once.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from './harness';
import { closeDatabase } from '@/db/lifecycle';
import { getRunById, listRunIntervals } from '@/db/repo/runs';
import { listRunChunks } from '@/db/repo/run-chunks';
import { launchRun } from '@/src/runs/launch';
import { makeRunWorld } from '@/test/runs/world';
import { runEnded, until } from '@/test/helpers/until';

let app: TestApp;

beforeAll(async () => {
  app = await startTestApp({
    env: {
      CAVITAS_RUN_LEASE_S: '3',
      CAVITAS_RUN_SWEEP_S: '1',
      CAVITAS_RUN_SLICE_S: '2',
      CAVITAS_RUN_THREADS: '1',
      CAVITAS_RUN_WRITE_MS: '0',
      WORKER_CONCURRENCY: '1',
    },
  });
});
afterAll(async () => {
  await app?.stop();
  await closeDatabase();
});

const appLog = () => app.logs.slice(-40).join('\n');

describe('worker crash under the supervisor', () => {
  it('restarts the killed worker, keeps the web answering, and the new worker finishes the run', async () => {
    const w = await makeRunWorld(24);
    const run = await launchRun(w.networkId, w.userId, { ...w.config, starts: 16 });
    const total = run.intervalStarts.length;
    // Killed while it holds a chunk of the run, so that the chunk must be taken over.
    const holdsChunk = async () =>
      (await listRunChunks(run.id)).some((c) => c.doneAt === null && c.workerId?.split(':')[1] === String(app.pid('worker')));
    await until(
      'first interval stored while the run is still going, a chunk in the worker hands',
      async () => {
        const r = await getRunById(run.id);
        return (
          r && r.state === 'running' && r.progress.intervalsDone >= 1 && r.progress.intervalsDone < total && (await holdsChunk())
        );
      },
      60_000,
      appLog,
      25,
    );
    const firstWorker = app.pid('worker')!;
    const web = app.pid('web');
    process.kill(firstWorker, 'SIGKILL');

    // The web server answers while the worker is down and after it is back.
    const page = await fetch(`${app.baseUrl}/sign-in`, { redirect: 'manual' });
    expect(page.status).toBe(200);
    const second = await until(
      'a new worker process',
      async () => {
        const p = app.pid('worker');
        return p !== undefined && p !== firstWorker ? p : null;
      },
      60_000,
      appLog,
    );
    expect(second).not.toBe(firstWorker);
    expect(app.logs.some((l) => /^worker\s*\| exited unexpectedly \(killed by SIGKILL\); restarting in/.test(l))).toBe(true);

    const done = await until('run finished by the restarted worker', runEnded(run.id), 90_000, appLog, 250);
    expect(done.state).toBe('finished');
    expect(done.error).toBeNull();
    expect(done.attempts).toBeGreaterThanOrEqual(2); // the killed worker's chunk was tried again
    const starts = (await listRunIntervals(run.id)).map((r) => r.startsAt.toISOString());
    expect(new Set(starts).size).toBe(total); // every interval, none twice
    expect(starts.length).toBe(total);

    expect(app.pid('web')).toBe(web); // the web server was never restarted
    const again = await fetch(`${app.baseUrl}/api/auth/session`);
    expect(again.status).toBe(200);
  }, 180_000);
});
