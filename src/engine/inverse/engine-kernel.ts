/**
 * The engine's kernel table for a cavity configuration on the inverter's
 * frequency grid (cached by the engine per cavity and grid, so each worker
 * thread builds it once).
 */
import { resolveCavity, type CavityConfig } from '@/src/engine/cavity';
import { getKernelTable } from '@/src/engine/kernels/kernel-table';
import type { KernelSampler } from './kernel-sampler';

export function engineKernel(config: CavityConfig, freqs: Float64Array): KernelSampler {
  return getKernelTable(resolveCavity(config), freqs);
}
