/**
 * The run driver: solves a run's intervals in order, stores each finished
 * interval (exactly once: unique (run, start), insert-or-ignore), and
 * writes progress as it goes. It resumes where a crashed attempt stopped —
 * intervals already stored are skipped — honours cancellation between and
 * within starts, and on a failure keeps what it finished and says why.
 *
 * The database work overlaps the solving and is batched: the data of the next
 * intervals are loaded (several per query) while this one is solved, and
 * finished intervals are written together at most every WRITE_EVERY_MS while
 * the next ones are solved (at most one write in flight; it is awaited before
 * the next write, before the run ends or is handed back, and a failed write
 * stops the run like a crash, which then redoes only what was not written).
 *
 * Cancelling stops further work and keeps what is finished. Each write brings
 * back whether someone asked to cancel, as does the progress timer within a
 * solve. Once the driver hears of one, no further interval begins; the solve in
 * hand is stopped at its next start, and is kept only if it completed anyway
 * (the solver says 'cancelled' when the stop cut it short). Every interval
 * finished before — also those solved but not yet written — is written, and
 * then the run ends as cancelled with its progress counted from the stored
 * rows. Writes go through only while this worker holds the run (not after it
 * ended or passed to another worker); a refused write ends the attempt
 * ('lost') without touching the run.
 *
 * With `chunk` it works one chunk of the run (a few intervals; db/repo/run-chunks.ts) while other
 * workers work the others: it holds the chunk, not the run, and its writes go through only
 * while it does; the worker that finishes the run's last chunk ends the run ('finished'), the
 * others answer 'chunk-done'. A cancelled run's chunks all stop at their next interval; the
 * last one to stop ends the run ('cancelled'), the others answer 'stopped'. A paused run's
 * chunks hear it the same way but complete the interval in hand, store it, let go of the chunk
 * and answer 'stopped' (resuming queues the chunks not done; src/runs/control.ts).
 *
 * The solver is passed in (src/runs/solver.ts binds the engine's multi-start
 * inverter), so the driver knows no physics.
 */
import { claimChunk, completeChunk, releaseChunk } from '@/db/repo/run-chunks';
import {
  claimRun,
  endRun,
  finishedIntervalStarts,
  releaseRun,
  reportProgress,
  saveRunIntervals,
  type RunHolder,
  type RunProgress,
  type RunRow,
} from '@/db/repo/runs';
import { PHASE } from './lifecycle';
import { loadRunContext } from './context';
import { countIntervalData, intervalLoader, type IntervalObservations } from './observations';
import type { IntervalCase, IntervalSolver, RunContext } from './types';
import type { RunIntervalEntry } from '@/db/repo/runs';

export interface ExecuteOptions {
  solve: IntervalSolver;
  workerId: string;
  /** Loads one interval's observations (default: from stored spectra, several intervals per query, or fits). */
  observe?: (ctx: RunContext, startsAt: Date) => Promise<IntervalObservations>;
  /** Minimum milliseconds between progress writes within an interval. Default 1000. */
  progressEveryMs?: number;
  /** Called after each stored interval, before the next one begins; throwing here simulates a crash (tests). */
  afterInterval?: (index: number) => void | Promise<void>;
  /** Seconds without a heartbeat after which a 'running' run counts as crashed. Default 30. */
  leaseSeconds?: number;
  /** After this many milliseconds the driver hands the run back after the current interval ('yielded'). */
  budgetMs?: number;
  /** Asked after each interval: true hands the run back at once ('yielded'), e.g. when the worker is shutting down. */
  yieldNow?: () => boolean;
  /**
   * Finished intervals are written together once this many milliseconds have passed since
   * the last write began (default WRITE_EVERY_MS; 0 writes each at once). With a hook
   * (afterInterval) each interval is written at once.
   */
  writeEveryMs?: number;
  /** Works only the chunk of the run whose first interval has this index (see the top). */
  chunk?: number;
}

/**
 * Quick intervals are written in batches, at most this often: one statement per batch costs
 * the database far less than one per interval, and a crash loses at most this much solving.
 */
export const WRITE_EVERY_MS = 500;
const MAX_BATCH = 64;

/**
 * 'yielded': the time slice ended with intervals left; queue a continuation job.
 * 'lost': a write (also the one that would end the run) was refused because the run is no longer
 * held by this worker (it ended, was swept or was taken over); nothing more is written, the run
 * is left as it is.
 */
export type ExecuteOutcome = 'finished' | 'cancelled' | 'failed' | 'yielded' | 'not-runnable' | 'lost' | 'chunk-done' | 'stopped';

/** What the driver holds: the whole run, or one chunk of it (indices `first` … `first + count - 1`). */
async function claim(runId: string, opts: ExecuteOptions, lease: number) {
  if (opts.chunk === undefined) {
    const run = await claimRun(runId, opts.workerId, lease);
    return run && { run, holder: opts.workerId as RunHolder, first: 0, count: run.intervalStarts.length };
  }
  const c = await claimChunk(runId, opts.chunk, opts.workerId, lease);
  return (
    c && {
      run: c.run as RunRow,
      holder: { workerId: opts.workerId, chunk: c.first } as RunHolder,
      first: c.first,
      count: c.count,
    }
  );
}

function eta(startedMs: number, done: number, total: number, doneThisAttempt: number): number | null {
  if (doneThisAttempt <= 0) return null;
  const perInterval = (Date.now() - startedMs) / 1000 / doneThisAttempt;
  return Math.round(perInterval * (total - done));
}

/**
 * Why an interval's result cannot count as solved: its best minimum has no
 * finite misfit (every start ended on a non-finite misfit). Null when it is fine
 * or when the interval was skipped for lack of data (no minima at all).
 */
export function nonFiniteBest(result: Record<string, unknown>): string | null {
  const minima = result.minima as { misfit?: unknown; stopReasons?: Record<string, number> }[] | undefined;
  if (!Array.isArray(minima) || minima.length === 0) return null;
  const best = minima[0];
  if (typeof best.misfit === 'number' && Number.isFinite(best.misfit)) return null;
  const reasons = Object.entries(best.stopReasons ?? {})
    .map(([k, n]) => `${k} ${n}`)
    .join(', ');
  return `no start reached a finite misfit (best minimum misfit ${String(best.misfit)}${reasons ? `; stop reasons: ${reasons}` : ''}), so there is no result to show`;
}

export async function executeRun(runId: string, opts: ExecuteOptions): Promise<ExecuteOutcome> {
  const lease = opts.leaseSeconds ?? 30;
  const held = await claim(runId, opts, lease);
  if (!held) return 'not-runnable';
  const { run, holder } = held;
  const chunk = opts.chunk === undefined ? null : { first: held.first, count: held.count };
  const every = opts.progressEveryMs ?? 1000;

  const total = run.intervalStarts.length;
  const startsTotal = (run.config as { starts?: number }).starts ?? 1;
  const progress: RunProgress = {
    ...run.progress,
    phase: 'loading the model, grid and stations',
    intervalsTotal: total,
    startsTotal,
    startsDone: 0,
  };
  let ctx: RunContext;
  try {
    ctx = await loadRunContext(run);
  } catch (e) {
    return (await endRun(
      runId,
      'failed',
      { ...progress, phase: 'failed' },
      `Could not prepare the run: ${(e as Error).message}`,
      holder,
    ))
      ? 'failed'
      : 'lost';
  }
  const finished = await finishedIntervalStarts(runId);
  const todo = run.intervalStarts
    .map((t, i) => ({ t, i }))
    .filter(({ t, i }) => i >= held.first && i < held.first + held.count && !finished.has(new Date(t).toISOString()));
  progress.intervalsDone = finished.size;
  const loader = intervalLoader(
    ctx.networkId,
    ctx.config,
    todo.map(({ t }) => new Date(t)),
  );
  const observe = opts.observe ?? ((_: RunContext, t: Date) => loader(t));
  const t0 = Date.now();
  let doneThisAttempt = 0;
  let cancelRequested = false; // heard from a write: no further interval begins
  let paused = false; // heard from a write: no further interval begins, the one in hand completes
  let lost = false; // a write was refused: the run is not ours any more
  let cancelled = false;
  let writing: Promise<unknown> = Promise.resolve();
  const writeEvery = opts.afterInterval ? 0 : (opts.writeEveryMs ?? WRITE_EVERY_MS);
  let pending: { entry: RunIntervalEntry; index: number }[] = [];
  let lastWrite = Date.now();
  const heard = (r: { cancelRequested: boolean; held: boolean; paused: boolean }) => {
    if (r.cancelRequested) cancelRequested = true;
    if (r.paused && chunk) paused = true; // only runs worked in chunks are paused
    if (!r.held) lost = true;
  };
  /**
   * Writes the finished intervals not yet written, after the write in flight — also once a
   * cancel request has been heard (what is finished is kept). Nothing once the run is lost.
   */
  const flush = async (): Promise<void> => {
    await writing; // one write in flight at a time; a failed write (or hook) ends the attempt here
    if (pending.length === 0 || lost) return;
    const batch = pending;
    pending = [];
    lastWrite = Date.now();
    writing = saveRunIntervals(
      runId,
      batch.map((b) => b.entry),
      { ...progress },
      holder,
    ).then(async (r) => {
      heard(r);
      if (r.held) for (const b of batch) await opts.afterInterval?.(b.index);
    });
    writing.catch(() => {}); // awaited at the next flush or at the end; the error surfaces there
    if (opts.afterInterval) await writing; // a hook runs before the next interval begins
  };
  const failWith = async (msg: string) => {
    await flush(); // what finished before stays stored
    await writing;
    if (lost) return 'lost' as const;
    return (await endRun(runId, 'failed', { ...progress, phase: 'failed' }, msg, holder))
      ? ('failed' as const)
      : ('lost' as const);
  };
  const load = (k: number) => {
    const p = k < todo.length ? observe(ctx, new Date(todo[k].t)) : null;
    p?.catch(() => {}); // awaited (and its error reported) when its turn comes
    return p;
  };
  let next = load(0);
  for (let k = 0; k < todo.length; k++) {
    if (cancelRequested || paused || lost) {
      cancelled = true;
      break;
    }
    const { t: startsAt, i } = todo[k];
    const label = new Date(startsAt).toISOString().slice(0, 16).replace('T', ' ');
    progress.phase = `interval ${label} UT: solving`;
    progress.startsDone = 0;
    let outcome;
    try {
      const obs = await next!;
      next = load(k + 1);
      const c: IntervalCase = { startsAt, ...obs };
      if (countIntervalData(obs) === 0) {
        outcome = { nData: 0, result: { skipped: 'no unflagged data for this interval', minima: [] } };
      } else {
        let stop = false;
        const t1 = Date.now();
        // Progress and heartbeat on a timer (the solver may run on worker threads and
        // keep this event loop free); the same write brings back a cancel request.
        const timer = setInterval(() => {
          reportProgress(runId, { ...progress }, holder).then(
            (r) => {
              heard(r);
              if (r.cancelRequested) stop = true;
            },
            () => {},
          );
        }, every);
        try {
          outcome = await opts.solve(ctx, c, {
            onStart(done, all) {
              progress.startsDone = done;
              progress.startsTotal = all;
              progress.phase = `interval ${label} UT: start ${done} of ${all}`;
            },
            shouldStop: () => stop || cancelRequested,
          });
        } finally {
          clearInterval(timer);
        }
        if (outcome !== 'cancelled') outcome = { ...outcome, seconds: (Date.now() - t1) / 1000 };
      }
    } catch (e) {
      return failWith(`Interval ${label} UT failed: ${e instanceof Error ? e.message : String(e)}`);
    }
    if (outcome === 'cancelled') {
      cancelled = true;
      break;
    } // cut short by the stop: not kept
    const notFinite = nonFiniteBest(outcome.result);
    if (notFinite) return failWith(`Interval ${label} UT failed: ${notFinite}`);
    // Finished (also when a cancel request came in while it completed): kept.
    progress.intervalsDone++;
    doneThisAttempt++;
    progress.etaSeconds = eta(t0, progress.intervalsDone, total, doneThisAttempt);
    progress.phase = `interval ${label} UT finished`;
    const seconds = (outcome as { seconds?: number }).seconds ?? 0;
    pending.push({ entry: { startsAt: new Date(startsAt), nData: outcome.nData, result: outcome.result, seconds }, index: i });
    if (cancelRequested || paused) {
      cancelled = k < todo.length - 1;
      break;
    }
    if (Date.now() - lastWrite >= writeEvery || pending.length >= MAX_BATCH) await flush();
    const sliceOver = opts.budgetMs !== undefined && Date.now() - t0 >= opts.budgetMs;
    if ((sliceOver || opts.yieldNow?.()) && k < todo.length - 1) {
      await flush();
      await writing;
      if (lost) return 'lost';
      if (cancelRequested || paused) {
        cancelled = true;
        break;
      }
      if (chunk) await releaseChunk(runId, chunk.first, opts.workerId, lease, PHASE.cancelledAfter);
      else await releaseRun(runId, opts.workerId, { ...progress, phase: 'waiting for the next time slice' });
      return 'yielded';
    }
  }
  await flush(); // every finished interval, also after a cancel request
  await writing;
  if (lost) return 'lost';
  if (chunk) {
    if (cancelled) {
      const r = await releaseChunk(runId, chunk.first, opts.workerId, lease, PHASE.cancelledAfter);
      return r === 'cancelled' ? 'cancelled' : 'stopped';
    }
    const r = await completeChunk(runId, chunk.first, opts.workerId, progress, lease, PHASE.cancelledAfter);
    return r === 'done' ? 'chunk-done' : r;
  }
  if (cancelled) {
    // The progress counts what is stored (a crashed attempt may have stored one more than it said).
    const kept = (await finishedIntervalStarts(runId)).size;
    const ended = await endRun(
      runId,
      'cancelled',
      {
        ...progress,
        intervalsDone: kept,
        startsDone: 0,
        phase: PHASE.cancelledAfter(kept, total),
        etaSeconds: null,
      },
      null,
      holder,
    );
    return ended ? 'cancelled' : 'lost';
  }
  const stored = await finishedIntervalStarts(runId);
  const ended = await endRun(
    runId,
    'finished',
    { ...progress, intervalsDone: stored.size, phase: 'finished', etaSeconds: 0 },
    null,
    holder,
  );
  return ended ? 'finished' : 'lost'; // taken over between the last write and here: the holder ends it
}
