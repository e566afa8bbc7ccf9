/**
 * Everything a spectrum inversion needs, built from a serialisable input (so
 * that pool workers can rebuild the same problem): data layout, parameters,
 * the engine kernel on the data grid, and the least-squares problem.
 */
import { bandFrequencies, type Band } from '@/src/engine/band';
import type { CavityConfig } from '@/src/engine/cavity';
import type { LeastSquaresProblem } from '@/src/engine/optim/types';
import { InversionInputError } from './errors';
import { modeProblem, type ModeProblem } from './mode-objective';
import { buildDataLayout, type DataLayout } from './data-layout';
import { engineKernel } from './engine-kernel';
import type { KernelSampler } from './kernel-sampler';
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

export interface PreparedSpectrum {
  layout: DataLayout;
  par: Parameterisation;
  kernel: KernelSampler;
  problem: SpectrumProblem;
}

export function prepareSpectrum(
  input: SpectrumInversionInput,
  kernelFor: (cavity: CavityConfig, freqs: Float64Array) => KernelSampler = engineKernel,
): PreparedSpectrum {
  const par = buildParameterisation(input.unknowns);
  const layout = buildDataLayout(input.stations, input.observed, input.selection);
  const kernel = kernelFor(input.cavity, layout.freqs);
  return { layout, par, kernel, problem: spectrumProblem(layout, kernel, par, input.scale ?? 'log') };
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

export interface PreparedModes {
  par: Parameterisation;
  problem: ModeProblem;
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
  return { par, problem: modeProblem(input.stations, input.modes, kernel, par) };
}
