/**
 * What the compare page shows for two picks, each a run with one interval and
 * one of its minima (by default the last solved interval's best minimum): the
 * runs' summaries, the chosen minima, the settings side by side, the
 * parameter table (compare.ts), the fit of each chosen minimum per station
 * and component, one colour per region for both and one intensity scale for
 * both maps. The two picks may name the same run.
 */
import { getRun, getRunInterval } from '@/db/repo/runs';
import { listStations } from '@/src/data/stations';
import type { InversionResult, Minimum } from '@/src/engine/inverse/types';
import { notFound } from '@/src/server/errors';
import {
  comparisonColours,
  parameterComparison,
  settingsDiff,
  sharedLogRange,
  type ParameterRow,
  type SettingRow,
} from './compare';
import { loadRunContext } from './context';
import { seriesGoodness, type SeriesGoodness, type SeriesMisfit } from './goodness';
import { loadIntervalObservations } from './observations';
import { getIntervalView, getRunSummary, type RunView } from './results';
import { seriesMisfits } from './series-misfit';
import { solvedIntervals } from './view-select';

export interface Pick {
  runId: string;
  /** Interval start (ISO); default the last solved one. */
  interval?: string;
  /** Index of the minimum (0 = best). */
  minimum?: number;
}

/** A station on a compare map: where it is and how the chosen minimum fits it (chi-square per datum). */
export interface CompareStation {
  station: string;
  lat: number;
  lon: number;
  chi2PerBin: number | null;
  bins: number;
}

export interface PickedMinimum {
  view: RunView;
  interval: string | null;
  index: number;
  minimum: Minimum | null;
  /** How many minima the chosen interval has. */
  minimaCount: number;
  /** Goodness of the chosen minimum per station and component (chi2, dof, P). */
  fit: SeriesGoodness[];
  stations: CompareStation[];
}

/**
 * The chosen minimum's misfit per series: the one the solver recorded for the best minimum, else
 * worked out again from the interval's observations, as the solver does (series-misfit.ts).
 */
async function misfitsOf(networkId: string, runId: string, startsAt: Date, index: number) {
  const run = await getRun(networkId, runId);
  const row = run ? await getRunInterval(run.id, startsAt) : null;
  if (!run || !row) throw notFound('That run interval is not in this network.');
  const result = row.result as unknown as InversionResult & { seriesMisfits?: SeriesMisfit[] };
  const minimum = result.minima?.[index];
  if (!minimum) return null;
  if (index === 0 && result.seriesMisfits) return { misfits: result.seriesMisfits, nParams: result.nParams };
  const ctx = await loadRunContext(run);
  const obs = await loadIntervalObservations(networkId, ctx.config, startsAt);
  return { misfits: seriesMisfits(ctx, obs, minimum.internal), nParams: result.nParams };
}

type StationRow = Awaited<ReturnType<typeof listStations>>[number];

/** The run's stations with the chosen minimum's chi-square per datum over their series (null: no data). */
function stationMarks(view: RunView, misfits: readonly SeriesMisfit[], stations: StationRow[]): CompareStation[] {
  return view.config.data.stationIds.flatMap((id) => {
    const st = stations.find((s) => s.id === id);
    if (!st) return [];
    const mine = misfits.filter((f) => f.station === st.code);
    const bins = mine.reduce((a, f) => a + f.n, 0);
    const chi2PerBin = bins ? mine.reduce((a, f) => a + f.chi2, 0) / bins : null;
    return [{ station: st.code, lat: st.latitude, lon: st.longitude, bins, chi2PerBin }];
  });
}

async function load(networkId: string, p: Pick, stations: StationRow[]): Promise<PickedMinimum> {
  const view = await getRunSummary(networkId, p.runId);
  const solved = solvedIntervals(view.intervals);
  const chosen = (p.interval && solved.find((i) => Date.parse(i.startsAt) === Date.parse(p.interval!))) || solved.at(-1);
  if (!chosen)
    return { view, interval: null, index: 0, minimum: null, minimaCount: 0, fit: [], stations: stationMarks(view, [], stations) };
  const whole = chosen.brief ? await getIntervalView(networkId, p.runId, new Date(chosen.startsAt)) : chosen;
  const minima = whole.result?.minima ?? [];
  const index = Math.min(Math.max(0, p.minimum ?? 0), Math.max(0, minima.length - 1));
  const m = minima.length ? await misfitsOf(networkId, p.runId, new Date(chosen.startsAt), index) : null;
  const misfits = m?.misfits ?? [];
  return {
    view,
    interval: chosen.startsAt,
    index,
    minimum: minima[index] ?? null,
    minimaCount: minima.length,
    fit: m ? seriesGoodness(misfits, m.nParams) : [],
    stations: stationMarks(view, misfits, stations),
  };
}

export interface Comparison {
  a: PickedMinimum;
  b: PickedMinimum;
  settings: SettingRow[];
  parameters: ParameterRow[];
  /** One colour per region name, for every figure and table of both picks. */
  colours: Record<string, string>;
  /** One log10 intensity range for both maps. */
  logRange: { lo: number; hi: number } | null;
}

export async function loadComparison(networkId: string, a: Pick, b: Pick): Promise<Comparison> {
  const stations = await listStations(networkId);
  const [pa, pb] = await Promise.all([load(networkId, a, stations), load(networkId, b, stations)]);
  const code = (id: string) => stations.find((s) => s.id === id)?.code ?? 'removed station';
  return {
    a: pa,
    b: pb,
    settings: settingsDiff(pa.view, pb.view, code),
    parameters: pa.minimum && pb.minimum ? parameterComparison(pa.minimum, pb.minimum) : [],
    colours: comparisonColours(pa.view.grid.regions, pb.view.grid.regions),
    logRange: sharedLogRange([pa.minimum, pb.minimum]),
  };
}
