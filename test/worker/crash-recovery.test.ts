/**
 * Runs shared by real worker processes, and crash recovery: two workers work the chunks of one
 * run at once; one is killed with SIGKILL while it holds a chunk (no shutdown, no hand-back, its
 * pg-boss job left 'active' until it would expire); the other's sweep finds that chunk's lapsed
 * lease and queues it again, takes it over, and the run finishes with every interval stored
 * exactly once.
 *
 * The checks are the run's own contract: one stored row per (run, interval start) for every
 * planned start, progress at 100 %, both processes holding a chunk at once, and the sweep
 * saying it queued the orphaned chunk. A first test sweeps three times at once over a chunk
 * whose lease has lapsed and counts the pending jobs: exactly one more.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawn, type ChildProcess } from 'node:child_process';
import { programArgs } from '@/src/ops/paths';
import { fileURLToPath } from 'node:url';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { getBoss, stopBoss } from '@/db/jobs';
import { deleteRun, getRunById, listRunIntervals } from '@/db/repo/runs';
import { claimChunk, listRunChunks } from '@/db/repo/run-chunks';
import { setEnv } from '@/src/settings';
import { sweepRuns } from '@/src/worker/sweep';
import { RUN_QUEUE } from '@/src/runs/queues';
import { launchRun } from '@/src/runs/launch';
import { cancelRun, setRunPaused } from '@/src/runs/control';
import { makeRunWorld } from '@/test/runs/world';
import { runEnded, until } from '@/test/helpers/until';

const root = fileURLToPath(new URL('../../', import.meta.url));
const children: ChildProcess[] = [];
setEnv('CAVITAS_RUN_CHUNK', '4'); // 24 intervals in 6 chunks

function startWorker(): { child: ChildProcess; out: () => string } {
  const child = spawn(process.execPath, programArgs('worker'), {
    cwd: root,
    env: {
      ...process.env,
      CAVITAS_RUN_LEASE_S: '3',
      CAVITAS_RUN_SWEEP_S: '1',
      CAVITAS_RUN_SLICE_S: '2',
      CAVITAS_RUN_THREADS: '1',
      CAVITAS_RUN_WRITE_MS: '0', // each interval written at once, so that a kill can fall between two stored intervals
      WORKER_CONCURRENCY: '1',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  children.push(child);
  let out = '';
  child.stdout!.on('data', (b) => (out += b));
  child.stderr!.on('data', (b) => (out += b));
  return { child, out: () => out };
}

function exited(child: ChildProcess): Promise<void> {
  return child.exitCode !== null || child.signalCode !== null
    ? Promise.resolve()
    : new Promise((r) => child.once('exit', () => r()));
}

describe('crash recovery with real worker processes', () => {
  beforeAll(resetDatabase);
  afterAll(async () => {
    for (const c of children) {
      if (c.exitCode === null && c.signalCode === null) {
        c.kill('SIGKILL');
        await exited(c);
      }
    }
    await stopBoss(5_000);
    await closeDatabase();
  });

  it('sweeps queue at most one job per lapsed chunk, however many sweep at once', async () => {
    const w = await makeRunWorld(1);
    const boss = await getBoss();
    // Earlier test files may leave run jobs queued in the shared test database: start from an empty queue.
    await boss.purgeQueue(RUN_QUEUE);
    const run = await launchRun(w.networkId, w.userId, w.config);
    // Drain the launch job so only the sweep's jobs are pending (no worker runs yet).
    const [launched] = await boss.fetch(RUN_QUEUE);
    expect(launched.data).toEqual({ runId: run.id, first: 0 });
    expect(await claimChunk(run.id, 0, 'vanished-worker', 1)).not.toBeNull();
    expect(await sweepRuns(60)).toEqual({ continued: [], cancelled: [], chunks: [] }); // heartbeat still within a 60 s lease
    await new Promise((r) => setTimeout(r, 1_200));
    const before = await boss.getQueueSize(RUN_QUEUE);
    const sweeps = await Promise.all([sweepRuns(1), sweepRuns(1), sweepRuns(1)]);
    const again = await sweepRuns(1);
    expect(sweeps.flatMap((s) => s.chunks).filter((c) => c.runId === run.id)).toEqual([{ runId: run.id, first: 0 }]);
    expect(sweeps.flatMap((s) => s.continued)).not.toContain(run.id); // a run in chunks is continued chunk by chunk
    expect(again.chunks).toEqual([]); // its job is still pending
    expect(await boss.getQueueSize(RUN_QUEUE)).toBe(before + 1);
    expect(await deleteRun(w.networkId, run.id)).toBe(true); // the pending job will find no run
  });

  it('a paused run is left alone by the sweep; paused and asked to stop with its worker gone, it is ended as cancelled', async () => {
    const w = await makeRunWorld(1);
    const boss = await getBoss();
    await boss.purgeQueue(RUN_QUEUE);
    const run = await launchRun(w.networkId, w.userId, w.config);
    await boss.purgeQueue(RUN_QUEUE);
    expect(await claimChunk(run.id, 0, 'vanished-worker', 1)).not.toBeNull();
    await setRunPaused(w.networkId, run.id, true, null);
    await new Promise((r) => setTimeout(r, 1_200));
    expect(await sweepRuns(1)).toEqual({ continued: [], cancelled: [], chunks: [] });
    expect((await getRunById(run.id))!.state).toBe('paused');
    // The cancel finds the chunk held (within the default lease), so it waits for that worker, which is gone.
    expect((await cancelRun(w.networkId, run.id, null)).state).toBe('paused');
    expect((await sweepRuns(1)).cancelled).toEqual([run.id]);
    expect((await getRunById(run.id))!.state).toBe('cancelled');
    expect(await boss.getQueueSize(RUN_QUEUE)).toBe(0);
    expect(await deleteRun(w.networkId, run.id)).toBe(true);
  });

  it('two worker processes share a run; one is killed and its chunk is taken over; every interval is stored once', async () => {
    // Enough intervals and chunks that a quiet machine cannot finish the run between two polls.
    const w = await makeRunWorld(24);
    const first = startWorker();
    const second = startWorker();
    for (const wk of [first, second])
      await until('worker ready', async () => wk.out().includes('[worker] ready'), 40_000, wk.out);
    const run = await launchRun(w.networkId, w.userId, { ...w.config, starts: 16 });
    const total = run.intervalStarts.length;
    expect(total).toBe(24);
    expect(await listRunChunks(run.id)).toHaveLength(6);

    // Kill the first worker while both hold a chunk of the run at once, with at least one interval
    // stored and the run not over.
    const pidOf = (c: { workerId: string | null }) => c.workerId?.split(':')[1];
    const bothAtWork = async () => {
      const r = await getRunById(run.id);
      if (!r || r.state !== 'running' || r.progress.intervalsDone < 1 || r.progress.intervalsDone >= total) return null;
      const held = (await listRunChunks(run.id)).filter((c) => c.doneAt === null && c.workerId !== null);
      const mine = held.find((c) => pidOf(c) === String(first.child.pid));
      return mine && held.some((c) => pidOf(c) === String(second.child.pid)) ? mine : null;
    };
    const orphan = await until('both workers holding a chunk mid-run', bothAtWork, 40_000, first.out, 25);
    first.child.kill('SIGKILL');
    await exited(first.child);
    expect(await listRunIntervals(run.id)).not.toHaveLength(total);

    const done = await until('run finished by the second worker', runEnded(run.id), 60_000, second.out);
    expect(done.error).toBeNull();
    expect(done.state).toBe('finished');

    const rows = await listRunIntervals(run.id);
    const starts = rows.map((r) => r.startsAt.toISOString());
    expect(new Set(starts).size).toBe(starts.length); // no interval twice
    expect([...starts].sort()).toEqual(run.intervalStarts.map((t) => new Date(t).toISOString()).sort()); // none missing
    expect(done.progress.intervalsDone).toBe(total);
    expect(done.progress.intervalsTotal).toBe(total);
    // The killed worker's chunk was finished by the other after its lease lapsed: nothing but
    // the sweep could have queued it (the dead worker's job stays 'active' for 20 minutes).
    const chunks = await listRunChunks(run.id);
    const taken = chunks.find((c) => c.first === orphan.first)!;
    expect(taken.attempts).toBeGreaterThanOrEqual(2);
    expect(pidOf(taken)).toBe(String(second.child.pid));
    expect(second.out()).toContain(`[worker] sweep: chunk ${orphan.first} of run ${run.id} had no live worker; queued it again`);
  }, 150_000);
});
