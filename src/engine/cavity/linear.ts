/**
 * Linear propagation-parameter model nu(f) = (f - 2)/6 - i f/70
 * (Nickolaenko & Hayakawa 2002, Resonances in the Earth–Ionosphere Cavity; from memory).
 * Re nu = n at f = 6 n + 2 Hz.
 */
import type { Nu } from './types';

export function linearNu(fHz: number): Nu {
  return { re: (fHz - 2) / 6, im: -fHz / 70 };
}
