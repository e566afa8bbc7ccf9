/**
 * Sampling a kernel table: quintic Hermite interpolation in theta of g = ln(ez) and
 * g = ln(bh / sin^2 theta), matching g, g', g'' at both nodes of the interval
 * (basis functions of fifth-degree Hermite interpolation, e.g. Burden & Faires,
 * Numerical Analysis, ch. 3), then power = exp(g) (x sin^2 theta for B) and its
 * theta-derivative by the chain rule. Allocation-free.
 * Data layout: data[((i * n) + j) * 6 + k], k = gE, h gE', h^2 gE'', gB, h gB', h^2 gB''.
 */
import type { KernelSample, KernelTable } from './kernel-sample';

export function createHermiteSampler(
  freqs: Float64Array,
  data: Float64Array,
  thetaMin: number,
  h: number,
  nodes: number,
): KernelTable {
  const n = freqs.length;
  const thetaMax = Math.PI;
  const stride = n * 6;
  const invH = 1 / h;
  // Scratch of the last locate(): quintic Hermite basis h0..h5 (values), sin^2 theta, t.
  const w = new Float64Array(8);
  /** Clamp theta to the table, find its interval, fill `w`; returns the data offset of the interval's left node. */
  function locate(theta: number): number {
    if (!(theta > thetaMin)) theta = thetaMin;
    else if (theta > thetaMax) theta = thetaMax;
    const u = (theta - thetaMin) * invH;
    let i = Math.floor(u);
    if (i > nodes - 2) i = nodes - 2;
    const t = u - i;
    const t2 = t * t,
      t3 = t2 * t,
      t4 = t3 * t,
      t5 = t4 * t;
    w[0] = 1 - 10 * t3 + 15 * t4 - 6 * t5;
    w[1] = t - 6 * t3 + 8 * t4 - 3 * t5;
    w[2] = 0.5 * (t2 - 3 * t3 + 3 * t4 - t5);
    w[3] = 10 * t3 - 15 * t4 + 6 * t5;
    w[4] = -4 * t3 + 7 * t4 - 3 * t5;
    w[5] = 0.5 * (t3 - 2 * t4 + t5);
    const sn = Math.sin(theta);
    w[6] = sn * sn;
    w[7] = t;
    return i * stride;
  }
  return {
    freqs,
    n,
    thetaMin,
    step: h,
    nodes,
    sample(theta: number, out: KernelSample): void {
      const clamped = !(theta > thetaMin) || theta > thetaMax;
      let a = locate(theta);
      const h0 = w[0],
        h1 = w[1],
        h2 = w[2],
        h3 = w[3],
        h4 = w[4],
        h5 = w[5],
        s2 = w[6],
        t = w[7];
      const t2 = t * t,
        t3 = t2 * t,
        t4 = t3 * t;
      // t-derivatives of the basis, per radian
      const dScale = clamped ? 0 : invH;
      const q0 = (-30 * t2 + 60 * t3 - 30 * t4) * dScale,
        q1 = (1 - 18 * t2 + 32 * t3 - 15 * t4) * dScale;
      const q2 = 0.5 * (2 * t - 9 * t2 + 12 * t3 - 5 * t4) * dScale,
        q3 = -q0;
      const q4 = (-12 * t2 + 28 * t3 - 15 * t4) * dScale,
        q5 = 0.5 * (3 * t2 - 8 * t3 + 5 * t4) * dScale;
      const s2d = clamped ? 0 : 2 * Math.sin(theta) * Math.cos(theta);
      const { ez, bh, dEz, dBh } = out;
      for (let j = 0; j < n; j++, a += 6) {
        const b = a + stride;
        const e0 = data[a],
          e1 = data[a + 1],
          e2 = data[a + 2],
          f0 = data[b],
          f1 = data[b + 1],
          f2 = data[b + 2];
        const g0 = data[a + 3],
          g1 = data[a + 4],
          g2 = data[a + 5],
          k0 = data[b + 3],
          k1 = data[b + 4],
          k2 = data[b + 5];
        const ge = h0 * e0 + h1 * e1 + h2 * e2 + h3 * f0 + h4 * f1 + h5 * f2;
        const gep = q0 * e0 + q1 * e1 + q2 * e2 + q3 * f0 + q4 * f1 + q5 * f2;
        const gb = h0 * g0 + h1 * g1 + h2 * g2 + h3 * k0 + h4 * k1 + h5 * k2;
        const gbp = q0 * g0 + q1 * g1 + q2 * g2 + q3 * k0 + q4 * k1 + q5 * k2;
        const pe = Math.exp(ge);
        const pb = Math.exp(gb);
        ez[j] = pe;
        dEz[j] = pe * gep;
        bh[j] = pb * s2;
        dBh[j] = pb * (s2 * gbp + s2d);
      }
    },
    samplePower(theta: number, out: Pick<KernelSample, 'ez' | 'bh'>): void {
      let a = locate(theta);
      const h0 = w[0],
        h1 = w[1],
        h2 = w[2],
        h3 = w[3],
        h4 = w[4],
        h5 = w[5],
        s2 = w[6];
      const { ez, bh } = out;
      for (let j = 0; j < n; j++, a += 6) {
        const b = a + stride;
        ez[j] = Math.exp(h0 * data[a] + h1 * data[a + 1] + h2 * data[a + 2] + h3 * data[b] + h4 * data[b + 1] + h5 * data[b + 2]);
        bh[j] =
          s2 *
          Math.exp(
            h0 * data[a + 3] + h1 * data[a + 4] + h2 * data[a + 5] + h3 * data[b + 3] + h4 * data[b + 4] + h5 * data[b + 5],
          );
      }
    },
    addPower(theta: number, wEz: number, wNs: number, wEw: number, ez: Float64Array, bns: Float64Array, bew: Float64Array): void {
      // samplePower's values, added straight into the spectra (no intermediate arrays)
      let a = locate(theta);
      const h0 = w[0],
        h1 = w[1],
        h2 = w[2],
        h3 = w[3],
        h4 = w[4],
        h5 = w[5],
        s2 = w[6];
      for (let j = 0; j < n; j++, a += 6) {
        const b = a + stride;
        const e = Math.exp(
          h0 * data[a] + h1 * data[a + 1] + h2 * data[a + 2] + h3 * data[b] + h4 * data[b + 1] + h5 * data[b + 2],
        );
        const p =
          s2 *
          Math.exp(
            h0 * data[a + 3] + h1 * data[a + 4] + h2 * data[a + 5] + h3 * data[b + 3] + h4 * data[b + 4] + h5 * data[b + 5],
          );
        ez[j] += wEz * e;
        bns[j] += wNs * p;
        bew[j] += wEw * p;
      }
    },
  };
}
