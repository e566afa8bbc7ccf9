/**
 * Synthetic observations for recovery studies, tests and benchmarks: the
 * engine's kernel tables summed over point sources (powers add, sources being
 * incoherent), projected on each coil by the bearing, times seeded log-normal
 * noise of standard deviation sigma in ln(power).
 */
import type { CavityConfig } from '../cavity/types';
import { COMPONENTS, type Component } from '../components';
import { greatCircle } from '../geometry/great-circle';
import { mulberry32 } from '../random';
import { engineKernel } from './kernel-sampler';
import { createKernelBuffers } from './kernel-sampler';
import type { ObservedSeries, StationSite } from './types';

export type SyntheticSource = { lat: number; lon: number; intensity: number };

/** Ez, Bns and Bew of every station (in that order), noise drawn station by station, bin by bin. */
export function syntheticObserved(
  cavity: CavityConfig,
  stations: readonly StationSite[],
  sources: readonly SyntheticSource[],
  freqs: Float64Array,
  sigma: number,
  seed: number,
): ObservedSeries[] {
  const kernel = engineKernel(cavity, freqs);
  const buf = createKernelBuffers(freqs.length);
  const rnd = mulberry32(seed);
  const gauss = () => Math.sqrt(-2 * Math.log(1 - rnd())) * Math.cos(2 * Math.PI * rnd());
  return stations.flatMap((st) => {
    const sums = { Ez: new Float64Array(freqs.length), Bns: new Float64Array(freqs.length), Bew: new Float64Array(freqs.length) };
    for (const s of sources) {
      const g = greatCircle(st.lat, st.lon, s.lat, s.lon);
      kernel.sample(g.theta, buf);
      const ns = Math.sin(g.bearing) ** 2;
      const ew = Math.cos(g.bearing) ** 2;
      for (let k = 0; k < freqs.length; k++) {
        sums.Ez[k] += s.intensity * buf.ez[k];
        sums.Bns[k] += s.intensity * buf.bh[k] * ns;
        sums.Bew[k] += s.intensity * buf.bh[k] * ew;
      }
    }
    return COMPONENTS.map((c: Component) => ({
      station: st.code,
      component: c,
      frequencies: freqs,
      power: sums[c].map((p) => p * Math.exp(sigma * gauss())),
      sigmaLog: sigma,
    }));
  });
}
