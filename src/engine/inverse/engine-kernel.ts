/**
 * The engine's kernel for a cavity configuration on the inverter's grid.
 * Uses the direct (table-free) evaluation of the engine's kernels, one
 * Legendre evaluation per frequency and distance.
 */
import { resolveCavity, type CavityConfig } from '@/src/engine/cavity';
import { directKernel } from '@/src/engine/kernels/direct';
import type { KernelBuffers, KernelSampler } from './kernel-sampler';

export function engineKernel(config: CavityConfig, freqs: Float64Array): KernelSampler {
  const cavity = resolveCavity(config);
  return {
    n: freqs.length,
    freqs,
    sample(theta: number, out: KernelBuffers) {
      for (let k = 0; k < freqs.length; k++) {
        const d = directKernel(cavity, freqs[k], theta);
        out.ez[k] = d.ez;
        out.bh[k] = d.bh;
        out.dEz[k] = d.dEz;
        out.dBh[k] = d.dBh;
      }
    },
  };
}
