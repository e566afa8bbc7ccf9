/** SI <-> display units of spectra: (mV/m)^2/Hz for Ez, pT^2/Hz for the magnetic coils. */
import { COMPONENT_INFO, type Component } from '../components';
import { T2_TO_PT2, VM2_TO_MVM2 } from '../constants';
import type { DisplaySpectrum, Spectrum } from './types';

export function displayFactor(component: Component): number {
  return component === 'Ez' ? VM2_TO_MVM2 : T2_TO_PT2;
}

export function toDisplayUnits(s: Spectrum): DisplaySpectrum {
  const k = displayFactor(s.component);
  return { ...s, power: s.power.map((p) => p * k), unit: COMPONENT_INFO[s.component].displayUnit };
}

export function fromDisplayUnits(component: Component, power: readonly number[]): number[] {
  const k = displayFactor(component);
  return power.map((p) => p / k);
}
