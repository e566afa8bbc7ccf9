/**
 * Runs, their finished intervals and cached misfit surfaces.
 *
 * A run's intervals are written once each: (run, interval start) is unique and
 * the insert ignores a second copy, so a job that is retried after a crash can
 * redo an interval whose write it did not see without duplicating it. Nothing is
 * written to a run once it has ended (finished, failed or cancelled).
 */
import { and, asc, desc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import { getDb } from '../client';
import { cavityModels, runChunks, runIntervals, runs, runSurfaces, sourceGrids, type RunProgress } from '../schema/runs';
import { ENDED_STATES } from '@/src/runs/lifecycle';

export type RunRow = typeof runs.$inferSelect;
export type RunIntervalRow = typeof runIntervals.$inferSelect;
export type SurfaceRow = typeof runSurfaces.$inferSelect;
export type RunState = RunRow['state'];
export type { RunProgress };

export interface NewRun {
  networkId: string;
  name: string;
  config: Record<string, unknown>;
  modelId: string;
  gridId: string;
  engineVersion: string;
  intervalStarts: string[];
  startsPerInterval: number;
  createdBy: string | null;
}

export async function createRun(r: NewRun): Promise<RunRow> {
  const [row] = await getDb()
    .insert(runs)
    .values({
      networkId: r.networkId,
      name: r.name,
      config: r.config,
      modelId: r.modelId,
      gridId: r.gridId,
      engineVersion: r.engineVersion,
      intervalStarts: r.intervalStarts,
      createdBy: r.createdBy,
      progress: {
        phase: 'waiting for a worker',
        intervalsDone: 0,
        intervalsTotal: r.intervalStarts.length,
        startsDone: 0,
        startsTotal: r.startsPerInterval,
        etaSeconds: null,
      },
    })
    .returning();
  return row;
}

export async function getRun(networkId: string, runId: string): Promise<RunRow | null> {
  const [row] = await getDb()
    .select()
    .from(runs)
    .where(and(eq(runs.id, runId), eq(runs.networkId, networkId)));
  return row ?? null;
}

/** For the worker, which knows only the run id. */
export async function getRunById(runId: string): Promise<RunRow | null> {
  const [row] = await getDb().select().from(runs).where(eq(runs.id, runId));
  return row ?? null;
}

export interface RunListEntry {
  id: string;
  name: string;
  state: RunState;
  progress: RunProgress;
  createdAt: Date;
  finishedAt: Date | null;
  modelName: string;
  modelVersion: number;
  gridName: string;
  gridVersion: number;
  intervals: number;
  error: string | null;
}

export async function listRuns(networkId: string): Promise<RunListEntry[]> {
  const rows = await getDb()
    .select({
      r: runs,
      modelName: cavityModels.name,
      modelVersion: cavityModels.version,
      gridName: sourceGrids.name,
      gridVersion: sourceGrids.version,
    })
    .from(runs)
    .innerJoin(cavityModels, eq(cavityModels.id, runs.modelId))
    .innerJoin(sourceGrids, eq(sourceGrids.id, runs.gridId))
    .where(eq(runs.networkId, networkId))
    .orderBy(desc(runs.createdAt))
    .limit(500);
  return rows.map(({ r, ...m }) => ({
    id: r.id,
    name: r.name,
    state: r.state,
    progress: r.progress,
    createdAt: r.createdAt,
    finishedAt: r.finishedAt,
    intervals: r.intervalStarts.length,
    error: r.error,
    ...m,
  }));
}

/**
 * A worker takes a run: a queued run, or a running one whose worker has not
 * reported for `leaseSeconds` (it crashed), becomes running under this worker.
 * Returns null when the run is gone, ended, cancelled, or alive elsewhere.
 */
export async function claimRun(runId: string, workerId: string, leaseSeconds = 30): Promise<RunRow | null> {
  const [row] = await getDb()
    .update(runs)
    .set({
      state: 'running',
      workerId,
      heartbeatAt: new Date(),
      attempts: sql`${runs.attempts} + 1`,
      startedAt: sql`coalesce(${runs.startedAt}, now())`,
      error: null,
    })
    .where(
      and(
        eq(runs.id, runId),
        eq(runs.cancelRequested, false),
        sql`(${runs.state} = 'queued' or (${runs.state} = 'running' and (${runs.heartbeatAt} is null
      or ${runs.heartbeatAt} < now() - make_interval(secs => ${leaseSeconds}))))`,
      ),
    )
    .returning();
  return row ?? null;
}

/** A worker hands a run back (its time slice is over); the next job takes it up. */
export async function releaseRun(runId: string, workerId: string, progress: RunProgress): Promise<void> {
  // The heartbeat stays set (to the hand-back time): the sweep counts a queued run as lost only
  // once it has waited a whole lease without a pending job.
  await getDb()
    .update(runs)
    .set({ state: 'queued', workerId: null, heartbeatAt: new Date(), progress })
    .where(and(eq(runs.id, runId), eq(runs.workerId, workerId), eq(runs.state, 'running')));
}

/**
 * Who writes to a run: a worker id holds the whole run ('running' under its id); a chunk holder
 * holds one chunk of it (src/runs/chunks.ts), and any number of chunks may be held at once.
 */
export type RunHolder = string | { workerId: string; chunk: number };

const chunkOf = (holder: RunHolder | undefined) => (typeof holder === 'object' ? holder : null);

/**
 * Which run rows a write may touch: never an ended run; with a worker id, only while that
 * worker holds the run ('running' under its id); with a chunk holder, only while that worker
 * holds that chunk (not done). A worker that lost its lease (the run was swept, ended, handed on
 * or re-queued meanwhile, or its chunk was taken over) writes nothing.
 */
function writable(runId: string, holder?: RunHolder): SQL {
  const c = chunkOf(holder);
  return and(
    eq(runs.id, runId),
    sql`${runs.state} not in (${sql.join(
      ENDED_STATES.map((s) => sql`${s}`),
      sql`, `,
    )})`,
    ...(holder === undefined
      ? []
      : c
        ? [
            sql`exists (select 1 from ${runChunks} c where c.run_id = ${runs.id} and c.first_index = ${c.chunk}
              and c.worker_id = ${c.workerId} and c.done_at is null)`,
          ]
        : [eq(runs.state, 'running'), eq(runs.workerId, holder as string)]),
  )!;
}

/**
 * The progress a write stores. A chunk writes the whole run's progress: its intervals done are
 * the stored rows (`newRows` more than the statement sees), and the time left follows from the
 * run's rate since it started, which every worker on it adds to.
 */
function progressValue(runId: string, progress: RunProgress, holder: RunHolder | undefined, newRows: SQL): SQL {
  const given = sql`${JSON.stringify(progress)}::jsonb`;
  if (!chunkOf(holder)) return given;
  return sql`(select jsonb_set(jsonb_set(${given}, '{intervalsDone}', to_jsonb(d.n)), '{etaSeconds}',
    case when d.n > 0 and ${runs.startedAt} is not null
      then to_jsonb(round(extract(epoch from now() - ${runs.startedAt}) / d.n * (jsonb_array_length(${runs.intervalStarts}) - d.n)))
      else 'null'::jsonb end)
    from (select (select count(*) from ${runIntervals} where run_id = ${runId}) + ${newRows} as n) d)`;
}

/**
 * Writes progress and a heartbeat; returns whether someone asked to cancel or paused the run
 * (the chunk then stops after the interval in hand) and whether the write was taken (`held`: the run has not ended and, with a holder, that holder holds it).
 * A refused write counts as a cancel request: the caller has nothing more to do on this run.
 */
export async function reportProgress(
  runId: string,
  progress: RunProgress,
  holder?: RunHolder,
): Promise<{ cancelRequested: boolean; held: boolean; paused: boolean }> {
  const { cancelRequested, held, paused } = await saveRunIntervals(runId, [], progress, holder);
  return { cancelRequested, held, paused };
}

export interface RunIntervalEntry {
  startsAt: Date;
  nData: number;
  result: Record<string, unknown>;
  seconds: number;
}

/**
 * Stores finished intervals (each once: insert-or-ignore on (run, start)) and the
 * run's progress and heartbeat (also the chunk's, for a chunk holder) in a single statement
 * (one round trip: the insert runs as a data-modifying CTE), and brings back how many rows
 * were new and whether someone asked to cancel. A cancel request does not refuse the write (the
 * worker keeps what it finished before it stops), but an ended run (finished, failed,
 * cancelled) takes nothing more, and with a holder only that holder may write: the run row is
 * locked first (FOR UPDATE, so a concurrent end or hand-over is seen after it commits) and a
 * refused write stores nothing and answers `held: false`. With no entries it writes only the
 * progress and heartbeat.
 */
export async function saveRunIntervals(
  runId: string,
  entries: RunIntervalEntry[],
  progress: RunProgress,
  holder?: RunHolder,
): Promise<{ inserted: number; cancelRequested: boolean; held: boolean; paused: boolean }> {
  const values = sql.join(
    entries.map(
      (e) =>
        sql`(${e.startsAt.toISOString()}::timestamptz, ${e.nData}::integer, ${JSON.stringify(e.result)}::jsonb, ${e.seconds}::float8)`,
    ),
    sql`, `,
  );
  const insert =
    entries.length === 0
      ? sql`select 1 where false`
      : sql`insert into ${runIntervals} (run_id, starts_at, n_data, result, seconds)
      select held.id, v.starts_at, v.n_data, v.result, v.seconds
      from held cross join (values ${values}) as v (starts_at, n_data, result, seconds)
      on conflict (run_id, starts_at) do nothing
      returning 1`;
  const c = chunkOf(holder);
  const touch = c
    ? sql`, touch as (
      update ${runChunks} set heartbeat_at = now()
      where run_id = ${runId} and first_index = ${c.chunk} and worker_id = ${c.workerId} and exists (select 1 from held)
    )`
    : sql``;
  const rows = await getDb().execute<{ inserted: number; cancel_requested: boolean; paused: boolean }>(sql`
    with held as (
      select ${runs.id} as id from ${runs} where ${writable(runId, holder)} for update
    ), ins as (${insert})${touch}
    update ${runs} set progress = ${progressValue(runId, progress, holder, sql`(select count(*) from ins)`)}, heartbeat_at = now()
    where id in (select id from held)
    returning (select count(*)::int from ins) as inserted, cancel_requested, state = 'paused' as paused`);
  const row = rows[0];
  return row
    ? { inserted: row.inserted, cancelRequested: row.cancel_requested, held: true, paused: row.paused }
    : { inserted: 0, cancelRequested: true, held: false, paused: false };
}

/** One finished interval: saveRunIntervals with a single entry. */
export async function saveRunInterval(
  runId: string,
  entry: RunIntervalEntry,
  progress: RunProgress,
  holder?: RunHolder,
): Promise<{ inserted: boolean; cancelRequested: boolean; held: boolean }> {
  const r = await saveRunIntervals(runId, [entry], progress, holder);
  return { inserted: r.inserted > 0, cancelRequested: r.cancelRequested, held: r.held };
}

export async function listRunIntervals(runId: string): Promise<RunIntervalRow[]> {
  return getDb().select().from(runIntervals).where(eq(runIntervals.runId, runId)).orderBy(asc(runIntervals.startsAt));
}

/** A finished interval without the bulk of its result: the best minimum and the counts. */
export interface RunIntervalSummaryRow {
  startsAt: Date;
  nData: number;
  seconds: number;
  skipped: string | null;
  /** The best minimum's misfit, reduced chi-square, start count, sources and standard errors (null when none). */
  best: Record<string, unknown> | null;
  minimaCount: number;
  starts: number | null;
  unconverged: number | null;
  /** Free parameters of the interval's inversion (null for skipped intervals). */
  nParams: number | null;
  /** How the stored errors were made ('stated'; null for results stored before it was recorded). */
  errorBasis: string | null;
  /** Each series' chi2 and data count at the best minimum (null when not recorded). */
  seriesMisfits: unknown[] | null;
}

/**
 * Every finished interval of a run, cut down inside PostgreSQL (jsonb operators) so the bulk of
 * each result (every minimum's matrices, every start's end) never leaves the database.
 */
export async function listRunIntervalSummaries(runId: string): Promise<RunIntervalSummaryRow[]> {
  // jsonb_to_record reads each (TOASTed, compressed) result once; the operators then work on the
  // minima array in memory instead of fetching and decompressing the whole result per operator.
  const rows = await getDb().execute<{
    starts_at: string | Date;
    n_data: number;
    seconds: number;
    skipped: string | null;
    best: Record<string, unknown> | string | null;
    minima_count: number;
    starts: number | null;
    unconverged: number | null;
    n_params: number | null;
    error_basis: string | null;
    series_misfits: unknown[] | string | null;
  }>(sql`
    select ri.starts_at, ri.n_data, ri.seconds, x.skipped,
      case when x.minima -> 0 is not null then jsonb_build_object(
        'misfit', x.minima -> 0 -> 'misfit',
        'reducedChi2', x.minima -> 0 -> 'reducedChi2',
        'count', x.minima -> 0 -> 'count',
        'sources', x.minima -> 0 -> 'sources',
        'stdErrors', x.minima -> 0 -> 'stdErrors') end as best,
      coalesce(jsonb_array_length(case when jsonb_typeof(x.minima) = 'array' then x.minima end), 0)::int as minima_count,
      x.starts, x.unconverged, x."nParams" as n_params, x."errorBasis" as error_basis, x."seriesMisfits" as series_misfits
    from ${runIntervals} ri
    cross join lateral jsonb_to_record(ri.result)
      as x(skipped text, minima jsonb, starts int, unconverged int, "nParams" int, "errorBasis" text, "seriesMisfits" jsonb)
    where ri.run_id = ${runId}
    order by ri.starts_at`);
  return rows.map((r) => ({
    startsAt: new Date(r.starts_at),
    nData: Number(r.n_data),
    seconds: Number(r.seconds),
    skipped: r.skipped,
    best: typeof r.best === 'string' ? (JSON.parse(r.best) as Record<string, unknown>) : r.best,
    minimaCount: Number(r.minima_count),
    starts: r.starts === null ? null : Number(r.starts),
    unconverged: r.unconverged === null ? null : Number(r.unconverged),
    nParams: r.n_params === null ? null : Number(r.n_params),
    errorBasis: r.error_basis,
    seriesMisfits: typeof r.series_misfits === 'string' ? (JSON.parse(r.series_misfits) as unknown[]) : r.series_misfits,
  }));
}

/** One stored interval of a run, or null. */
export async function getRunInterval(runId: string, startsAt: Date): Promise<RunIntervalRow | null> {
  const rows = await getDb()
    .select()
    .from(runIntervals)
    .where(and(eq(runIntervals.runId, runId), eq(runIntervals.startsAt, startsAt)))
    .limit(1);
  return rows[0] ?? null;
}

export async function finishedIntervalStarts(runId: string): Promise<Set<string>> {
  const rows = await getDb().select({ t: runIntervals.startsAt }).from(runIntervals).where(eq(runIntervals.runId, runId));
  return new Set(rows.map((r) => r.t.toISOString()));
}

/**
 * Ends a run (finished, failed or cancelled) with its last progress and, for a failure, why.
 * Like every write of a run's progress: never a run that has already ended, and with a holder
 * only while that worker holds it. Returns whether the run was ended here.
 */
export async function endRun(
  runId: string,
  state: 'finished' | 'failed' | 'cancelled',
  progress: RunProgress | null,
  error: string | null = null,
  holder?: RunHolder,
): Promise<boolean> {
  const rows = await getDb()
    .update(runs)
    .set({
      state,
      error,
      finishedAt: new Date(),
      heartbeatAt: new Date(),
      ...(progress ? { progress } : {}),
    })
    .where(writable(runId, holder))
    .returning({ id: runs.id });
  return rows.length > 0;
}

/**
 * Marks a run as asked to stop (no worker claims it from then on; its worker stops at the
 * next check). Returns the run, or null when not in this network.
 */
export async function requestCancel(networkId: string, runId: string): Promise<RunRow | null> {
  const [row] = await getDb()
    .update(runs)
    .set({ cancelRequested: true })
    .where(and(eq(runs.id, runId), eq(runs.networkId, networkId)))
    .returning();
  return row ?? null;
}

/** The run's progress with its phase replaced. */
const withPhase = (phase: string) => sql`jsonb_set(${runs.progress}, '{phase}', to_jsonb(${phase}::text))`;

/** Moves a run of this network that is in one of `from` (and meets `also`) with `set`, showing `phase`; null when it is not. */
async function moveRun(
  networkId: string,
  runId: string,
  from: readonly RunState[],
  phase: string,
  set: Partial<typeof runs.$inferInsert>,
  also?: SQL,
): Promise<RunRow | null> {
  const [row] = await getDb()
    .update(runs)
    .set({ ...set, progress: withPhase(phase) })
    .where(and(eq(runs.id, runId), eq(runs.networkId, networkId), inArray(runs.state, [...from]), also))
    .returning();
  return row ?? null;
}

/**
 * Pauses a run that is in one of `from` and not asked to stop: no worker claims its chunks
 * from then on, and each chunk at work hears it at its next write. Null when it is not in such a state.
 */
export const pauseRunRow = (networkId: string, runId: string, from: readonly RunState[], phase: string) =>
  moveRun(networkId, runId, from, phase, { state: 'paused' }, eq(runs.cancelRequested, false));

/** Puts a run that is in one of `from` back in the queue, showing `phase`; its finished intervals are kept. */
export const requeueRun = (networkId: string, runId: string, from: readonly RunState[], phase: string) =>
  moveRun(networkId, runId, from, phase, { state: 'queued', cancelRequested: false, error: null, finishedAt: null });

export async function deleteRun(networkId: string, runId: string): Promise<boolean> {
  const rows = await getDb()
    .delete(runs)
    .where(and(eq(runs.id, runId), eq(runs.networkId, networkId)))
    .returning({ id: runs.id });
  return rows.length > 0;
}

/** Runs stuck in 'running' whose worker stopped reporting (for the sweeper to requeue). */
export async function staleRunningRuns(olderThanS: number): Promise<RunRow[]> {
  return getDb()
    .select()
    .from(runs)
    .where(and(eq(runs.state, 'running'), sql`${runs.heartbeatAt} < now() - make_interval(secs => ${olderThanS})`));
}

/**
 * The crash sweep's part in the database. Under a transaction-scoped advisory lock (so two
 * workers sweeping at once cannot both act on a run) it finds runs whose lease has lapsed —
 * 'running' with no heartbeat for `leaseSeconds`, or 'queued' for that long since launch or
 * hand-back — that have no pending (created or retry) job on `queue` in pg-boss's table, and
 * calls `send(runId)` for each while the lock is held. A lapsed running (or paused) run whose
 * cancel was asked for is ended as cancelled instead (no worker will come back to stop it); a
 * paused run is otherwise left alone (resuming queues it).
 *
 * A run worked in chunks is continued chunk by chunk: each chunk not done of a run that goes on,
 * whose holder's heartbeat has lapsed (or that has no holder and has waited a lease) and that
 * has no pending job, gets `sendChunk(runId, first)`.
 */
export async function sweepLapsedRuns(
  leaseSeconds: number,
  queue: string,
  send: (runId: string) => Promise<void>,
  sendChunk: (runId: string, first: number) => Promise<void>,
  cancelledPhase: string,
  bossSchema = 'pgboss',
): Promise<{ continued: string[]; cancelled: string[]; chunks: { runId: string; first: number }[] }> {
  return getDb().transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext('cavitas-run-sweep'))`);
    const before = sql`now() - make_interval(secs => ${leaseSeconds})`;
    const lapsed = sql`(
      (${runs.state} in ('running', 'paused') and (${runs.heartbeatAt} is null or ${runs.heartbeatAt} < ${before}))
      or (${runs.state} = 'queued' and coalesce(${runs.heartbeatAt}, ${runs.createdAt}) < ${before}))`;
    const ended = await tx
      .update(runs)
      .set({
        state: 'cancelled',
        finishedAt: new Date(),
        heartbeatAt: new Date(),
        progress: withPhase(cancelledPhase),
      })
      .where(and(eq(runs.cancelRequested, true), lapsed))
      .returning({ id: runs.id });
    const jobs = sql.raw(`${bossSchema}.job`);
    const rows = await tx
      .select({ id: runs.id })
      .from(runs)
      .where(
        and(
          eq(runs.cancelRequested, false),
          lapsed,
          sql`not exists (select 1 from ${runChunks} c where c.run_id = ${runs.id})`,
          sql`not exists (
      select 1 from ${jobs} j where j.name = ${queue} and j.state in ('created', 'retry') and j.data->>'runId' = ${runs.id}::text)`,
        ),
      );
    for (const r of rows) await send(r.id);
    // A chunk without a holder counts as lost only once its job is neither waiting nor being
    // taken up (fetched within the lease: a worker that died between fetching and claiming
    // leaves its job 'active' until pg-boss expires it).
    const chunks = await tx.execute<{ run_id: string; first_index: number }>(sql`
      select c.run_id, c.first_index from ${runChunks} c join ${runs} r on r.id = c.run_id
      where c.done_at is null and r.state in ('queued', 'running') and not r.cancel_requested
        and ((c.worker_id is not null and c.heartbeat_at < ${before})
          or (c.worker_id is null and coalesce(c.heartbeat_at, r.created_at) < ${before}
            and not exists (select 1 from ${jobs} j where j.name = ${queue} and j.state = 'active' and j.started_on >= ${before}
              and j.data->>'runId' = c.run_id::text and (j.data->>'first')::int = c.first_index)))
        and not exists (select 1 from ${jobs} j where j.name = ${queue} and j.state in ('created', 'retry')
          and j.data->>'runId' = c.run_id::text and (j.data->>'first')::int = c.first_index)
      order by c.run_id, c.first_index`);
    const sent = chunks.map((c) => ({ runId: c.run_id, first: Number(c.first_index) }));
    for (const c of sent) await sendChunk(c.runId, c.first);
    return { continued: rows.map((r) => r.id), cancelled: ended.map((r) => r.id), chunks: sent };
  });
}

// ── misfit surfaces ────────────────────────────────────────────────────────

/** Returns the cached surface for this spec, creating a queued one if none exists. */
export async function getOrCreateSurface(
  runId: string,
  specKey: string,
  spec: Record<string, unknown>,
): Promise<{ row: SurfaceRow; created: boolean }> {
  const ins = await getDb()
    .insert(runSurfaces)
    .values({ runId, specKey, spec })
    .onConflictDoNothing({ target: [runSurfaces.runId, runSurfaces.specKey] })
    .returning();
  if (ins.length) return { row: ins[0], created: true };
  const [row] = await getDb()
    .select()
    .from(runSurfaces)
    .where(and(eq(runSurfaces.runId, runId), eq(runSurfaces.specKey, specKey)));
  return { row, created: false };
}

export async function getSurface(runId: string, surfaceId: string): Promise<SurfaceRow | null> {
  const [row] = await getDb()
    .select()
    .from(runSurfaces)
    .where(and(eq(runSurfaces.id, surfaceId), eq(runSurfaces.runId, runId)));
  return row ?? null;
}

export async function getSurfaceById(surfaceId: string): Promise<SurfaceRow | null> {
  const [row] = await getDb().select().from(runSurfaces).where(eq(runSurfaces.id, surfaceId));
  return row ?? null;
}

export async function setSurface(
  surfaceId: string,
  state: SurfaceRow['state'],
  result: Record<string, unknown> | null = null,
  error: string | null = null,
): Promise<void> {
  await getDb()
    .update(runSurfaces)
    .set({
      state,
      result,
      error,
      finishedAt: state === 'ready' || state === 'failed' ? new Date() : null,
    })
    .where(eq(runSurfaces.id, surfaceId));
}

/** Lets a failed surface be asked for again. */
export async function resetSurface(surfaceId: string): Promise<void> {
  await getDb().update(runSurfaces).set({ state: 'queued', error: null, result: null }).where(eq(runSurfaces.id, surfaceId));
}

/**
 * Timings of recently finished intervals (30 days, newest first, at most `limit`) of this
 * network's runs of one kind (every network's on this server when `networkId` is null): the
 * raw material of the launch preview's time estimate (src/runs/time-estimate.ts).
 */
export async function recentIntervalTimings(networkId: string | null, observables: 'spectrum' | 'modes', limit = 400) {
  const rows = await getDb()
    .select({
      runId: runIntervals.runId,
      startsAt: runIntervals.startsAt,
      seconds: runIntervals.seconds,
      nData: runIntervals.nData,
      nParams: sql<number | null>`(${runIntervals.result}->>'nParams')::float8`,
      starts: sql<number | null>`(${runIntervals.result}->>'starts')::float8`,
    })
    .from(runIntervals)
    .innerJoin(runs, eq(runs.id, runIntervals.runId))
    .where(
      and(
        networkId === null ? undefined : eq(runs.networkId, networkId),
        sql`${runIntervals.nData} > 0 and ${runIntervals.seconds} > 0`,
        sql`coalesce(${runs.config}->'observables'->>'kind', 'spectrum') = ${observables}`,
        sql`${runIntervals.createdAt} > now() - interval '30 days'`,
      ),
    )
    .orderBy(desc(runIntervals.createdAt))
    .limit(limit);
  return rows.map((r) => ({ ...r, nParams: Number(r.nParams ?? 0), starts: Number(r.starts ?? 0) }));
}
