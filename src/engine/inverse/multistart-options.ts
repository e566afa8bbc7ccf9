/**
 * The multi-start's one options object and the one function that resolves
 * its defaults (defaults.ts) and checks it; a bad value is refused naming it.
 */
import { availableParallelism } from 'node:os';
import type { LmOptions } from '@/src/engine/optim/types';
import { INVERSION_DEFAULTS } from './defaults';
import { InversionInputError } from './errors';

export interface MultiStartOptions {
  /** Number of starts (default 64). */
  starts: number;
  /** Seed of the quasi-random start sequence (default 1). */
  seed: number;
  /** Worker threads; 1 runs in the calling thread (default: all cores). */
  threads: number;
  /** Explicit start points (internal units) used for the first indexes. */
  warm: number[][];
  /** Options of each LM run (default: looser misfit and step tolerances than the optimiser's own). */
  lm: Partial<LmOptions>;
  /**
   * Stop quasi-random starts before their search when a start of lower misfit lies within the multi-level
   * single linkage distance, counting them in that start's minimum (default true; clustering.ts).
   */
  cluster: boolean;
  /** Scale standard errors by the reduced chi-square (default false: sigmas are trusted). */
  scaleErrors: boolean;
  /**
   * With threads > 1, the calling thread computes starts too (default true). Set false to keep
   * the caller's event loop free (a server process): all starts then go to `threads` workers.
   */
  callerWorks: boolean;
}

export function resolveMultiStartOptions(o: Partial<MultiStartOptions> = {}): MultiStartOptions {
  const r: MultiStartOptions = {
    starts: o.starts ?? INVERSION_DEFAULTS.starts,
    seed: o.seed ?? INVERSION_DEFAULTS.seed,
    threads: o.threads ?? availableParallelism(),
    warm: o.warm ?? [],
    lm: { ...INVERSION_DEFAULTS.lm, ...o.lm },
    cluster: o.cluster ?? INVERSION_DEFAULTS.cluster,
    scaleErrors: o.scaleErrors ?? INVERSION_DEFAULTS.scaleErrors,
    callerWorks: o.callerWorks ?? true,
  };
  if (!Number.isInteger(r.starts) || r.starts < 1)
    throw new InversionInputError(`starts must be a whole number >= 1, got ${r.starts}`);
  if (!Number.isInteger(r.seed) || r.seed < 0) throw new InversionInputError(`seed must be a whole number >= 0, got ${r.seed}`);
  if (!Number.isInteger(r.threads) || r.threads < 1)
    throw new InversionInputError(`threads must be a whole number >= 1, got ${r.threads}`);
  if (r.warm.length > r.starts) r.warm = r.warm.slice(0, r.starts);
  return r;
}
