/**
 * The recovery study's one options object and the one function that resolves
 * its defaults and checks it: how many noise realisations, the seed of their
 * noise, and the inversion of each (a full multi-start, as a run does: the
 * inverter's own defaults unless given). A bad value is refused naming it.
 */
import { INVERSION_DEFAULTS } from '@/src/engine/inverse/defaults';
import { InversionInputError } from '@/src/engine/inverse/errors';
import type { MultiStartOptions } from '@/src/engine/inverse/multistart-options';

/** Most realisations one study may ask for. */
export const RECOVERY_MAX_REALISATIONS = 10_000;

export interface RecoveryOptions {
  /** Noise realisations, each inverted (required, 1..RECOVERY_MAX_REALISATIONS). */
  realisations: number;
  /** Seed of the noise (default 1): the same seed gives the same study. */
  seed: number;
  /** Options of each realisation's multi-start inversion (starts, start seed, threads…). */
  inversion: Partial<MultiStartOptions>;
}

export function resolveRecoveryOptions(o: Partial<RecoveryOptions>): RecoveryOptions {
  const r: RecoveryOptions = {
    realisations: o.realisations ?? 0,
    seed: o.seed ?? INVERSION_DEFAULTS.seed,
    inversion: o.inversion ?? {},
  };
  if (!Number.isInteger(r.realisations) || r.realisations < 1 || r.realisations > RECOVERY_MAX_REALISATIONS)
    throw new InversionInputError(
      `realisations must be a whole number from 1 to ${RECOVERY_MAX_REALISATIONS}, got ${o.realisations ?? 'none'}`,
    );
  if (!Number.isInteger(r.seed) || r.seed < 0 || r.seed > 2 ** 31 - 1)
    throw new InversionInputError(`seed must be a whole number from 0 to ${2 ** 31 - 1}, got ${r.seed}`);
  return r;
}
