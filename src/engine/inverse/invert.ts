/**
 * The multi-start inversions for regional intensities (and centres):
 * invertSpectra (log-power misfit of observed spectra) and invertModes
 * (misfit of observed mode parameters), returning distinct minima best first.
 */
import { buildMinima, startEnds } from './minima';
import { multiStart, resolveMultiStartOptions, type MultiStartOptions } from './multistart';
import { prepareRecipe, type ProblemRecipe } from './recipes';
import type { ModeInversionInput, SpectrumInversionInput } from './spectrum-setup';
import type { InversionCallbacks, InversionResult } from './types';

async function runInversion(
  recipe: Extract<ProblemRecipe, { kind: 'spectrum' | 'modes' }>,
  options: Partial<MultiStartOptions>,
  callbacks: InversionCallbacks,
): Promise<InversionResult> {
  const t0 = performance.now();
  const o = resolveMultiStartOptions(options);
  const prepared = prepareRecipe(recipe);
  const par = prepared.par!;
  const outcomes = await multiStart(recipe, prepared.problem, o, callbacks);
  const minima = buildMinima(outcomes, par, prepared.nData, o.scaleErrors);
  return {
    starts: o.starts,
    seed: o.seed,
    seconds: (performance.now() - t0) / 1000,
    nData: prepared.nData,
    nParams: par.slots.length,
    paramNames: par.names,
    unconverged: outcomes.filter((x) => !x.converged).length,
    minima,
    startEnds: startEnds(outcomes, minima),
  };
}

export function invertSpectra(
  input: SpectrumInversionInput,
  options: Partial<MultiStartOptions> = {},
  callbacks: InversionCallbacks = {},
): Promise<InversionResult> {
  return runInversion({ kind: 'spectrum', input }, options, callbacks);
}

export function invertModes(
  input: ModeInversionInput,
  options: Partial<MultiStartOptions> = {},
  callbacks: InversionCallbacks = {},
): Promise<InversionResult> {
  return runInversion({ kind: 'modes', input }, options, callbacks);
}
