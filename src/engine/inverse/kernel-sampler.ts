/**
 * What the inverter needs from a kernel table: the power kernels per unit
 * intensity at an angular distance, and their theta-derivatives, on a fixed
 * frequency grid. The engine's KernelTable satisfies this structurally;
 * engineKernel gives it for a cavity configuration (cached by the engine per
 * cavity and grid, so each worker thread builds it once).
 */
import { resolveCavity, type CavityConfig } from '@/src/engine/cavity';
import { getKernelTable } from '@/src/engine/kernels/kernel-table';

export interface KernelBuffers {
  ez: Float64Array;
  bh: Float64Array;
  dEz: Float64Array;
  dBh: Float64Array;
}

export interface KernelSampler {
  readonly n: number;
  readonly freqs: Float64Array;
  sample(theta: number, out: KernelBuffers): void;
}

export function createKernelBuffers(n: number): KernelBuffers {
  return { ez: new Float64Array(n), bh: new Float64Array(n), dEz: new Float64Array(n), dBh: new Float64Array(n) };
}

/** The engine's kernel table for a cavity configuration on the inverter's frequency grid. */
export function engineKernel(config: CavityConfig, freqs: Float64Array): KernelSampler {
  return getKernelTable(resolveCavity(config), freqs);
}
