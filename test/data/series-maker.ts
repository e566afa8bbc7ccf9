/**
 * Invented station recordings in the Cavitas time-series CSV layout, made
 * deterministically for tests:
 * - 'white': Gaussian white noise of standard deviation sigma (one-sided PSD
 *   2 sigma^2 / fs, Parseval's theorem; Bendat & Piersol, Random Data, §5.2);
 * - 'modes': Gaussian noise whose PSD is exactly a floor plus Lorentzian
 *   modes, by frequency-domain synthesis (random complex Gaussian
 *   coefficients scaled by sqrt(PSD), inverse FFT; Timmer & Koenig 1995,
 *   A&A 300, 707).
 */
import FFT from 'fft.js';
export type Synth =
  | { kind: 'white'; sigma: number; unit: string }
  | { kind: 'modes'; modes: { f: number; halfWidth: number; gain: number }[]; floor: number; unit: string };

/** The PSD shape of a 'modes' synthesis (arbitrary scale): floor + sum gain / (1 + ((f - f_n)/g_n)^2). */
export function modesPsd(s: Extract<Synth, { kind: 'modes' }>, f: number): number {
  return s.floor + s.modes.reduce((acc, m) => acc + m.gain / (1 + ((f - m.f) / m.halfWidth) ** 2), 0);
}

function rng(seed: number) {
  let a = seed >>> 0;
  const u = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - u())) * Math.cos(2 * Math.PI * u());
}

export function synthesize(s: Synth, n: number, fs: number, seed: number): Float64Array {
  const g = rng(seed);
  const out = new Float64Array(n);
  if (s.kind === 'white') {
    for (let i = 0; i < n; i++) out[i] = s.sigma * g();
    return out;
  }
  let size = 2;
  while (size < n) size *= 2;
  const fft = new FFT(size);
  const spec = fft.createComplexArray() as number[];
  for (let k = 1; k < size / 2; k++) {
    const a = Math.sqrt(modesPsd(s, (k * fs) / size));
    spec[2 * k] = a * g();
    spec[2 * k + 1] = a * g();
  }
  const time = fft.createComplexArray() as number[];
  fft.inverseTransform(time, spec);
  // The real part of a one-sided spectrum's transform has a PSD proportional to |coefficient|^2.
  for (let i = 0; i < n; i++) out[i] = time[2 * i] * size;
  return out;
}

export interface SeriesSpec {
  station: string;
  fs: number;
  startUtc: string;
  seconds: number;
  components: Partial<Record<'Ez' | 'Bns' | 'Bew', Synth>>;
  seed?: number;
  /** Sample rate written in the header when it should disagree with the data. */
  headerRate?: number;
}

export function seriesCsv(spec: SeriesSpec): string {
  const names = Object.keys(spec.components) as ('Ez' | 'Bns' | 'Bew')[];
  const n = Math.round(spec.seconds * spec.fs);
  const cols = names.map((c, k) => synthesize(spec.components[c]!, n, spec.fs, (spec.seed ?? 7) * 31 + k));
  const digits = Math.max(0, Math.ceil(Math.log10(spec.fs)));
  const lines = [
    '# cavitas-series 1',
    `# station: ${spec.station}`,
    `# sample-rate-hz: ${spec.headerRate ?? spec.fs}`,
    `# start-utc: ${spec.startUtc}`,
    `# units: ${names.map((c) => `${c}=${spec.components[c]!.unit}`).join(', ')}`,
    `seconds,${names.join(',')}`,
  ];
  for (let i = 0; i < n; i++) {
    lines.push(`${(i / spec.fs).toFixed(digits)},${cols.map((c) => c[i].toPrecision(6)).join(',')}`);
  }
  return lines.join('\n') + '\n';
}

/** A Web ReadableStream over text, in chunks of `size` bytes (like a request body). */
export function bodyOf(text: string | Uint8Array, size = 65536): ReadableStream<Uint8Array> {
  const bytes = typeof text === 'string' ? new TextEncoder().encode(text) : text;
  let at = 0;
  return new ReadableStream({
    pull(ctrl) {
      if (at >= bytes.length) {
        ctrl.close();
        return;
      }
      ctrl.enqueue(bytes.slice(at, at + size));
      at += size;
    },
  });
}

/** Schumann-like modes (usual frequencies, common practice) for the 'modes' synthesis. */
export const TEST_MODES = [
  { f: 7.8, halfWidth: 1.0, gain: 1 },
  { f: 14.1, halfWidth: 1.4, gain: 0.8 },
  { f: 20.3, halfWidth: 1.8, gain: 0.6 },
];
