/**
 * invertSpectra: the multi-start inversion of observed spectra for regional
 * intensities (and centres), returning the distinct minima best first.
 */
import { buildMinima } from './minima';
import { multiStart, resolveMultiStartOptions, type MultiStartOptions } from './multistart';
import { prepareSpectrum, type SpectrumInversionInput } from './spectrum-setup';
import { misfitSurface, type SurfaceRequest } from './surface';
import type { InversionCallbacks, InversionResult, MisfitSurface } from './types';

export async function invertSpectra(
  input: SpectrumInversionInput,
  options: Partial<MultiStartOptions> = {},
  callbacks: InversionCallbacks = {},
): Promise<InversionResult> {
  const t0 = performance.now();
  const o = resolveMultiStartOptions(options);
  const prepared = prepareSpectrum(input);
  const outcomes = await multiStart({ kind: 'spectrum', input }, prepared.problem, o, callbacks);
  const minima = buildMinima(outcomes, prepared.par, prepared.layout.nData, o.scaleErrors);
  return {
    starts: o.starts,
    seed: o.seed,
    seconds: (performance.now() - t0) / 1000,
    nData: prepared.layout.nData,
    nParams: prepared.par.slots.length,
    paramNames: prepared.par.names,
    unconverged: outcomes.filter((x) => !x.converged).length,
    minima,
  };
}

/** chi-square surface over two free parameters of a spectrum inversion (see surface.ts). */
export function spectrumSurface(input: SpectrumInversionInput, request: SurfaceRequest, shouldCancel?: () => boolean): MisfitSurface {
  const { problem, par } = prepareSpectrum(input);
  return misfitSurface(problem, par, request, shouldCancel);
}
