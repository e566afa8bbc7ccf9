/**
 * How well a minimum fits each station and component: observed and predicted
 * power per bin and the weighted residual (ln P_pred - ln P_obs) / sigma for
 * spectrum runs; for mode-parameter runs every observed mode beside the one
 * fitted to the predicted spectrum, with the weighted residuals of frequency,
 * ln intensity and half-width. Both come from the engine's own least-squares
 * problem at the minimum's parameters, built as the run solver builds it
 * (interval-input.ts), so the figure shows exactly what the inversion fitted.
 */
import { buildIntervalProblem } from '@/src/engine/inverse/interval-problem';
import type { InversionResult } from '@/src/engine/inverse/types';
import type { Component } from '@/src/engine/components';
import { badRequest, notFound } from '@/src/server/errors';
import { getRun, getRunInterval } from '@/db/repo/runs';
import { loadRunContext } from './context';
import { assumedExclusionSeries, loadModeObservations, loadObservations } from './observations';
import { intervalInput } from './interval-input';

export interface SeriesFit {
  station: string;
  component: Component;
  frequencies: number[];
  observed: number[];
  predicted: number[];
  residual: number[];
  /** chi-square of this series / its number of bins. */
  chi2PerBin: number;
}

/** For mode runs: chi2PerBin is chi-square per datum and bins the number of data (three per mode). */
export interface StationFit {
  station: string;
  lat: number;
  lon: number;
  chi2PerBin: number;
  bins: number;
}

/** One observed mode of a mode-parameter run beside its prediction at the minimum. */
export interface ModeFit {
  station: string;
  component: Component;
  mode: number; // 1-based, order of the observed modes
  observed: { frequency: number; intensity: number; halfWidth: number };
  sigma: { frequency: number; logIntensity: number; halfWidth: number };
  predicted: { frequency: number; intensity: number; halfWidth: number };
  residual: { frequency: number; logIntensity: number; halfWidth: number }; // weighted, as in the misfit
}

export interface RunFits {
  series: SeriesFit[];
  stations: StationFit[];
  modes?: ModeFit[];
  /** Mode runs: series whose stored fit did not record the ranges it left out (the station's lines were assumed). */
  assumedExclusions?: string[];
}

export async function fitsAt(networkId: string, runId: string, intervalIso: string, minimumIndex: number): Promise<RunFits> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  const when = new Date(intervalIso);
  if (Number.isNaN(when.getTime())) throw badRequest('interval must be a date-time', 'interval');
  const row = await getRunInterval(run.id, when); // one row, not the whole run
  const result = row?.result as unknown as InversionResult | undefined;
  const minimum = result?.minima?.[minimumIndex];
  if (!minimum) throw badRequest('this interval has no such minimum', 'minimum');
  const ctx = await loadRunContext(run);
  if (ctx.config.observables.kind === 'modes') {
    const observedModes = await loadModeObservations(networkId, ctx.config, when);
    const built = buildIntervalProblem(intervalInput(ctx, { observed: [], modes: observedModes }));
    if (built.kind !== 'modes') throw new Error('a mode run builds a mode problem');
    const modes: ModeFit[] = built.problem.compare(Float64Array.from(minimum.internal));
    const stations: StationFit[] = ctx.stations.map((st) => {
      const mine = modes.filter((m) => m.station === st.code);
      const chi2 = mine.reduce(
        (a, m) => a + m.residual.frequency ** 2 + m.residual.logIntensity ** 2 + m.residual.halfWidth ** 2,
        0,
      );
      const bins = 3 * mine.length;
      return { station: st.code, lat: st.lat, lon: st.lon, bins, chi2PerBin: bins ? chi2 / bins : NaN };
    });
    return { series: [], stations, modes, assumedExclusions: assumedExclusionSeries(observedModes) };
  }
  const observed = await loadObservations(networkId, ctx.config, when);
  const built = buildIntervalProblem(intervalInput(ctx, { observed }));
  if (built.kind !== 'spectrum') throw new Error('a spectrum run builds a spectrum problem');
  const { problem, layout } = built;
  const r = new Float64Array(problem.nResiduals);
  problem.residuals(Float64Array.from(minimum.internal), r);
  const series: SeriesFit[] = layout.series.map((s, i) => {
    const n = s.bins.length;
    const res = Array.from(r.subarray(s.offset, s.offset + n));
    return {
      station: observed[i].station,
      component: observed[i].component,
      frequencies: Array.from(s.bins, (b) => layout.freqs[b]),
      observed: Array.from(s.obs),
      predicted: Array.from(problem.predicted.subarray(s.offset, s.offset + n)),
      residual: res,
      chi2PerBin: res.reduce((a, x) => a + x * x, 0) / Math.max(1, n),
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
