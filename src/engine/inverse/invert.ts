/**
 * The multi-start inversion of one interval for regional intensities (and
 * centres): builds the interval's problem (interval-problem.ts: log-power
 * spectra or mode parameters), runs the multi-start and returns the distinct
 * minima best first.
 */
import {
  buildIntervalProblem,
  type IntervalInput,
  type ModeInversionInput,
  type SpectrumInversionInput,
} from './interval-problem';
import { buildMinima, startEnds } from './minima';
import { multiStart } from './multistart';
import { resolveMultiStartOptions, type MultiStartOptions } from './multistart-options';
import type { InversionCallbacks, InversionResult } from './types';

export async function invertInterval(
  interval: IntervalInput,
  options: Partial<MultiStartOptions> = {},
  callbacks: InversionCallbacks = {},
): Promise<InversionResult> {
  const t0 = performance.now();
  const o = resolveMultiStartOptions(options);
  const { problem, par, nData } = buildIntervalProblem(interval);
  const outcomes = await multiStart({ problem, ref: { builder: 'interval', input: interval } }, o, callbacks);
  const minima = buildMinima(outcomes, par, nData, o.scaleErrors);
  return {
    starts: o.starts,
    seed: o.seed,
    seconds: (performance.now() - t0) / 1000,
    nData,
    nParams: par.slots.length,
    paramNames: par.names,
    unconverged: outcomes.filter((x) => !x.converged && x.joins === undefined).length,
    minima,
    startEnds: startEnds(outcomes, minima),
  };
}

export function invertSpectra(
  input: SpectrumInversionInput,
  options: Partial<MultiStartOptions> = {},
  callbacks: InversionCallbacks = {},
): Promise<InversionResult> {
  return invertInterval({ kind: 'spectrum', input }, options, callbacks);
}

export function invertModes(
  input: ModeInversionInput,
  options: Partial<MultiStartOptions> = {},
  callbacks: InversionCallbacks = {},
): Promise<InversionResult> {
  return invertInterval({ kind: 'modes', input }, options, callbacks);
}
