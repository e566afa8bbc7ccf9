/**
 * Ishaq & Jones (1977, Electronics Letters 13, 254) fit of phase-velocity ratio
 * and attenuation (coefficients from memory):
 *   c/V = 1.64 - 0.1759 ln f + 0.01791 (ln f)^2,   alpha = 0.063 f^0.64 dB/Mm.
 */
import { nuFromSpeedAttenuation } from './propagation';
import type { Nu } from './types';

export function ishaqJonesSpeed(fHz: number): number {
  const l = Math.log(fHz);
  return 1.64 - 0.1759 * l + 0.01791 * l * l;
}

export function ishaqJonesAttenuation(fHz: number): number {
  return 0.063 * Math.pow(fHz, 0.64);
}

export function ishaqJonesNu(fHz: number, radiusM: number): Nu {
  return nuFromSpeedAttenuation(fHz, radiusM, ishaqJonesSpeed(fHz), ishaqJonesAttenuation(fHz));
}
