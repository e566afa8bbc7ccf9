export { predictSpectra, spectraFromPower, asCavity, type PredictInput } from './predict';
export { createForwardModel, type ForwardModel, type StationPower } from './forward-model';
export { predictSpectraDirect } from './direct-spectra';
export { toDisplayUnits, fromDisplayUnits, displayFactor } from './units';
export type { ForwardStation, Spectrum, DisplaySpectrum } from './types';
