/**
 * A run worked in chunks by several workers at once, against the throwaway PostgreSQL and the
 * real engine: the split at launch (one job per chunk), two workers on one run storing every
 * interval exactly once and ending the run exactly once with the same minima as one worker
 * solving the run whole, a chunk that two workers reach at the same moment (one holds it), a
 * chunk taken over after its holder's lease lapsed (the old holder's writes refused), a
 * cancel that reaches every chunk, a re-run that queues only what is left, and a pause that
 * reaches every chunk, then a resume that finishes with the results of an uninterrupted run.
 */
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { closeDatabase, resetDatabase } from '@/test/helpers/db';
import { getBoss } from '@/db/jobs';
import { getRunById, listRunIntervals, saveRunIntervals } from '@/db/repo/runs';
import { claimChunk, listRunChunks, liveWorkers } from '@/db/repo/run-chunks';
import { launchRun } from '@/src/runs/launch';
import { executeRun, type ExecuteOutcome } from '@/src/runs/execute';
import { engineSolver } from '@/src/runs/solver';
import { cancelRun, rerunRun, setRunPaused } from '@/src/runs/control';
import { getRunView } from '@/src/runs/results';
import { RUN_QUEUE } from '@/src/runs/queues';
import type { IntervalSolver } from '@/src/runs/types';
import { setEnv } from '@/src/settings';
import type { InversionResult } from '@/src/engine/inverse/types';
import { makeRunWorld, TRUTH } from './world';

setEnv('CAVITAS_RUN_THREADS', '1');
setEnv('CAVITAS_RUN_CHUNK', '3');

type World = Awaited<ReturnType<typeof makeRunWorld>>;

/** Launches the world's run with its jobs taken off the queue (the test plays the workers). */
async function launchDrained(w: World) {
  const boss = await getBoss();
  await boss.purgeQueue(RUN_QUEUE);
  const run = await launchRun(w.networkId, w.userId, w.config);
  const jobs = await boss.fetch<{ runId: string; first?: number }>(RUN_QUEUE, { batchSize: 100 });
  return { run, jobs };
}

/** A worker: takes chunk after chunk from the shared list until none is left. */
async function worker(runId: string, workerId: string, firsts: number[], solve: IntervalSolver = engineSolver) {
  const outcomes: ExecuteOutcome[] = [];
  for (let first = firsts.shift(); first !== undefined; first = firsts.shift())
    outcomes.push(await executeRun(runId, { solve, workerId, chunk: first, writeEveryMs: 0 }));
  return outcomes;
}

/**
 * A solver that holds two workers at known points: each worker's first interval waits until
 * both workers are at work, every later one until `release()` (called once a cancel or pause
 * has been asked for); then the engine solves it. `solvedAfter()` counts the solves begun after the release.
 */
function gatedSolver() {
  let started = 0;
  let released = false;
  let solvedAfter = 0;
  let bothAtWork = () => {};
  const twoAtWork = new Promise<void>((r) => (bothAtWork = r));
  let open = () => {};
  const opened = new Promise<void>((r) => (open = r));
  const solve: IntervalSolver = async (ctx, c, h) => {
    started++;
    if (started === 2) bothAtWork();
    await (started <= 2 ? twoAtWork : opened);
    if (released) solvedAfter++;
    return engineSolver(ctx, c, h);
  };
  const release = () => {
    released = true;
    open();
  };
  return { solve, twoAtWork, release, solvedAfter: () => solvedAfter };
}

/** Two workers sharing the chunks that begin at `firsts`. */
const twoWorkers = (runId: string, solve: IntervalSolver, firsts: number[]) => {
  return Promise.all([worker(runId, 'worker-a', firsts, solve), worker(runId, 'worker-b', firsts, solve)]);
};

const bestOf = (rows: Awaited<ReturnType<typeof listRunIntervals>>) =>
  rows.map((r) => ({ t: r.startsAt.toISOString(), minima: (r.result as { minima: unknown[] }).minima }));

describe('runs worked in chunks', () => {
  beforeEach(resetDatabase);
  afterAll(closeDatabase);

  it('splits a launched run into chunks, one job each', async () => {
    const w = await makeRunWorld(7);
    const { run, jobs } = await launchDrained(w);
    const chunks = await listRunChunks(run.id);
    expect(chunks.map((c) => [c.first, c.count])).toEqual([
      [0, 3],
      [3, 3],
      [6, 1],
    ]);
    expect(jobs.map((j) => j.data).sort((a, b) => a.first! - b.first!)).toEqual([
      { runId: run.id, first: 0 },
      { runId: run.id, first: 3 },
      { runId: run.id, first: 6 },
    ]);
  });

  it('two workers share a run: every interval once, the run ended once, the minima of one worker solving it whole', async () => {
    const w = await makeRunWorld(7);
    const { run } = await launchDrained(w);
    const firsts = (await listRunChunks(run.id)).map((c) => c.first);
    const [a, b] = await Promise.all([worker(run.id, 'worker-a', firsts), worker(run.id, 'worker-b', firsts)]);
    const outcomes = [...a, ...b];
    expect(outcomes.filter((o) => o === 'finished')).toHaveLength(1);
    expect(outcomes.filter((o) => o === 'chunk-done')).toHaveLength(2);
    expect(a.length).toBeGreaterThan(0);
    expect(b.length).toBeGreaterThan(0);
    const end = (await getRunById(run.id))!;
    expect(end.state).toBe('finished');
    expect(end.progress.intervalsDone).toBe(7);
    const rows = await listRunIntervals(run.id);
    expect(rows.map((r) => r.startsAt.toISOString())).toEqual(run.intervalStarts.map((t) => new Date(t).toISOString()));
    expect(new Set((await listRunChunks(run.id)).map((c) => c.workerId))).toEqual(new Set(['worker-a', 'worker-b']));
    for (const r of rows) {
      // Noise-free data made by the forward model at the true source: chi2 = 0 there (least
      // squares on exact data, Press et al., Numerical Recipes §15.5), found in every interval.
      const best = (r.result as unknown as InversionResult).minima[0];
      expect(best.misfit).toBeLessThan(1e-6);
      expect(best.sources[0].lat).toBeCloseTo(TRUTH.lat, 3);
      expect(best.sources[0].lon).toBeCloseTo(TRUTH.lon, 3);
    }

    // The same run solved whole by one worker (the driver without chunks) gives the same minima:
    // the result of an interval depends on its data, the seed and the start count alone.
    const whole = await launchDrained(w);
    expect(await executeRun(whole.run.id, { solve: engineSolver, workerId: 'alone' })).toBe('finished');
    expect(bestOf(rows)).toEqual(bestOf(await listRunIntervals(whole.run.id)));
  });

  it('a chunk reached by two workers at once is worked by one; the other finds it held', async () => {
    const w = await makeRunWorld(3);
    const { run } = await launchDrained(w);
    const both = await Promise.all(
      ['twin-1', 'twin-2'].map((id) => executeRun(run.id, { solve: engineSolver, workerId: id, chunk: 0, writeEveryMs: 0 })),
    );
    expect([...both].sort()).toEqual(['finished', 'not-runnable']);
    expect(await listRunIntervals(run.id)).toHaveLength(3);
  });

  it('a chunk whose holder stopped reporting is taken over after the lease; the old holder writes nothing more', async () => {
    const w = await makeRunWorld(3);
    const { run } = await launchDrained(w);
    expect(await claimChunk(run.id, 0, 'vanished', 1)).not.toBeNull();
    expect(await liveWorkers(run.id, 60)).toBe(1);
    // Within the lease the chunk stays with its holder.
    expect(await executeRun(run.id, { solve: engineSolver, workerId: 'early', chunk: 0, leaseSeconds: 60 })).toBe('not-runnable');
    await new Promise((r) => setTimeout(r, 1_200));
    expect(await liveWorkers(run.id, 1)).toBe(0);
    expect(await executeRun(run.id, { solve: engineSolver, workerId: 'successor', chunk: 0, leaseSeconds: 1 })).toBe('finished');
    const late = await saveRunIntervals(
      run.id,
      [{ startsAt: new Date(run.intervalStarts[0]), nData: 1, result: { minima: [] }, seconds: 0 }],
      (await getRunById(run.id))!.progress,
      { workerId: 'vanished', chunk: 0 },
    );
    expect(late).toEqual({ inserted: 0, cancelRequested: true, held: false, paused: false });
    const chunk = (await listRunChunks(run.id))[0];
    expect(chunk.workerId).toBe('successor');
    expect(chunk.attempts).toBe(2);
  });

  it('a cancel reaches every chunk at work; the last to stop ends the run, and a re-run queues only what is left', async () => {
    const w = await makeRunWorld(9);
    const { run } = await launchDrained(w);
    const gate = gatedSolver();
    const working = twoWorkers(run.id, gate.solve, [0, 3, 6]);
    await gate.twoAtWork;
    expect((await getRunView(w.networkId, run.id)).run.workers).toBe(2); // what the run page shows
    await cancelRun(w.networkId, run.id, null);
    gate.release();
    const outcomes = (await working).flat();
    // Each worker stops its chunk at its next check (it may complete the interval in hand), and
    // the chunk left waiting is not taken up.
    expect(outcomes.filter((o) => o === 'cancelled')).toHaveLength(1);
    expect(outcomes.filter((o) => o === 'cancelled' || o === 'stopped' || o === 'chunk-done')).toHaveLength(2);
    expect(outcomes.filter((o) => o === 'not-runnable')).toHaveLength(1);
    // At most the interval in hand and one begun before the write that brought the cancel back, per worker.
    expect(gate.solvedAfter()).toBeLessThanOrEqual(4);
    const end = (await getRunById(run.id))!;
    expect(end.state).toBe('cancelled');
    const kept = await listRunIntervals(run.id);
    expect(end.progress.intervalsDone).toBe(kept.length);
    expect(kept.length).toBeLessThan(9);
    expect(await liveWorkers(run.id, 60)).toBe(0);

    const boss = await getBoss();
    await boss.purgeQueue(RUN_QUEUE);
    await rerunRun(w.networkId, run.id, null);
    const left = (await listRunChunks(run.id)).filter((c) => c.doneAt === null).map((c) => c.first);
    const jobs = await boss.fetch<{ runId: string; first?: number }>(RUN_QUEUE, { batchSize: 100 });
    expect(jobs.map((j) => j.data.first).sort()).toEqual(left);
    expect(left).toContain(6);
    expect((await worker(run.id, 'worker-c', [...left])).at(-1)).toBe('finished');
    const rows = await listRunIntervals(run.id);
    expect(rows.map((r) => r.startsAt.toISOString())).toEqual(run.intervalStarts.map((t) => new Date(t).toISOString()));
    expect((await getRunById(run.id))!.state).toBe('finished');
  });

  it('a cancel ends at once a running run none of whose chunks is in hand', async () => {
    const w = await makeRunWorld(6);
    const { run } = await launchDrained(w);
    expect(await worker(run.id, 'one-chunk', [0])).toEqual(['chunk-done']);
    expect((await getRunById(run.id))!.state).toBe('running');
    const row = await cancelRun(w.networkId, run.id, null);
    expect(row.state).toBe('cancelled');
    expect(row.progress.intervalsDone).toBe(3);
    expect(await executeRun(run.id, { solve: engineSolver, workerId: 'late', chunk: 3 })).toBe('not-runnable');
  });
  it('a pause reaches every chunk at work and no worker takes its chunks up; resuming ends with the results of an uninterrupted run', async () => {
    // Chunks of six: a worker hears the pause at the latest from the write of the interval
    // after the one in hand (the driver awaits a write before the next one), so no chunk ends.
    setEnv('CAVITAS_RUN_CHUNK', '6');
    const w = await makeRunWorld(15);
    const { run } = await launchDrained(w).finally(() => setEnv('CAVITAS_RUN_CHUNK', '3'));
    const gate = gatedSolver();
    const working = twoWorkers(run.id, gate.solve, [0, 6, 12]);
    await gate.twoAtWork;
    expect((await setRunPaused(w.networkId, run.id, true, null)).state).toBe('paused');
    gate.release();
    // Each worker completes the interval in hand, stores it and lets go of its chunk; the chunk
    // left waiting is not taken up while the run is paused.
    const outcomes = (await working).flat();
    expect([...outcomes].sort()).toEqual(['not-runnable', 'stopped', 'stopped']);
    const paused = (await getRunById(run.id))!;
    expect(paused.state).toBe('paused');
    expect(await liveWorkers(run.id, 60)).toBe(0);
    expect(await executeRun(run.id, { solve: engineSolver, workerId: 'eager', chunk: 12 })).toBe('not-runnable');
    const kept = await listRunIntervals(run.id);
    expect(kept.length).toBeGreaterThanOrEqual(2); // at least the interval in hand of each worker
    expect(kept.length).toBeLessThanOrEqual(6);
    // At most the interval in hand and one begun before the write that brought the pause back, per worker.
    expect(gate.solvedAfter()).toBeLessThanOrEqual(4);

    const boss = await getBoss();
    await boss.purgeQueue(RUN_QUEUE);
    expect((await setRunPaused(w.networkId, run.id, false, null)).state).toBe('queued');
    const left = (await listRunChunks(run.id)).filter((c) => c.doneAt === null).map((c) => c.first);
    const jobs = await boss.fetch<{ runId: string; first?: number }>(RUN_QUEUE, { batchSize: 100 });
    expect(jobs.map((j) => j.data.first).sort((x, y) => x! - y!)).toEqual(left);
    expect(left).toEqual([0, 6, 12]);
    const expected = run.intervalStarts.map((t) => new Date(t).toISOString());
    const resumed = await Promise.all([worker(run.id, 'worker-c', left), worker(run.id, 'worker-d', left)]);
    expect(resumed.flat().filter((o) => o === 'finished')).toHaveLength(1);
    const end = (await getRunById(run.id))!;
    expect(end.state).toBe('finished');
    expect(end.progress.intervalsDone).toBe(15);
    const rows = await listRunIntervals(run.id);
    expect(rows.map((r) => r.startsAt.toISOString())).toEqual(expected);

    // The same run worked without a pause stores the same minima for every interval.
    setEnv('CAVITAS_RUN_CHUNK', '6');
    const straight = await launchDrained(w).finally(() => setEnv('CAVITAS_RUN_CHUNK', '3'));
    expect((await worker(straight.run.id, 'straight', [0, 6, 12])).at(-1)).toBe('finished');
    expect(bestOf(rows)).toEqual(bestOf(await listRunIntervals(straight.run.id)));
  });
});
