/**
 * Turns stored interval spectra into the observations of one run interval:
 * the chosen stations and components, bins inside the band (every k-th),
 * each with the statistics stored with its spectrum (Welch statistics: sigma
 * from K_eff, log bias removed, neighbouring bins correlated; or a stated
 * sigma of ln P for synthetic spectra, src/data/spectrum-statistics.ts); or
 * the fitted modes with the covariance of (frequency, ln peak, half-width)
 * their fit reports. A spectrum whose statistics are missing or contradictory
 * stops the run with a RunDataError naming the series and the field.
 */
import { getIntervalSpectra, listIntervals, type IntervalFit, type IntervalSpectrum } from '@/db/repo/intervals';
import { listStations } from '@/db/repo/stations';
import { listedLines, mainsLines, type SpectralLine } from '@/src/engine/signal/line-suppression';
import type { RunConfig } from './config';
import type { ObservedModes } from '@/src/engine/inverse/types';
import { SPECTRUM_BAND_MAX_HZ, SPECTRUM_BAND_MIN_HZ } from '@/src/engine/tolerances';
import { InversionInputError } from '@/src/engine/inverse/errors';
import { propagatedModeErrors, seriesScatter } from '@/src/engine/inverse/observed-modes';
import { seriesScatterOf, statisticsProblem } from '@/src/data/spectrum-statistics';
import type { ObservedSeries } from './types';

const TEN_MINUTES_MS = 600_000;

/**
 * Frequency grid on which mode runs evaluate predicted spectra: the bins of the stations' default spectra
 * (the default band in 0.1 Hz steps, 10 s Welch segments), so that the predicted modes are fitted over
 * the same bins and band as the observed ones.
 */
export const MODE_BAND = { minHz: SPECTRUM_BAND_MIN_HZ, maxHz: SPECTRUM_BAND_MAX_HZ, stepHz: 0.1 };

/** Stored data a run cannot use as they are; `field` names what is wrong (e.g. "statistics.welch.segments"). */
export class RunDataError extends Error {
  constructor(
    message: string,
    readonly field: string,
  ) {
    super(message);
    this.name = 'RunDataError';
  }
}

/** The stored spectrum's statistics as the inverter takes them, or a RunDataError naming the series and field. */
function checkedScatter(s: Pick<IntervalSpectrum, 'stationCode' | 'component' | 'startsAt' | 'statistics'>) {
  const problem = statisticsProblem(s.statistics);
  if (problem) {
    const when = s.startsAt.toISOString().slice(0, 16).replace('T', ' ');
    throw new RunDataError(`${s.stationCode} ${s.component} ${when} UT: ${problem}`, problem.split(':')[0]);
  }
  return seriesScatterOf(s.statistics!);
}

function bandSeries(s: IntervalSpectrum, minHz: number, maxHz: number, every: number): ObservedSeries | null {
  const frequencies: number[] = [];
  const power: number[] = [];
  let k = 0;
  for (let i = 0; i < s.frequencies.length; i++) {
    const f = s.frequencies[i];
    if (f < minHz || f > maxHz) continue;
    if (k++ % every !== 0) continue;
    const p = s.power[i];
    if (!(p > 0) || !Number.isFinite(p)) continue;
    frequencies.push(f);
    power.push(p);
  }
  if (frequencies.length === 0) return null;
  return { station: s.stationCode, component: s.component, frequencies, power, ...checkedScatter(s) };
}

/** Observations of the interval starting at `startsAt` (spectrum observables). */
export async function loadSpectrumObservations(networkId: string, config: RunConfig, startsAt: Date): Promise<ObservedSeries[]> {
  const o = config.observables;
  if (o.kind !== 'spectrum') throw new Error('loadSpectrumObservations needs spectrum observables');
  if (config.imported) return config.imported.observed;
  const spectra = await getIntervalSpectra({
    networkId,
    stationIds: config.data.stationIds,
    components: config.data.components,
    from: startsAt,
    to: new Date(startsAt.getTime() + TEN_MINUTES_MS),
    includeFlagged: config.data.includeFlagged,
  });
  return spectra.map((s) => bandSeries(s, o.minHz, o.maxHz, o.every)).filter((s): s is ObservedSeries => s !== null);
}

/**
 * Spectrum observations of several intervals in one query: every stored spectrum
 * from the first start to ten minutes after the last, each given to the run
 * interval it starts in ([t, t + 10 min)). Same result per interval as
 * loadSpectrumObservations, with one round trip for the lot.
 */
export async function loadSpectrumObservationsOf(
  networkId: string,
  config: RunConfig,
  starts: readonly Date[],
): Promise<Map<number, ObservedSeries[]>> {
  const o = config.observables;
  if (o.kind !== 'spectrum') throw new Error('loadSpectrumObservationsOf needs spectrum observables');
  const times = [...new Set(starts.map((t) => t.getTime()))].sort((a, b) => a - b);
  const imported = config.imported;
  if (imported) return new Map(times.map((t) => [t, imported.observed]));
  const out = new Map<number, ObservedSeries[]>(times.map((t) => [t, []]));
  if (times.length === 0) return out;
  const spectra = await getIntervalSpectra({
    networkId,
    stationIds: config.data.stationIds,
    components: config.data.components,
    from: new Date(times[0]),
    to: new Date(times[times.length - 1] + TEN_MINUTES_MS),
    includeFlagged: config.data.includeFlagged,
  });
  for (const sp of spectra) {
    const at = sp.startsAt.getTime();
    let lo = 0,
      hi = times.length - 1; // the last run start at or before this spectrum's start
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (times[mid] <= at) lo = mid;
      else hi = mid - 1;
    }
    if (times[lo] > at || at >= times[lo] + TEN_MINUTES_MS) continue;
    const series = bandSeries(sp, o.minHz, o.maxHz, o.every);
    if (series) out.get(times[lo])!.push(series);
  }
  return out;
}

/**
 * Observations from stored mode fits: frequency, peak power (amplitude plus
 * background at the mode frequency) and half-width of the first `modes`
 * modes, with errors propagated from the stored spectrum through the same fit
 * over the stored fit's band (or, without a spectrum, the fit's own errors:
 * sigma of ln peak = error of the amplitude / peak, by the delta method).
 */
export async function loadModeObservations(networkId: string, config: RunConfig, startsAt: Date): Promise<ObservedModes[]> {
  const o = config.observables;
  if (o.kind !== 'modes') throw new Error('loadModeObservations needs mode observables');
  if (config.imported) return config.imported.modes ?? [];
  const filter = {
    networkId,
    stationIds: config.data.stationIds,
    components: config.data.components,
    from: startsAt,
    to: new Date(startsAt.getTime() + TEN_MINUTES_MS),
    includeFlagged: config.data.includeFlagged,
  };
  const rows = await listIntervals(filter);
  const spectra = new Map((await getIntervalSpectra(filter)).map((sp) => [sp.intervalId, sp]));
  // For fits that did not record what they left out: the bins the pipeline's fit of time series leaves out,
  // the mains line, its harmonics and the station's interference lines (as the station is set up now).
  const lines = new Map(
    (await listStations(networkId)).map((s) => [
      s.code,
      [...mainsLines(s.mainsHz, SPECTRUM_BAND_MAX_HZ), ...listedLines(s.interferenceLines)],
    ]),
  );
  const out: ObservedModes[] = [];
  for (const r of rows) {
    if (!r.fit) continue;
    const modes = [...r.fit.modes]
      .sort((a, b) => a.frequency - b.frequency)
      .slice(0, o.modes)
      .flatMap((m) => {
        const peak = m.peak ?? m.amplitude + r.fit!.background.b0 + r.fit!.background.b1 * m.frequency;
        const e = m.errors;
        if (!(peak > 0) || !(e?.frequency > 0) || !(e?.amplitude > 0) || !(e?.halfWidth > 0)) return [];
        // The fit's own covariance of (frequency, ln peak, half-width), background included, where it reports it.
        const own =
          e.lnPeak !== undefined && e.lnPeak > 0 && m.correlation ? { lnPeak: e.lnPeak, correlation: m.correlation } : null;
        // A mode whose half-width reaches outside the model grid is no usable resonance (observed
        // Schumann modes have Q about 4-6, Sentman 1995); it is left out rather than failing the run.
        if (m.frequency - m.halfWidth < MODE_BAND.minHz || m.frequency + m.halfWidth > MODE_BAND.maxHz) return [];
        return [
          {
            frequency: m.frequency,
            intensity: peak,
            halfWidth: m.halfWidth,
            sigmaFrequency: e.frequency,
            sigmaLogIntensity: own ? own.lnPeak : e.amplitude / peak,
            sigmaHalfWidth: e.halfWidth,
            ...(own ? { correlation: own.correlation.map((row) => [...row]) } : {}),
          },
        ];
      });
    // The predicted modes go through the same fit: as many modes, over the stored fit's band (older fits:
    // the pipeline's default band, which they used), less the bins it left out (older fits: assumed).
    if (!modes.length) continue;
    const band = r.fit.band ? { minHz: r.fit.band.minHz, maxHz: r.fit.band.maxHz } : {};
    const om: ObservedModes = {
      station: r.stationCode,
      component: r.component,
      modes,
      fit: { modes: r.fit.modes.length, ...band, ...fitExclusions(r.fit, lines.get(r.stationCode) ?? []) },
    };
    const sp = spectra.get(r.id);
    // Fits that report their covariance are used as they are; older ones get their errors propagated afresh.
    const reported = modes.every((m) => m.correlation);
    out.push(sp && !reported ? withPropagatedErrors(om, sp, r.fit) : om);
  }
  return out;
}

/**
 * What the predicted fit leaves out: exactly the ranges the stored fit recorded (none for fits of spectra
 * files); for fits stored before exclusions were recorded, the station's mains and listed lines, marked
 * as assumed.
 */
export function fitExclusions(
  fit: IntervalFit,
  stationLines: SpectralLine[],
): Pick<NonNullable<ObservedModes['fit']>, 'excludeLines' | 'excludeRanges' | 'exclusionsAssumed'> {
  if (fit.excluded) return { excludeRanges: fit.excluded.map((x) => ({ minHz: x.minHz, maxHz: x.maxHz })) };
  return { excludeLines: stationLines, exclusionsAssumed: true };
}

/** The series ("station component") whose observed fits did not record what they left out, so the predicted fit assumed it. */
export function assumedExclusionSeries(modes: readonly ObservedModes[]): string[] {
  return modes.filter((m) => m.fit?.exclusionsAssumed).map((m) => `${m.station} ${m.component}`);
}

/**
 * Where the interval's spectrum is stored, its bins' scatter is propagated through the same fit to the
 * observables, ln peak among them (observed-modes.ts; the stored errors cover frequency, amplitude and
 * half-width but not the peak's correlation with the background, and fits stored before the errors were
 * propagated came from the covariance (J^T W J)^-1, which understates them). The scatter is the one the
 * stored fit assumed (its averages and bin correlation), else the statistics stored with the spectrum.
 * Modes the fit holds on a bound keep the stored errors.
 */
function withPropagatedErrors(om: ObservedModes, sp: IntervalSpectrum, fit: IntervalFit): ObservedModes {
  const scatter =
    fit.averages !== undefined
      ? { averages: fit.averages, lagCorrelation: fit.binCorrelation }
      : seriesScatter({ station: sp.stationCode, component: sp.component, frequencies: [], power: [], ...checkedScatter(sp) });
  let prop;
  try {
    prop = propagatedModeErrors(om, Float64Array.from(sp.frequencies), sp.power, scatter);
  } catch (e) {
    if (e instanceof InversionInputError) return om;
    throw e;
  }
  return {
    ...om,
    modes: om.modes.map((m, k) => {
      const [sf, sA, sg] = prop.sigmas[k];
      if (prop.onEdge[k] || ![sf, sA, sg].every((v) => v > 0 && Number.isFinite(v))) return m;
      return { ...m, sigmaFrequency: sf, sigmaLogIntensity: sA, sigmaHalfWidth: sg };
    }),
  };
}

export interface IntervalObservations {
  observed: ObservedSeries[];
  modes?: ObservedModes[];
}

/** Observations of one interval for the run's observables. */
export async function loadIntervalObservations(
  networkId: string,
  config: RunConfig,
  startsAt: Date,
): Promise<IntervalObservations> {
  if (config.observables.kind === 'spectrum') return { observed: await loadSpectrumObservations(networkId, config, startsAt) };
  return { observed: [], modes: await loadModeObservations(networkId, config, startsAt) };
}

/**
 * A loader for a run's intervals taken in order: spectrum observations are read
 * `batch` intervals at a time (one query each), mode observations one interval at a
 * time. Each interval is handed out once and then forgotten.
 */
export function intervalLoader(
  networkId: string,
  config: RunConfig,
  starts: readonly Date[],
  batch = 16,
): (startsAt: Date) => Promise<IntervalObservations> {
  if (config.observables.kind !== 'spectrum') return (t) => loadIntervalObservations(networkId, config, t);
  const index = new Map(starts.map((t, i) => [t.getTime(), i]));
  const loaded = new Map<number, Promise<ObservedSeries[]>>();
  return async (startsAt) => {
    const t = startsAt.getTime();
    const i = index.get(t);
    if (i === undefined) return loadIntervalObservations(networkId, config, startsAt);
    if (!loaded.has(t)) {
      const window = starts.slice(i, i + batch);
      const all = loadSpectrumObservationsOf(networkId, config, window);
      for (const w of window) {
        const one = all.then((m) => m.get(w.getTime()) ?? []);
        one.catch(() => {}); // reported by whoever awaits it; the rest may never be asked for
        loaded.set(w.getTime(), one);
      }
    }
    const observed = await loaded.get(t)!;
    loaded.delete(t);
    return { observed };
  };
}

/** Number of data: one per bin, or three per observed mode (frequency, peak, half-width). */
export function countIntervalData(o: IntervalObservations): number {
  return countData(o.observed) + (o.modes ?? []).reduce((n, s) => n + 3 * s.modes.length, 0);
}

/** Spectrum observations only (fits and surfaces are drawn for spectrum runs). */
export function loadObservations(networkId: string, config: RunConfig, startsAt: Date): Promise<ObservedSeries[]> {
  return loadSpectrumObservations(networkId, config, startsAt);
}

export function countData(observed: ObservedSeries[]): number {
  return observed.reduce((n, s) => n + s.power.length, 0);
}
