/**
 * Checking and launching a run. `checkLaunch` resolves a configuration
 * against the stored model, grid and data and lists every problem (each with
 * the form field it belongs to) plus a preview: data, parameters, starts,
 * intervals and a rough time. `launchRun` refuses a configuration with
 * problems, stores the run with its full configuration and engine version,
 * and queues it — it returns as soon as the job is queued.
 */
import { record } from '@/src/audit';
import { modelRepo } from '@/db/repo/models';
import { gridRepo } from '@/db/repo/grids';
import { createRun, recentIntervalTimings, type RunRow } from '@/db/repo/runs';
import { listIntervals, listSpectrumStatistics } from '@/db/repo/intervals';
import { statisticsProblem } from '@/src/data/spectrum-statistics';
import { listStations } from '@/db/repo/stations';
import { badRequest } from '@/src/server/errors';
import { countParameters, type RunConfig } from './config';
import { regionSchema, type Region } from './grid-spec';
import { countIntervalData, loadIntervalObservations, RunDataError } from './observations';
import { engineVersion } from './engine-version';
import { enqueueRunWork } from './queues';
import { splitRun } from './chunks';
import { estimateRunSeconds, measureSpeed } from './time-estimate';

export type LaunchProblem = { field: string; message: string };
export interface LaunchPreview {
  nData: number;
  nParams: number;
  starts: number;
  intervals: number;
  series: number;
  estimateSeconds: number;
  /** Where the estimate's speed comes from: finished intervals on this server, or the built-in figure. */
  estimateBasis: 'measured' | 'built-in';
  intervalStarts: string[];
}

/** At most one week of 10-minute intervals per run. */
export const MAX_INTERVALS = 7 * 144;
/**
 * Rough cost of one misfit evaluation per datum and parameter, seconds, with
 * about 40 evaluations per start: the demo run (13 intervals, 4 starts, about
 * 780 data and 5 parameters per interval) took about 0.3 s per interval on a
 * 2-core machine. Only an order of magnitude for the preview.
 */
const SECONDS_PER_DATUM_PARAM_EVAL = 4e-7;
const EVALS_PER_START = 40;
/**
 * Mode-parameter runs fit every predicted spectrum at each misfit evaluation, so a
 * start costs far more: 0.74-1.17 s CPU per start for 81 data (27 modes) and 3
 * parameters (`npm run bench -- inverse`, fixtures/cases/modes.json, 2 cores),
 * about 4e-3 s per datum and parameter per start. Also an order of magnitude.
 */
const MODE_SECONDS_PER_DATUM_PARAM_START = 4e-3;

export async function checkLaunch(
  networkId: string,
  config: RunConfig,
): Promise<{ problems: LaunchProblem[]; preview: LaunchPreview | null }> {
  const problems: LaunchProblem[] = [];
  const model = await modelRepo.get(networkId, config.modelId);
  if (!model) problems.push({ field: 'modelId', message: 'that cavity model is not in this network' });
  const grid = await gridRepo.get(networkId, config.gridId);
  if (!grid) problems.push({ field: 'gridId', message: 'that source grid is not in this network' });
  const stations = await listStations(networkId);
  const known = new Set(stations.map((s) => s.id));
  config.data.stationIds.forEach((id, i) => {
    if (!known.has(id)) problems.push({ field: `data.stationIds.${i}`, message: 'that station is not in this network' });
  });
  if (config.observables.kind === 'spectrum' && model?.config && (model.config as { model?: string }).model === 'table') {
    const rows = (model.config as { table?: { rows: number[][] } }).table?.rows ?? [];
    if (rows.length && (config.observables.minHz < rows[0][0] || config.observables.maxHz > rows[rows.length - 1][0])) {
      problems.push({
        field: 'observables.maxHz',
        message: `the band must lie inside the model table (${rows[0][0]}–${rows[rows.length - 1][0]} Hz)`,
      });
    }
  }
  if (grid) {
    const regions = new Map<string, Region>(grid.regions.map((r) => regionSchema.parse(r)).map((r) => [r.key, r]));
    const seen = new Set<string>();
    config.regions.forEach((u, i) => {
      const at = `regions.${i}`;
      const r = regions.get(u.region);
      if (!r) {
        problems.push({ field: `${at}.region`, message: `region "${u.region}" is not in this grid version` });
        return;
      }
      if (seen.has(u.region)) problems.push({ field: `${at}.region`, message: `region "${r.name}" is chosen twice` });
      seen.add(u.region);
      if (r.kind === 'cells') {
        if (r.cells.length === 0) problems.push({ field: `${at}.region`, message: `region "${r.name}" has no cells` });
        if (u.lat || u.lon)
          problems.push({
            field: `${at}.lat`,
            message: `region "${r.name}" is made of fixed cells: only its intensity can be free`,
          });
      } else {
        for (const k of ['lat', 'lon'] as const) {
          const b = u[k];
          const g = r.bounds[k];
          if (b && (b.min < g.min || b.max > g.max)) {
            problems.push({
              field: `${at}.${k}`,
              message: `the ${k === 'lat' ? 'latitude' : 'longitude'} range of "${r.name}" (${b.min}..${b.max}) leaves the region's bounds in the grid (${g.min}..${g.max})`,
            });
          }
        }
      }
    });
  }
  const to = new Date(Date.parse(config.data.to) + 1);
  const rows = await listIntervals({
    networkId,
    stationIds: config.data.stationIds.filter((id) => known.has(id)),
    components: config.data.components,
    from: new Date(config.data.from),
    to,
    includeFlagged: config.data.includeFlagged,
    limit: 50_000,
  });
  const starts = [...new Set(rows.map((r) => r.startsAt.toISOString()))].sort();
  if (starts.length === 0) {
    problems.push({
      field: 'data.from',
      message: config.data.includeFlagged
        ? 'no data for these stations and components in the chosen range'
        : 'no unflagged data for these stations and components in the chosen range',
    });
  } else if (starts.length > MAX_INTERVALS) {
    problems.push({
      field: 'data.to',
      message: `the range holds ${starts.length} intervals; at most ${MAX_INTERVALS} (one week) per run`,
    });
  }
  if (config.observables.kind === 'spectrum' && starts.length) {
    // Every spectrum the run would use must say how much its bins scatter, consistently; else the run is
    // refused before anything is stored, naming the series and the field.
    const stats = await listSpectrumStatistics({
      networkId,
      stationIds: config.data.stationIds.filter((id) => known.has(id)),
      components: config.data.components,
      from: new Date(config.data.from),
      to,
      includeFlagged: config.data.includeFlagged,
      limit: 50_000,
    });
    const bad = stats.flatMap((s) => {
      const p = s.bins > 0 ? statisticsProblem(s.statistics) : null; // an empty spectrum gives no data anyway
      return p ? [`${s.stationCode} ${s.component} ${s.startsAt.toISOString().slice(0, 16).replace('T', ' ')} UT: ${p}`] : [];
    });
    if (bad.length)
      problems.push({
        field: 'data',
        message: `${bad.length} stored spectra cannot be used as they are: ${bad.slice(0, 3).join('; ')}${bad.length > 3 ? '; …' : ''}`,
      });
  }
  if (problems.length || !model || !grid) return { problems, preview: null };
  let obs;
  try {
    obs = await loadIntervalObservations(networkId, config, new Date(starts[0]));
  } catch (e) {
    if (!(e instanceof RunDataError)) throw e;
    return { problems: [{ field: 'data', message: e.message }], preview: null };
  }
  const nData = countIntervalData(obs);
  const nParams = countParameters(config);
  if (nData === 0)
    problems.push({ field: 'observables', message: 'the chosen band or modes hold no data in the first interval' });
  else if (nParams > nData)
    problems.push({
      field: 'regions',
      message: `too many free parameters (${nParams}) for the data (${nData} values per interval)`,
    });
  // The engine's measured speed on this server (src/runs/time-estimate.ts): this network's own
  // finished intervals first, else every network's here; the built-in figure only on a server
  // that has finished nothing yet. Spectrum and mode runs cost very differently per datum: each
  // is measured on its own kind.
  const kind = config.observables.kind;
  const measured =
    measureSpeed(await recentIntervalTimings(networkId, kind)) ?? measureSpeed(await recentIntervalTimings(null, kind));
  const builtIn = kind === 'modes' ? MODE_SECONDS_PER_DATUM_PARAM_START : EVALS_PER_START * SECONDS_PER_DATUM_PARAM_EVAL;
  const estimateSeconds = estimateRunSeconds(
    measured ?? { secondsPerUnit: builtIn, startupSeconds: 0 },
    starts.length,
    config.starts * nData * Math.max(1, nParams),
  );
  return {
    problems,
    preview: {
      nData,
      nParams,
      starts: config.starts,
      intervals: starts.length,
      series: obs.observed.length + (obs.modes?.length ?? 0),
      estimateSeconds,
      estimateBasis: measured === null ? 'built-in' : 'measured',
      intervalStarts: starts,
    },
  };
}

/** Stores a new run of `config` over the given interval starts (queued, pinned to this engine version). */
export function storeRun(networkId: string, userId: string | null, config: RunConfig, intervalStarts: string[]): Promise<RunRow> {
  return createRun({
    networkId,
    name: config.name,
    config: config as unknown as Record<string, unknown>,
    modelId: config.modelId,
    gridId: config.gridId,
    engineVersion: engineVersion(),
    intervalStarts,
    startsPerInterval: config.starts,
    createdBy: userId,
  });
}

export async function launchRun(networkId: string, userId: string | null, config: RunConfig): Promise<RunRow> {
  const { problems, preview } = await checkLaunch(networkId, config);
  if (problems.length || !preview) {
    const p = problems[0] ?? { field: 'data', message: 'the run cannot start' };
    throw badRequest(`${p.field}: ${p.message}`, p.field);
  }
  const run = await storeRun(networkId, userId, config, preview.intervalStarts);
  await splitRun(run.id, run.intervalStarts.length);
  await enqueueRunWork(run.id);
  await record({
    networkId,
    actorId: userId,
    action: 'created',
    subject: 'run',
    subjectId: run.id,
    summary: `run "${run.name}"`,
  });
  return run;
}
