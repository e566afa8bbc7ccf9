/**
 * Discrete Fourier transform of any length, X_k = sum_j x_j exp(-2 pi i j k / m).
 * Power-of-two lengths go straight to fft.js; other lengths use Bluestein's
 * chirp-z identity jk = (j^2 + k^2 - (k - j)^2) / 2, which turns the DFT into
 * a circular convolution done with power-of-two FFTs (Bluestein 1970, IEEE
 * Trans. Audio Electroacoust. 18, 451). Plans are cached per length.
 */
import FFT from 'fft.js';

export interface ComplexDft {
  readonly size: number;
  /** Forward transform of interleaved complex `input` (length 2m) into `output` (length 2m). */
  forward(input: Float64Array, output: Float64Array): void;
}

const isPowerOfTwo = (m: number) => m > 1 && (m & (m - 1)) === 0;

function radix2Plan(m: number): ComplexDft {
  const fft = new FFT(m);
  return { size: m, forward: (input, output) => fft.transform(output, input) };
}

function bluesteinPlan(m: number): ComplexDft {
  let big = 2;
  while (big < 2 * m - 1) big *= 2;
  const fft = new FFT(big);
  // chirp c_j = exp(-i pi j^2 / m); j^2 is reduced mod 2m so the angle stays exact
  const chirp = new Float64Array(2 * m);
  for (let j = 0; j < m; j++) {
    const angle = (Math.PI * ((j * j) % (2 * m))) / m;
    chirp[2 * j] = Math.cos(angle);
    chirp[2 * j + 1] = -Math.sin(angle);
  }
  // filter b_l = conj(c_l) for l = -(m-1) .. m-1, wrapped circularly, transformed once
  const filter = new Float64Array(2 * big);
  for (let l = 0; l < m; l++) {
    filter[2 * l] = chirp[2 * l];
    filter[2 * l + 1] = -chirp[2 * l + 1];
    if (l > 0) {
      filter[2 * (big - l)] = chirp[2 * l];
      filter[2 * (big - l) + 1] = -chirp[2 * l + 1];
    }
  }
  const filterHat = new Float64Array(2 * big);
  fft.transform(filterHat, filter);
  const a = new Float64Array(2 * big);
  const aHat = new Float64Array(2 * big);
  const conv = new Float64Array(2 * big);
  return {
    size: m,
    forward(input, output) {
      a.fill(0);
      for (let j = 0; j < m; j++) {
        const xr = input[2 * j],
          xi = input[2 * j + 1];
        const cr = chirp[2 * j],
          ci = chirp[2 * j + 1];
        a[2 * j] = xr * cr - xi * ci;
        a[2 * j + 1] = xr * ci + xi * cr;
      }
      fft.transform(aHat, a);
      for (let k = 0; k < big; k++) {
        const ar = aHat[2 * k],
          ai = aHat[2 * k + 1];
        const br = filterHat[2 * k],
          bi = filterHat[2 * k + 1];
        aHat[2 * k] = ar * br - ai * bi;
        aHat[2 * k + 1] = ar * bi + ai * br;
      }
      fft.inverseTransform(conv, aHat);
      for (let k = 0; k < m; k++) {
        const vr = conv[2 * k],
          vi = conv[2 * k + 1];
        const cr = chirp[2 * k],
          ci = chirp[2 * k + 1];
        output[2 * k] = vr * cr - vi * ci;
        output[2 * k + 1] = vr * ci + vi * cr;
      }
    },
  };
}

function directPlan(m: number): ComplexDft {
  return {
    size: m,
    forward(input, output) {
      if (m === 1) {
        output[0] = input[0];
        output[1] = input[1];
      }
    },
  };
}

const plans = new Map<number, ComplexDft>();

/** A cached transform plan for length m (not safe to share between threads; each worker has its own). */
export function complexDft(m: number): ComplexDft {
  if (!Number.isInteger(m) || m < 1) throw new RangeError(`transform length must be a positive whole number, got ${m}`);
  let plan = plans.get(m);
  if (!plan) {
    plan = m === 1 ? directPlan(m) : isPowerOfTwo(m) ? radix2Plan(m) : bluesteinPlan(m);
    plans.set(m, plan);
  }
  return plan;
}
