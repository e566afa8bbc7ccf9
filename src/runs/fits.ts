/**
 * How well a minimum fits each station and component: observed and predicted
 * power per bin and the weighted residual (ln P_pred - ln P_obs) / sigma, from
 * the engine's own least-squares problem at the minimum's parameters (so the
 * figure shows exactly what the inversion fitted).
 */
import { prepareSpectrum } from '@/src/engine/inverse/spectrum-setup';
import type { InversionResult } from '@/src/engine/inverse/types';
import { badRequest } from '@/src/server/errors';
import { getRun, getRunInterval } from '@/db/repo/runs';
import { notFound } from '@/src/server/errors';
import { loadRunContext } from './context';
import { loadObservations } from './observations';
import { buildUnknowns } from './unknowns';

export interface SeriesFit {
  station: string;
  component: 'Ez' | 'Bns' | 'Bew';
  frequencies: number[];
  observed: number[];
  predicted: number[];
  residual: number[];
  /** chi-square of this series / its number of bins. */
  chi2PerBin: number;
}

export interface StationFit { station: string; lat: number; lon: number; chi2PerBin: number; bins: number }

export async function fitsAt(networkId: string, runId: string, intervalIso: string, minimumIndex: number): Promise<{ series: SeriesFit[]; stations: StationFit[] }> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  const when = new Date(intervalIso);
  if (Number.isNaN(when.getTime())) throw badRequest('interval must be a date-time', 'interval');
  const row = await getRunInterval(run.id, when); // one row, not the whole run
  const result = row?.result as unknown as InversionResult | undefined;
  const minimum = result?.minima?.[minimumIndex];
  if (!minimum) throw badRequest('this interval has no such minimum', 'minimum');
  const ctx = await loadRunContext(run);
  if (ctx.config.observables.kind !== 'spectrum') throw badRequest('per-bin fits are drawn for spectrum runs; this run fitted mode parameters', 'interval');
  const observed = await loadObservations(networkId, ctx.config, when);
  const { problem, layout } = prepareSpectrum({
    cavity: ctx.cavity, stations: ctx.stations.map((s) => ({ code: s.code, lat: s.lat, lon: s.lon })),
    observed, unknowns: buildUnknowns(ctx.config, ctx.grid),
  });
  const r = new Float64Array(problem.nResiduals);
  problem.residuals(Float64Array.from(minimum.internal), r);
  const series: SeriesFit[] = layout.series.map((s, i) => {
    const n = s.bins.length;
    const res = Array.from(r.subarray(s.offset, s.offset + n));
    return {
      station: observed[i].station, component: observed[i].component,
      frequencies: Array.from(s.bins, (b) => layout.freqs[b]),
      observed: Array.from(s.obs), predicted: Array.from(problem.predicted.subarray(s.offset, s.offset + n)),
      residual: res, chi2PerBin: res.reduce((a, x) => a + x * x, 0) / Math.max(1, n),
    };
  });
  const stations: StationFit[] = ctx.stations.map((st) => {
    const mine = series.filter((s) => s.station === st.code);
    const bins = mine.reduce((a, s) => a + s.frequencies.length, 0);
    const chi2 = mine.reduce((a, s) => a + s.chi2PerBin * s.frequencies.length, 0);
    return { station: st.code, lat: st.lat, lon: st.lon, bins, chi2PerBin: bins ? chi2 / bins : NaN };
  });
  return { series, stations };
}
