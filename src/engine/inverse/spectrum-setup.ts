/**
 * Everything a spectrum inversion needs, built from a serialisable input (so
 * that pool workers can rebuild the same problem): data layout, parameters,
 * the engine kernel on the data grid, and the least-squares problem.
 */
import type { CavityConfig } from '@/src/engine/cavity';
import { buildDataLayout, type DataLayout } from './data-layout';
import { engineKernel } from './engine-kernel';
import type { KernelSampler } from './kernel-sampler';
import { buildParameterisation, type Parameterisation } from './parameters';
import { spectrumProblem, type MisfitScale, type SpectrumProblem } from './spectrum-objective';
import type { BinSelection, ObservedSeries, RegionUnknown, StationSite } from './types';

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
