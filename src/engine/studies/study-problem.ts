/**
 * A study's starting point, built through the one interval problem builder:
 * the parameterisation of its unknowns, the truth (or solution) as the internal
 * vector, and every station series on the band with the study's noise and
 * the power the inverter's own model predicts at the truth (so that the
 * synthetic data and the model fitted to them are the same model). Siting
 * linearises here; recovery adds noise to these spectra.
 */
import { bandFrequencies } from '@/src/engine/band';
import { InversionInputError } from '@/src/engine/inverse/errors';
import { prepareSpectrum, type SpectrumInversionInput } from '@/src/engine/inverse/interval-problem';
import type { Parameterisation } from '@/src/engine/inverse/parameters';
import type { ObservedSeries, StationSite } from '@/src/engine/inverse/types';
import { truthPoint } from './truth-point';
import type { StudyInput, StudyNoise, StudyStation } from './types';

export interface PreparedStudy {
  par: Parameterisation;
  /** The sources as the internal free vector. */
  truth: Float64Array;
  freqs: Float64Array;
  /** Every station series on the band, noise-free at the truth, with the study's noise. */
  series: ObservedSeries[];
}

/** The series of the stations' components on the grid `freqs`, with the given scatter and unit power. */
export function noiseSeries(stations: readonly StudyStation[], freqs: Float64Array, noise: StudyNoise): ObservedSeries[] {
  const scatter = {
    ...(noise.sigmaLog !== undefined ? { sigmaLog: noise.sigmaLog } : {}),
    ...(noise.welch ? { welch: noise.welch } : {}),
  };
  return stations.flatMap((st) =>
    st.components.map((component) => ({
      station: st.code,
      component,
      frequencies: freqs,
      power: new Float64Array(freqs.length).fill(1),
      ...scatter,
    })),
  );
}

export const sitesOf = (stations: readonly StudyStation[]): StationSite[] =>
  stations.map(({ code, lat, lon }) => ({ code, lat, lon }));

/** The spectrum inversion input of the given series: the study's cavity and unknowns, the stations named. */
export function studySpectrumInput(
  input: StudyInput,
  stations: readonly StudyStation[],
  series: ObservedSeries[],
): SpectrumInversionInput {
  return { cavity: input.cavity, stations: sitesOf(stations), observed: series, unknowns: input.unknowns };
}

export function prepareStudy(input: StudyInput): PreparedStudy {
  let freqs: Float64Array;
  try {
    freqs = bandFrequencies(input.band);
  } catch (e) {
    throw new InversionInputError((e as Error).message);
  }
  const template = noiseSeries(input.stations, freqs, input.noise);
  const { par, problem } = prepareSpectrum(studySpectrumInput(input, input.stations, template));
  const truth = truthPoint(par, input.sources);
  problem.residuals(truth, new Float64Array(problem.nResiduals));
  const predicted = problem.predicted;
  const series = template.map((s, i) => ({ ...s, power: predicted.slice(i * freqs.length, (i + 1) * freqs.length) }));
  return { par, truth, freqs, series };
}
