/**
 * What the inverter needs from a kernel table: the power kernels per unit
 * intensity at an angular distance, and their theta-derivatives, on a fixed
 * frequency grid. The engine's KernelTable satisfies this structurally.
 */
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
