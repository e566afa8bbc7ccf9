/**
 * The recovery study: for each realisation, fresh seeded noise on the
 * spectra the model predicts at the truth (noise-realisation.ts), then a full
 * multi-start inversion of them as a real run does (inverse/invert.ts); the
 * best minimum of each is compared with the truth (recovery-summary.ts).
 * Realisation i draws its noise from the i-th number of a stream seeded with
 * the study's seed, so the same seed gives the same study on any machine and
 * thread count. Progress and cancellation come as callbacks, per realisation.
 */
import { invertSpectra } from '@/src/engine/inverse/invert';
import type { Minimum } from '@/src/engine/inverse/types';
import { mulberry32 } from '@/src/engine/random';
import { noiseRealisation } from './noise-realisation';
import { resolveRecoveryOptions, type RecoveryOptions } from './recovery-options';
import { meanCorrelation, recoveredParameters } from './recovery-summary';
import { prepareStudy, studySpectrumInput } from './study-problem';
import type { RecoveryResult, StudyCallbacks, StudyInput } from './types';

/** The recovery was stopped by its caller between realisations. */
export class StudyCancelled extends Error {
  constructor() {
    super('the study was cancelled');
    this.name = 'StudyCancelled';
  }
}

export async function recoveryStudy(
  input: StudyInput,
  options: Partial<RecoveryOptions>,
  callbacks: StudyCallbacks = {},
): Promise<RecoveryResult> {
  const o = resolveRecoveryOptions(options);
  const prepared = prepareStudy(input);
  const stream = mulberry32(o.seed);
  const seeds = Array.from({ length: o.realisations }, () => Math.floor(stream() * 2 ** 32));
  const best: Minimum[] = [];
  let misfit = 0;
  let dof = 0;
  for (const seed of seeds) {
    if (callbacks.shouldCancel?.()) throw new StudyCancelled();
    const observed = noiseRealisation(prepared.series, input.noise, input.band, seed);
    const result = await invertSpectra(studySpectrumInput(input, input.stations, observed), o.inversion, {
      shouldCancel: callbacks.shouldCancel,
    });
    if (callbacks.shouldCancel?.()) throw new StudyCancelled();
    best.push(result.minima[0]);
    misfit += result.minima[0].misfit;
    dof = result.nData - result.nParams;
    callbacks.onProgress?.({ done: best.length, total: o.realisations });
  }
  return {
    realisations: o.realisations,
    seed: o.seed,
    parameters: recoveredParameters(prepared.par, prepared.truth, best),
    correlation: meanCorrelation(prepared.par.names, best),
    singular: best.filter((m) => m.singular).length,
    meanMisfit: misfit / best.length,
    degreesOfFreedom: dof,
  };
}
