/**
 * Reading a run back: its configuration with the pinned model and grid, its
 * progress, and the stored result of every finished interval. Shared by the
 * run page, the API and the exports.
 */
import { getGrid } from '@/db/repo/grids';
import { getModel } from '@/db/repo/models';
import { getRun, listRunIntervals, type RunRow } from '@/db/repo/runs';
import { notFound } from '@/src/server/errors';
import type { InversionResult, Minimum } from '@/src/engine/inverse/types';
import { runConfigSchema, type RunConfig } from './config';
import { regionSchema, type Region } from './grid-spec';
import { openingInterval } from './view-select';

export interface IntervalView {
  startsAt: string;
  nData: number;
  seconds: number;
  /** Null when the interval had no data (then `skipped` says why). */
  result: InversionResult | null;
  skipped?: string;
  /**
   * Set by `firstView`: `result` holds only the best minimum's source names and intensities (to
   * `BRIEF_DIGITS` significant digits) and their intensity standard errors — what the daily curves draw.
   */
  brief?: true;
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

export async function getRunView(networkId: string, runId: string): Promise<RunView> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  const [model, grid, rows] = await Promise.all([
    getModel(networkId, run.modelId),
    getGrid(networkId, run.gridId),
    listRunIntervals(run.id),
  ]);
  if (!model || !grid) throw notFound('The model or grid of this run is gone.');
  return {
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
    intervals: rows.map((r) => {
      const res = r.result as unknown as InversionResult & { skipped?: string };
      return {
        startsAt: r.startsAt.toISOString(),
        nData: r.nData,
        seconds: r.seconds,
        result: res.skipped ? null : res,
        ...(res.skipped ? { skipped: res.skipped } : {}),
      };
    }),
  };
}

/** Significant digits of the intensities in a brief interval: far below the curves' pixel and error scale. */
export const BRIEF_DIGITS = 5;

const rounded = (x: number) => Number(x.toPrecision(BRIEF_DIGITS));

/**
 * What the run page shows first: the full result of the last solved interval
 * (the one it opens on) and, for every other interval, only the best minimum's
 * source intensities and their errors (the daily curves). The page fetches the
 * full view when another interval is chosen.
 */
export function firstView(view: RunView): RunView {
  const open = openingInterval(view.intervals)?.startsAt;
  return {
    ...view,
    intervals: view.intervals.map((iv) => {
      if (!iv.result || iv.startsAt === open) return iv;
      const best = iv.result.minima[0];
      const brief = best
        ? [
            {
              sources: best.sources.map((x) => ({ name: x.name, intensity: rounded(x.intensity) })),
              stdErrors: Object.fromEntries(
                Object.entries(best.stdErrors).map(([k, e]) => [
                  k,
                  { intensity: e.intensity === undefined ? undefined : rounded(e.intensity) },
                ]),
              ),
            } as unknown as Minimum,
          ]
        : [];
      return { ...iv, result: { minima: brief } as unknown as InversionResult, brief: true as const };
    }),
  };
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
