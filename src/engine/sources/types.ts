/** Sources of the forward model. Intensities are in C^2 km^2/s (current-moment spectral density). */

/** A point source, or a spot region when spreadDeg > 0 (see spot.ts). */
export type ForwardSource = {
  name?: string;
  lat: number;
  lon: number;
  /** C^2 km^2 / s */
  intensity: number;
  /** angular radius (degrees) of a uniform spot around (lat, lon); 0 or absent = point */
  spreadDeg?: number;
};
