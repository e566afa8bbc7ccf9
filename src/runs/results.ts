/**
 * Reading a run back: its configuration with the pinned model and grid, its
 * progress, and the stored result of every finished interval. Shared by the
 * run page, the API and the exports.
 */
import { getGrid } from '@/db/repo/grids';
import { getModel } from '@/db/repo/models';
import { getRun, getRunInterval, listRunIntervals, listRunIntervalSummaries, type RunRow } from '@/db/repo/runs';
import { notFound } from '@/src/server/errors';
import type { InversionResult, Minimum } from '@/src/engine/inverse/types';
import { runConfigSchema, type RunConfig } from './config';
import { regionSchema, type Region } from './grid-spec';

export interface IntervalView {
  /** The stored interval's id (names it in `export?what=case&interval=`). */
  id?: string;
  startsAt: string;
  nData: number;
  seconds: number;
  /** Null when the interval had no data (then `skipped` says why). */
  result: InversionResult | null;
  skipped?: string;
  /**
   * Set in a run summary (`getRunSummary`): `result` holds only the best minimum's misfit, reduced
   * chi-square, start count, sources and standard errors; `counts` says how many minima and starts there are.
   * The whole interval comes from `getIntervalView` (the API's `?interval=`).
   */
  brief?: true;
  counts?: { minima: number; starts: number | null; unconverged: number | null };
}

export interface RunView {
  run: Pick<RunRow, 'id' | 'name' | 'state' | 'progress' | 'error' | 'engineVersion' | 'attempts' | 'cancelRequested'> & {
    createdAt: string;
    startedAt: string | null;
    finishedAt: string | null;
    intervalStarts: string[];
  };
  config: RunConfig;
  model: { id: string; name: string; version: number; config: Record<string, unknown> };
  grid: { id: string; name: string; version: number; cellSizeDeg: number; regions: Region[] };
  intervals: IntervalView[];
}

const iso = (d: Date | null) => (d ? d.toISOString() : null);

async function runHead(networkId: string, runId: string): Promise<{ row: RunRow; head: Omit<RunView, 'intervals'> }> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  const [model, grid] = await Promise.all([getModel(networkId, run.modelId), getGrid(networkId, run.gridId)]);
  if (!model || !grid) throw notFound('The model or grid of this run is gone.');
  return {
    row: run,
    head: {
      run: {
        id: run.id,
        name: run.name,
        state: run.state,
        progress: run.progress,
        error: run.error,
        engineVersion: run.engineVersion,
        attempts: run.attempts,
        cancelRequested: run.cancelRequested,
        createdAt: run.createdAt.toISOString(),
        startedAt: iso(run.startedAt),
        finishedAt: iso(run.finishedAt),
        intervalStarts: run.intervalStarts,
      },
      config: runConfigSchema.parse(run.config),
      model: { id: model.id, name: model.name, version: model.version, config: model.config },
      grid: {
        id: grid.id,
        name: grid.name,
        version: grid.version,
        cellSizeDeg: grid.cellSizeDeg,
        regions: grid.regions.map((r) => regionSchema.parse(r)),
      },
    },
  };
}

function intervalOf(r: {
  id: string;
  startsAt: Date;
  nData: number;
  seconds: number;
  result: Record<string, unknown>;
}): IntervalView {
  const res = r.result as unknown as InversionResult & { skipped?: string };
  return {
    id: r.id,
    startsAt: r.startsAt.toISOString(),
    nData: r.nData,
    seconds: r.seconds,
    result: res.skipped ? null : res,
    ...(res.skipped ? { skipped: res.skipped } : {}),
  };
}

/** The whole run: every interval's full result (exports, surfaces; the API's `?detail=full`). */
export async function getRunView(networkId: string, runId: string): Promise<RunView> {
  const [{ head }, rows] = await Promise.all([runHead(networkId, runId), listRunIntervals(runId)]);
  return { ...head, intervals: rows.map(intervalOf) };
}

/**
 * What the run page and the run API send first: every interval's best minimum (misfit, sources,
 * standard errors) and counts, cut down in the database, and the whole result of the
 * interval the page opens on (the last solved one). Other intervals come from `getIntervalView`.
 */
export async function getRunSummary(networkId: string, runId: string): Promise<RunView> {
  const [{ row, head }, rows] = await Promise.all([runHead(networkId, runId), listRunIntervalSummaries(runId)]);
  const open = rows.filter((r) => !r.skipped && r.minimaCount > 0).at(-1);
  const full = open ? await getRunInterval(row.id, open.startsAt) : null;
  return {
    ...head,
    intervals: rows.map((r): IntervalView => {
      if (full && r.startsAt.getTime() === full.startsAt.getTime()) return intervalOf(full);
      const base = { startsAt: r.startsAt.toISOString(), nData: r.nData, seconds: r.seconds };
      if (r.skipped) return { ...base, result: null, skipped: r.skipped };
      const result = {
        minima: r.best ? [r.best] : [],
        starts: r.starts,
        unconverged: r.unconverged,
      } as unknown as InversionResult;
      return {
        ...base,
        result,
        brief: true,
        counts: { minima: r.minimaCount, starts: r.starts, unconverged: r.unconverged },
      };
    }),
  };
}

/** One finished interval of a run, whole; null when the run has none at that time. */
export async function findIntervalView(networkId: string, runId: string, startsAt: Date): Promise<IntervalView | null> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  const row = await getRunInterval(run.id, startsAt);
  return row ? intervalOf(row) : null;
}

/** One finished interval of a run, whole; 404 when the run has none at that time. */
export async function getIntervalView(networkId: string, runId: string, startsAt: Date): Promise<IntervalView> {
  const iv = await findIntervalView(networkId, runId, startsAt);
  if (!iv) throw notFound(`The run has no finished interval starting at ${startsAt.toISOString()}.`);
  return iv;
}

/** One row per interval and minimum, flat, for CSV/JSON export. */
export function minimaRows(view: RunView): Record<string, string | number>[] {
  const out: Record<string, string | number>[] = [];
  for (const iv of view.intervals) {
    if (!iv.result) continue;
    iv.result.minima.forEach((m: Minimum, k: number) => {
      const row: Record<string, string | number> = {
        interval_start_utc: iv.startsAt,
        minimum: k + 1,
        misfit: m.misfit,
        reduced_chi2: m.reducedChi2,
        starts: m.count,
        n_data: iv.nData,
      };
      for (const s of m.sources) {
        row[`${s.name}.intensity_C2km2_per_s`] = s.intensity;
        row[`${s.name}.lat_deg`] = s.lat;
        row[`${s.name}.lon_deg`] = s.lon;
        const e = m.stdErrors[s.name] ?? {};
        if (e.intensity !== undefined) row[`${s.name}.intensity_stderr`] = e.intensity;
        if (e.lat !== undefined) row[`${s.name}.lat_stderr`] = e.lat;
        if (e.lon !== undefined) row[`${s.name}.lon_stderr`] = e.lon;
      }
      out.push(row);
    });
  }
  return out;
}

/** The best minimum of every interval: the intensity series per region. */
export function seriesRows(view: RunView): Record<string, string | number>[] {
  return minimaRows(view).filter((r) => r.minimum === 1);
}

function csvCell(v: string | number | undefined): string {
  if (v === undefined) return '';
  const s = String(v);
  return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function toCsv(rows: Record<string, string | number>[]): string {
  const cols: string[] = [];
  for (const r of rows) for (const k of Object.keys(r)) if (!cols.includes(k)) cols.push(k);
  return [cols.join(','), ...rows.map((r) => cols.map((c) => csvCell(r[c])).join(','))].join('\n') + '\n';
}
