/**
 * The one problem builder for an interval: from a serialisable input (observed
 * spectra, or observed mode parameters on a band grid; stations; unknown
 * regions) to the least-squares problem, its region parameterisation and its
 * data count. Runs, fits, surfaces, benchmarks and the command line all build
 * through here; pool workers rebuild the same problem from the same input.
 */
import { bandFrequencies, type Band } from '@/src/engine/band';
import type { CavityConfig } from '@/src/engine/cavity';
import { InversionInputError } from './errors';
import { buildDataLayout, type DataLayout } from './data-layout';
import { engineKernel, type KernelSampler } from './kernel-sampler';
import { modeProblem, type ModeProblem } from './mode-objective';
import { buildParameterisation, type Parameterisation } from './parameters';
import { spectrumProblem, type MisfitScale, type SpectrumProblem } from './spectrum-objective';
import type { BinSelection, ObservedModes, ObservedSeries, RegionUnknown, StationSite } from './types';

export interface SpectrumInversionInput {
  cavity: CavityConfig;
  stations: StationSite[];
  observed: ObservedSeries[];
  unknowns: RegionUnknown[];
  selection?: BinSelection;
  scale?: MisfitScale;
}

/** Input of a mode-parameter inversion: observed modes instead of spectra, on a band grid. */
export interface ModeInversionInput {
  cavity: CavityConfig;
  /** Grid on which the predicted spectrum is evaluated (fine enough to resolve the modes, e.g. 0.1 Hz). */
  band: Band;
  stations: StationSite[];
  modes: ObservedModes[];
  unknowns: RegionUnknown[];
}

/** What one interval's inversion fits: its spectra or its fitted modes. */
export type IntervalInput = { kind: 'spectrum'; input: SpectrumInversionInput } | { kind: 'modes'; input: ModeInversionInput };

export interface PreparedSpectrum {
  kind: 'spectrum';
  layout: DataLayout;
  par: Parameterisation;
  kernel: KernelSampler;
  problem: SpectrumProblem;
  nData: number;
}

export interface PreparedModes {
  kind: 'modes';
  par: Parameterisation;
  problem: ModeProblem;
  nData: number;
}

export type IntervalProblem = PreparedSpectrum | PreparedModes;

export function prepareSpectrum(
  input: SpectrumInversionInput,
  kernelFor: (cavity: CavityConfig, freqs: Float64Array) => KernelSampler = engineKernel,
): PreparedSpectrum {
  const par = buildParameterisation(input.unknowns);
  const layout = buildDataLayout(input.stations, input.observed, input.selection);
  const kernel = kernelFor(input.cavity, layout.freqs);
  const problem = spectrumProblem(layout, kernel, par, input.scale ?? 'log');
  return { kind: 'spectrum', layout, par, kernel, problem, nData: layout.nData };
}

export function prepareModes(input: ModeInversionInput, kernelFor = engineKernel): PreparedModes {
  const par = buildParameterisation(input.unknowns);
  let freqs: Float64Array;
  try {
    freqs = bandFrequencies(input.band);
  } catch (e) {
    throw new InversionInputError((e as Error).message);
  }
  const kernel = kernelFor(input.cavity, freqs);
  const problem = modeProblem(input.stations, input.modes, kernel, par);
  return { kind: 'modes', par, problem, nData: problem.nData };
}

export function buildIntervalProblem(interval: IntervalInput): IntervalProblem {
  return interval.kind === 'spectrum' ? prepareSpectrum(interval.input) : prepareModes(interval.input);
}
