/** Kernel tables' public shape and the preallocated output of KernelTable.sample (one value per frequency bin). */

/** Preallocated output of KernelTable.sample: one value per frequency bin. */
export type KernelSample = {
  /** Ez power per unit intensity, (V/m)^2/Hz per C^2 km^2/s */
  ez: Float64Array;
  /** horizontal magnetic power per unit intensity before coil projection, T^2/Hz per C^2 km^2/s */
  bh: Float64Array;
  /** d ez / d theta, per radian */
  dEz: Float64Array;
  /** d bh / d theta, per radian */
  dBh: Float64Array;
};

export function createKernelSample(n: number): KernelSample {
  return { ez: new Float64Array(n), bh: new Float64Array(n), dEz: new Float64Array(n), dBh: new Float64Array(n) };
}

export interface KernelTable {
  readonly freqs: Float64Array;
  /** number of frequency bins */
  readonly n: number;
  /** theta grid: first node, step, node count (radians) */
  readonly thetaMin: number;
  readonly step: number;
  readonly nodes: number;
  /** Fills out.ez, out.bh, out.dEz, out.dBh at angular distance theta (radians). No allocation. */
  sample(theta: number, out: KernelSample): void;
  /** Fills only out.ez and out.bh (no derivatives; cheaper, for misfit-only evaluations). */
  samplePower(theta: number, out: Pick<KernelSample, 'ez' | 'bh'>): void;
  /**
   * Adds wEz ez, wNs bh and wEw bh at theta to ez, bns, bew (the same values samplePower gives,
   * without the intermediate arrays; for forward sums over sources). No allocation.
   */
  addPower(theta: number, wEz: number, wNs: number, wEw: number, ez: Float64Array, bns: Float64Array, bew: Float64Array): void;
}
