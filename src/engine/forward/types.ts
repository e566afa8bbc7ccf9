/** Result and input types of spectra prediction, shared by CLI, worker and UI. */
import type { Component } from '../components';

export type ForwardStation = { code: string; lat: number; lon: number; components: readonly Component[] };

/** One predicted (or observed) power spectrum. SI: (V/m)^2/Hz for Ez, T^2/Hz for Bns/Bew. */
export type Spectrum = { station: string; component: Component; frequencies: number[]; power: number[] };

/** A spectrum in display units: (mV/m)^2/Hz for Ez, pT^2/Hz for Bns/Bew. */
export type DisplaySpectrum = Spectrum & { unit: string };
