/**
 * The chunks of a run: a few consecutive intervals each, worked by separate jobs so that any
 * number of workers work on one run at once. A chunk is held by one worker at a time (its id
 * and heartbeat; a heartbeat older than the lease lets another worker take the chunk over).
 * The intervals themselves are stored once each by the unique (run, start) of run_intervals.
 *
 * Every change that may end the run (the last chunk done, a cancelled run's last chunk
 * stopped) locks the run row first and decides under that lock, so exactly one of the
 * workers ends it, however many finish at the same moment. Lock order everywhere: the run
 * row, then its chunk rows.
 */
import { and, asc, eq, isNull, sql } from 'drizzle-orm';
import { getDb } from '../client';
import { runChunks, runIntervals, runs } from '../schema/runs';
import type { RunProgress, RunRow } from './runs';
import { ENDED_STATES } from '@/src/runs/lifecycle';

type Tx = Parameters<Parameters<ReturnType<typeof getDb>['transaction']>[0]>[0];

const lapsed = (leaseSeconds: number) => sql`now() - make_interval(secs => ${leaseSeconds})`;
const notEnded = sql`${runs.state} not in (${sql.join(
  ENDED_STATES.map((s) => sql`${s}`),
  sql`, `,
)})`;

/** Cuts a run's `total` intervals into chunks of `size` (the last one shorter); returns each chunk's first index. */
export async function createRunChunks(runId: string, total: number, size: number): Promise<number[]> {
  const firsts = Array.from({ length: Math.ceil(total / size) }, (_, k) => k * size);
  if (firsts.length === 0) return [];
  await getDb()
    .insert(runChunks)
    .values(firsts.map((first) => ({ runId, first, count: Math.min(size, total - first) })))
    .onConflictDoNothing();
  return firsts;
}

/** Whether the run is worked in chunks (runs launched before chunks were introduced are not). */
export async function hasChunks(runId: string): Promise<boolean> {
  const rows = await getDb().select({ first: runChunks.first }).from(runChunks).where(eq(runChunks.runId, runId)).limit(1);
  return rows.length > 0;
}

/** The first index of each chunk not yet done, in order; with `release`, their holders are cleared (a re-run). */
export async function undoneChunks(runId: string, release = false): Promise<number[]> {
  const where = and(eq(runChunks.runId, runId), isNull(runChunks.doneAt));
  const rows = release
    ? await getDb().update(runChunks).set({ workerId: null }).where(where).returning({ first: runChunks.first })
    : await getDb().select({ first: runChunks.first }).from(runChunks).where(where);
  return rows.map((r) => r.first).sort((a, b) => a - b);
}

export interface ClaimedChunk {
  run: RunRow;
  first: number;
  count: number;
}

/**
 * A worker takes a chunk: one not done whose holder is gone (none, or no heartbeat for
 * `leaseSeconds`), of a run that has not ended, is not paused and is not asked to stop. The run becomes
 * running. Null when the chunk is done, held alive elsewhere, or its run cannot go on.
 */
export async function claimChunk(
  runId: string,
  first: number,
  workerId: string,
  leaseSeconds: number,
): Promise<ClaimedChunk | null> {
  return getDb().transaction(async (tx) => {
    const [run] = await tx
      .select({ id: runs.id })
      .from(runs)
      .where(and(eq(runs.id, runId), eq(runs.cancelRequested, false), notEnded, sql`${runs.state} <> 'paused'`))
      .for('update');
    if (!run) return null;
    const [chunk] = await tx
      .update(runChunks)
      .set({ workerId, heartbeatAt: new Date(), attempts: sql`${runChunks.attempts} + 1` })
      .where(
        and(
          eq(runChunks.runId, runId),
          eq(runChunks.first, first),
          isNull(runChunks.doneAt),
          sql`(${runChunks.workerId} is null or ${runChunks.heartbeatAt} < ${lapsed(leaseSeconds)})`,
        ),
      )
      .returning();
    if (!chunk) return null;
    const [row] = await tx
      .update(runs)
      .set({
        state: 'running',
        heartbeatAt: new Date(),
        // A run's attempt is its most tried chunk's: 1 until a chunk is retried or taken over.
        attempts: sql`greatest(${runs.attempts}, ${chunk.attempts})`,
        startedAt: sql`coalesce(${runs.startedAt}, now())`,
        error: null,
      })
      .where(eq(runs.id, runId))
      .returning();
    return { run: row, first: chunk.first, count: chunk.count };
  });
}

/** Whether another worker holds the chunk alive (its job should be tried again after the lease). */
export async function chunkHeldElsewhere(runId: string, first: number, leaseSeconds: number): Promise<boolean> {
  const rows = await getDb()
    .select({ first: runChunks.first })
    .from(runChunks)
    .innerJoin(runs, eq(runs.id, runChunks.runId))
    .where(
      and(
        eq(runChunks.runId, runId),
        eq(runChunks.first, first),
        isNull(runChunks.doneAt),
        sql`${runChunks.heartbeatAt} >= ${lapsed(leaseSeconds)}`,
        eq(runs.cancelRequested, false),
        notEnded,
      ),
    );
  return rows.length > 0;
}

/**
 * Ends a run that was asked to stop once no chunk of it is held alive (none within
 * `leaseSeconds`) and no worker holds it whole; its progress counts the stored intervals.
 * Call with the run row locked. Returns whether it ended the run.
 */
async function endCancelledIfIdle(
  tx: Tx,
  runId: string,
  leaseSeconds: number,
  phase: (kept: number, total: number) => string,
): Promise<boolean> {
  const [run] = await tx
    .select({ progress: runs.progress, total: sql<number>`jsonb_array_length(${runs.intervalStarts})` })
    .from(runs)
    .where(
      and(
        eq(runs.id, runId),
        eq(runs.cancelRequested, true),
        isNull(runs.workerId),
        notEnded,
        sql`not exists (select 1 from ${runChunks} c where c.run_id = ${runId} and c.done_at is null
          and c.worker_id is not null and c.heartbeat_at >= ${lapsed(leaseSeconds)})`,
      ),
    );
  if (!run) return false;
  const [{ kept }] = await tx
    .select({ kept: sql<number>`count(*)::int` })
    .from(runIntervals)
    .where(eq(runIntervals.runId, runId));
  const progress: RunProgress = {
    ...run.progress,
    intervalsDone: kept,
    startsDone: 0,
    phase: phase(kept, Number(run.total)),
    etaSeconds: null,
  };
  await tx
    .update(runs)
    .set({ state: 'cancelled', progress, finishedAt: new Date(), heartbeatAt: new Date() })
    .where(eq(runs.id, runId));
  return true;
}

const lockRun = (tx: Tx, runId: string) => tx.select({ id: runs.id }).from(runs).where(eq(runs.id, runId)).for('update');

/** A cancel request reached a run whose chunks are all waiting or gone: it ends now (true) instead of by a worker. */
export async function settleCancelledRun(
  runId: string,
  leaseSeconds: number,
  phase: (kept: number, total: number) => string,
): Promise<boolean> {
  return getDb().transaction(async (tx) => {
    await lockRun(tx, runId);
    return endCancelledIfIdle(tx, runId, leaseSeconds, phase);
  });
}

/**
 * A worker lets go of its chunk without finishing it (the run was asked to stop, or the worker
 * is shutting down). When the run was asked to stop and this was its last live chunk, the run
 * ends as cancelled here: 'cancelled'; else 'released'.
 */
export async function releaseChunk(
  runId: string,
  first: number,
  workerId: string,
  leaseSeconds: number,
  phase: (kept: number, total: number) => string,
): Promise<'cancelled' | 'released'> {
  return getDb().transaction(async (tx) => {
    await lockRun(tx, runId);
    await tx
      .update(runChunks)
      .set({ workerId: null, heartbeatAt: new Date() })
      .where(and(eq(runChunks.runId, runId), eq(runChunks.first, first), eq(runChunks.workerId, workerId)));
    return (await endCancelledIfIdle(tx, runId, leaseSeconds, phase)) ? 'cancelled' : 'released';
  });
}

/**
 * A worker's chunk is done (its intervals stored). The worker that marks the run's last chunk
 * done ends the run as finished, with its progress counting the stored intervals: 'finished'.
 * 'done' when other chunks remain; 'cancelled' when the run was asked to stop and this was its
 * last live chunk; 'lost' when the chunk was no longer this worker's (taken over) or the run
 * had ended.
 */
export async function completeChunk(
  runId: string,
  first: number,
  workerId: string,
  progress: RunProgress,
  leaseSeconds: number,
  cancelledPhase: (kept: number, total: number) => string,
): Promise<'finished' | 'done' | 'cancelled' | 'lost'> {
  return getDb().transaction(async (tx) => {
    const [run] = await tx
      .select({ id: runs.id })
      .from(runs)
      .where(and(eq(runs.id, runId), notEnded))
      .for('update');
    if (!run) return 'lost';
    const marked = await tx
      .update(runChunks)
      .set({ doneAt: new Date(), heartbeatAt: new Date() })
      .where(
        and(eq(runChunks.runId, runId), eq(runChunks.first, first), eq(runChunks.workerId, workerId), isNull(runChunks.doneAt)),
      )
      .returning({ first: runChunks.first });
    if (marked.length === 0) return 'lost';
    const left = await tx
      .select({ first: runChunks.first })
      .from(runChunks)
      .where(and(eq(runChunks.runId, runId), isNull(runChunks.doneAt)))
      .limit(1);
    if (left.length === 0) {
      const [{ kept }] = await tx
        .select({ kept: sql<number>`count(*)::int` })
        .from(runIntervals)
        .where(eq(runIntervals.runId, runId));
      await tx
        .update(runs)
        .set({
          state: 'finished',
          error: null,
          finishedAt: new Date(),
          heartbeatAt: new Date(),
          progress: { ...progress, intervalsDone: kept, phase: 'finished', etaSeconds: 0 },
        })
        .where(eq(runs.id, runId));
      return 'finished';
    }
    return (await endCancelledIfIdle(tx, runId, leaseSeconds, cancelledPhase)) ? 'cancelled' : 'done';
  });
}

/**
 * How many workers are on the run now: distinct holders of its chunks with a heartbeat within
 * `leaseSeconds`, or 1 while a single worker holds the whole run alive.
 */
export async function liveWorkers(runId: string, leaseSeconds: number): Promise<number> {
  const [row] = await getDb().execute<{ n: number }>(sql`
    select (select count(distinct c.worker_id) from ${runChunks} c
      where c.run_id = ${runId} and c.done_at is null and c.worker_id is not null and c.heartbeat_at >= ${lapsed(leaseSeconds)})
      + (select count(*) from ${runs} r
      where r.id = ${runId} and r.state = 'running' and r.worker_id is not null and r.heartbeat_at >= ${lapsed(leaseSeconds)}) as n`);
  return Number(row?.n ?? 0);
}

/** The chunks of a run in order (tests and the benchmark look at them). */
export async function listRunChunks(runId: string) {
  return getDb().select().from(runChunks).where(eq(runChunks.runId, runId)).orderBy(asc(runChunks.first));
}
