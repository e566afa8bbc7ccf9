/**
 * Predicted spectra for any stations x components from any sources, one entry
 * per station and component in input order, power in SI units.
 */
import type { Band } from '../band';
import { resolveCavity } from '../cavity/resolve';
import type { Cavity, CavityConfig } from '../cavity/types';
import type { ForwardSource } from '../sources/types';
import { createForwardModel, type StationPower } from './forward-model';
import type { ForwardStation, Spectrum } from './types';

export type PredictInput = {
  cavity: Cavity | CavityConfig;
  band: Band;
  stations: readonly ForwardStation[];
  sources: readonly ForwardSource[];
};

export function asCavity(c: Cavity | CavityConfig): Cavity {
  return 'nu' in c && typeof c.nu === 'function' ? c : resolveCavity(c as CavityConfig);
}

export function predictSpectra({ cavity, band, stations, sources }: PredictInput): Spectrum[] {
  const model = createForwardModel(asCavity(cavity), band, stations);
  const out = model.createOutput();
  model.evaluate(sources, out);
  return spectraFromPower(stations, model.freqs, out);
}

/** Arranges per-station power arrays as one Spectrum per station and requested component. */
export function spectraFromPower(stations: readonly ForwardStation[], freqs: Float64Array, power: StationPower[]): Spectrum[] {
  const frequencies = Array.from(freqs);
  const spectra: Spectrum[] = [];
  stations.forEach((st, s) => {
    for (const component of st.components) {
      const p = component === 'Ez' ? power[s].ez : component === 'Bns' ? power[s].bns : power[s].bew;
      spectra.push({ station: st.code, component, frequencies, power: Array.from(p) });
    }
  });
  return spectra;
}
