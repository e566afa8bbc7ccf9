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
