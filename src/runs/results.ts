/**
 * Reading a run back: its configuration with the pinned model and grid, its
 * progress, and the stored result of every finished interval. Shared by the
 * run page, the API and the exports.
 */
import { gridRepo } from '@/db/repo/grids';
import { modelRepo } from '@/db/repo/models';
import { getRun, getRunInterval, listRunIntervals, listRunIntervalSummaries, type RunRow } from '@/db/repo/runs';
import { notFound } from '@/src/server/errors';
import type { InversionResult, Minimum } from '@/src/engine/inverse/types';
import { runConfigSchema, scalesErrorsByMisfit, type RunConfig } from './config';
import { shownErrors } from './error-scaling';
import { chiSquareTail } from '@/src/engine/stats/chi-square';
import { IMPLAUSIBLE_FIT_P, runGoodness, type GoodnessSource, type RunGoodness, type SeriesMisfit } from './goodness';
import { regionSchema, type Region } from './grid-spec';
import { hasEnded } from './lifecycle';
import { workersOnRun } from './chunks';

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
    /** Worker processes on the run now (a live heartbeat on it or on one of its chunks). */
    workers: number;
  };
  config: RunConfig;
  model: { id: string; name: string; version: number; config: Record<string, unknown> };
  grid: { id: string; name: string; version: number; cellSizeDeg: number; regions: Region[] };
  intervals: IntervalView[];
  /**
   * Goodness of fit per run, interval and station/component (src/runs/goodness.ts). Errors shown in
   * `intervals` are scaled by the misfit when `errorsScaledByMisfit` (each minimum's `errorScale` says by how much).
   */
  goodness: RunGoodness;
  errorsScaledByMisfit: boolean;
}

type Head = Omit<RunView, 'intervals' | 'goodness'>;

/** How a run's stored errors are turned into the errors it shows (src/runs/error-scaling.ts). */
interface Scaling {
  byMisfit: boolean;
  legacyScaled: boolean;
}

const iso = (d: Date | null) => (d ? d.toISOString() : null);

function scalingOf(config: RunConfig): Scaling {
  return { byMisfit: scalesErrorsByMisfit(config), legacyScaled: config.damping.scaleCovariance === true };
}

async function runHead(networkId: string, runId: string): Promise<{ row: RunRow; head: Head; scaling: Scaling }> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  const [model, grid, workers] = await Promise.all([
    modelRepo.get(networkId, run.modelId),
    gridRepo.get(networkId, run.gridId),
    hasEnded(run.state) ? 0 : workersOnRun(run.id),
  ]);
  if (!model || !grid) throw notFound('The model or grid of this run is gone.');
  const config = runConfigSchema.parse(run.config);
  const scaling = scalingOf(config);
  return {
    row: run,
    scaling,
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
        workers,
      },
      config,
      model: { id: model.id, name: model.name, version: model.version, config: model.config },
      grid: {
        id: grid.id,
        name: grid.name,
        version: grid.version,
        cellSizeDeg: grid.cellSizeDeg,
        regions: grid.regions.map((r) => regionSchema.parse(r)),
      },
      errorsScaledByMisfit: scaling.byMisfit,
    },
  };
}

function intervalOf(
  r: { id: string; startsAt: Date; nData: number; seconds: number; result: Record<string, unknown> },
  scaling: Scaling,
): IntervalView {
  const res = r.result as unknown as InversionResult & { skipped?: string };
  return {
    id: r.id,
    startsAt: r.startsAt.toISOString(),
    nData: r.nData,
    seconds: r.seconds,
    result: res.skipped ? null : shownErrors(res, scaling.byMisfit, scaling.legacyScaled),
    ...(res.skipped ? { skipped: res.skipped } : {}),
  };
}

/** The whole run: every interval's full result (exports, surfaces; the API's `?detail=full`). */
export async function getRunView(networkId: string, runId: string): Promise<RunView> {
  const [{ head, scaling }, rows] = await Promise.all([runHead(networkId, runId), listRunIntervals(runId)]);
  const intervals = rows.map((r) => intervalOf(r, scaling));
  return { ...head, intervals, goodness: runGoodness(intervals as unknown as GoodnessSource[]) };
}

/**
 * What the run page and the run API send first: every interval's best minimum (misfit, sources,
 * standard errors) and counts, cut down in the database, and the whole result of the
 * interval the page opens on (the last solved one). Other intervals come from `getIntervalView`.
 * The goodness of fit of every interval and series comes along (from the same cut-down rows).
 */
export async function getRunSummary(networkId: string, runId: string): Promise<RunView> {
  const [{ row, head, scaling }, rows] = await Promise.all([runHead(networkId, runId), listRunIntervalSummaries(runId)]);
  const open = rows.filter((r) => !r.skipped && r.minimaCount > 0).at(-1);
  const full = open ? await getRunInterval(row.id, open.startsAt) : null;
  const goodness = runGoodness(
    rows.map((r) => ({
      startsAt: r.startsAt.toISOString(),
      nData: r.nData,
      result:
        r.skipped || !r.best || r.nParams === null
          ? null
          : {
              nParams: r.nParams,
              minima: [r.best as { misfit: number }],
              ...(r.seriesMisfits ? { seriesMisfits: r.seriesMisfits as SeriesMisfit[] } : {}),
            },
    })),
  );
  return {
    ...head,
    goodness,
    intervals: rows.map((r): IntervalView => {
      if (full && r.startsAt.getTime() === full.startsAt.getTime()) return intervalOf(full, scaling);
      const base = { startsAt: r.startsAt.toISOString(), nData: r.nData, seconds: r.seconds };
      if (r.skipped) return { ...base, result: null, skipped: r.skipped };
      const result = shownErrors(
        {
          minima: r.best ? [r.best] : [],
          starts: r.starts,
          unconverged: r.unconverged,
          ...(r.errorBasis === 'stated' ? { errorBasis: 'stated' as const } : {}),
        } as unknown as InversionResult,
        scaling.byMisfit,
        scaling.legacyScaled,
      );
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
  return row ? intervalOf(row, scalingOf(runConfigSchema.parse(run.config))) : null;
}

/** One finished interval of a run, whole; 404 when the run has none at that time. */
export async function getIntervalView(networkId: string, runId: string, startsAt: Date): Promise<IntervalView> {
  const iv = await findIntervalView(networkId, runId, startsAt);
  if (!iv) throw notFound(`The run has no finished interval starting at ${startsAt.toISOString()}.`);
  return iv;
}

/**
 * One row per interval and minimum, flat, for CSV/JSON export: misfit, its degrees of freedom and upper-tail
 * probability, and the factor the errors carry (`errors_scaled_by`, 1 when as stated).
 */
export function minimaRows(view: RunView): Record<string, string | number>[] {
  const out: Record<string, string | number>[] = [];
  for (const iv of view.intervals) {
    if (!iv.result) continue;
    const dof = iv.nData - iv.result.nParams;
    iv.result.minima.forEach((m: Minimum, k: number) => {
      const p = chiSquareTail(m.misfit, dof);
      const row: Record<string, string | number> = {
        interval_start_utc: iv.startsAt,
        minimum: k + 1,
        misfit: m.misfit,
        reduced_chi2: m.reducedChi2,
        dof,
        p_value: p,
        fit_implausible: p < IMPLAUSIBLE_FIT_P ? 'yes' : 'no',
        starts: m.count,
        n_data: iv.nData,
        errors_scaled_by: (m as { errorScale?: number }).errorScale ?? 1,
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
