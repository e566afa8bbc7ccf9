/**
 * Physical constants and unit conversions, SI inside the engine.
 * Values: CODATA 2018 (c exact; eps0 and mu0 as recommended values).
 */

/** Speed of light in vacuum, m/s (exact, SI definition). */
export const SPEED_OF_LIGHT = 299_792_458;
/** Vacuum permittivity, F/m (CODATA 2018). */
export const EPS0 = 8.8541878128e-12;
/** Vacuum permeability, H/m (CODATA 2018). */
export const MU0 = 1.25663706212e-6;

/** Default Earth radius, km (mean radius, common practice). */
export const DEFAULT_EARTH_RADIUS_KM = 6371;
/** Default effective cavity height, km (typical electric-height scale). */
export const DEFAULT_HEIGHT_KM = 60;

export const KM = 1000;
export const DEG = Math.PI / 180;

/**
 * Intensity unit: C^2 km^2 / s = (A km)^2 / Hz = 1e6 (A m)^2 / Hz.
 * Multiply an intensity in C^2 km^2/s by this to get (A m)^2/Hz.
 */
export const INTENSITY_TO_SI = 1e6;

/** (V/m)^2/Hz -> (mV/m)^2/Hz. */
export const VM2_TO_MVM2 = 1e6;
/** T^2/Hz -> pT^2/Hz. */
export const T2_TO_PT2 = 1e24;

/**
 * Attenuation factor: S = c/V - i * ATTENUATION_FACTOR * alpha / f with alpha in dB/Mm,
 * ATTENUATION_FACTOR = c / (2 pi 1e6 * 20 log10 e) ≈ 5.49 (Nickolaenko, Galuk & Hayakawa 2016).
 */
export const ATTENUATION_FACTOR = SPEED_OF_LIGHT / (2 * Math.PI * 1e6 * 20 * Math.LOG10E);
