/**
 * Table-free spectra: the same sums as the forward model, with every kernel value
 * evaluated straight from the Legendre functions. Slow; the reference that kernel
 * tables and the `forward` command are checked against.
 */
import { bandFrequencies, type Band } from '../band';
import { greatCircle } from '../geometry/great-circle';
import { directKernel } from '../kernels/direct';
import { spotNodes } from '../sources/spot';
import type { ForwardSource } from '../sources/types';
import { asCavity } from './predict';
import type { Cavity, CavityConfig } from '../cavity/types';
import type { ForwardStation, Spectrum } from './types';

export function predictSpectraDirect(input: {
  cavity: Cavity | CavityConfig;
  band: Band;
  stations: readonly ForwardStation[];
  sources: readonly ForwardSource[];
}): Spectrum[] {
  const cavity = asCavity(input.cavity);
  const freqs = Array.from(bandFrequencies(input.band));
  const out: Spectrum[] = [];
  for (const st of input.stations) {
    const ez = freqs.map(() => 0);
    const bns = freqs.map(() => 0);
    const bew = freqs.map(() => 0);
    for (const src of input.sources)
      for (const node of spotNodes(src.lat, src.lon, src.spreadDeg ?? 0)) {
        const g = greatCircle(st.lat, st.lon, node.lat, node.lon);
        const w = src.intensity * node.weight;
        freqs.forEach((f, j) => {
          const k = directKernel(cavity, f, g.theta);
          ez[j] += w * k.ez;
          bns[j] += w * k.bh * Math.sin(g.bearing) ** 2;
          bew[j] += w * k.bh * Math.cos(g.bearing) ** 2;
        });
      }
    for (const component of st.components)
      out.push({
        station: st.code,
        component,
        frequencies: freqs,
        power: component === 'Ez' ? ez : component === 'Bns' ? bns : bew,
      });
  }
  return out;
}
