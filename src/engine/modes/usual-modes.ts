/**
 * Usual Schumann-resonance mode frequencies near which fits start (Hz).
 * Values as commonly reported for the first seven modes of the vertical
 * electric field, about 7.8, 14.1, 20.3, 26.4, 32.5, 38.7 and 44.9 Hz
 * (Sentman 1995, Handbook of Atmospheric Electrodynamics, vol. 1 — from memory).
 */
export const USUAL_MODE_FREQUENCIES_HZ: readonly number[] = [7.8, 14.1, 20.3, 26.4, 32.5, 38.7, 44.9];
export const MIN_MODES = 3;
export const MAX_MODES = 7;
