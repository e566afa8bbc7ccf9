/**
 * Pipeline measurements (no pass/fail): one day of one invented station, three
 * components at 200 Hz (about 52 million samples), generated block by block
 * and streamed through the interval splitter and the full per-interval
 * processing (transient screen, Welch, calibration, line suppression, 5-mode
 * fit). Reports generation and processing time separately, the median time
 * per interval and component, and the peak resident memory of the process.
 */
import FFT from 'fft.js';
import { IntervalSplitter, type SampleBlock } from '@/src/engine/pipeline/interval-splitter';
import { processInterval } from '@/src/engine/pipeline/process-interval';
import type { ProcessingConfig } from '@/src/engine/pipeline/types';

const FS = 200;
const DAY_SECONDS = 86_400;
const BLOCK = 12_000; // one minute per block, as an upload reader would hand it over
const COMPONENTS = 3;

/**
 * Invented Schumann-like signal, one block at a time: noise with a five-mode
 * Lorentzian spectrum made in the frequency domain (random Fourier
 * coefficients, Timmer & König 1995) on a 16384-point grid and cut to the
 * block, plus 50 Hz mains, a 16.7 Hz line and a burst about every 83 minutes.
 */
export function makeGenerator(seed: number) {
  let s = seed >>> 0 || 1;
  const uniform = () => {
    s ^= s << 13;
    s ^= s >>> 17;
    s ^= s << 5;
    return ((s >>> 0) + 0.5) / 4294967296;
  };
  const gauss = () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
  const N = 16384;
  const fft = new FFT(N);
  const modes = [
    [7.85, 1.0, 0.9],
    [14.15, 0.7, 1.35],
    [20.4, 0.5, 1.8],
    [26.5, 0.36, 2.1],
    [32.7, 0.26, 2.4],
    [38.9, 0.19, 2.7],
    [45.1, 0.14, 3.0],
  ];
  const psd = (f: number) =>
    modes.reduce((acc, [fn, a, g]) => acc + a / (1 + ((f - fn) / g) ** 2), 0.12 - 1e-3 * Math.min(f, 100));
  const amp = Float64Array.from({ length: N / 2 }, (_, k) => (k === 0 ? 0 : Math.sqrt((psd((k * FS) / N) * FS * N) / 4)));
  const spec = new Float64Array(2 * N);
  const out = new Float64Array(2 * N);
  return (first: number, length: number): SampleBlock => {
    const columns = Array.from({ length: COMPONENTS }, () => new Float64Array(length));
    for (let c = 0; c < COMPONENTS; c++) {
      spec.fill(0);
      for (let k = 1; k < N / 2; k++) {
        const re = amp[k] * gauss();
        const im = amp[k] * gauss();
        spec[2 * k] = re;
        spec[2 * k + 1] = im;
        spec[2 * (N - k)] = re;
        spec[2 * (N - k) + 1] = -im;
      }
      fft.inverseTransform(out, spec);
      const col = columns[c];
      for (let j = 0; j < length; j++) {
        const n = first + j;
        let y = out[2 * j] + 2 * Math.sin((2 * Math.PI * 50 * n) / FS) + Math.sin((2 * Math.PI * (50 / 3) * n) / FS);
        if (n % 1_000_003 < 300) y += 30 * gauss();
        col[j] = y;
      }
    }
    return { firstSample: first, length, columns };
  };
}

export default async function pipelineBench(): Promise<void> {
  const config: ProcessingConfig = {
    sampleRateHz: FS,
    mainsHz: 50,
    interferenceLines: [{ frequencyHz: 50 / 3 }],
    calibration: {
      kind: 'response',
      points: [
        { frequencyHz: 0, amplitude: 1, phaseDeg: 0 },
        { frequencyHz: 100, amplitude: 0.8, phaseDeg: -30 },
      ],
    },
    modes: 5,
  };
  const total = DAY_SECONDS * FS;
  const generate = makeGenerator(20261202);
  const splitter = new IntervalSplitter({ sampleRateHz: FS, startMs: Date.UTC(2026, 2, 14), components: COMPONENTS });
  let genMs = 0;
  let procMs = 0;
  let procCpuUs = 0;
  const perInterval: number[] = [];
  let intervals = 0;
  const flagCounts = new Map<string, number>();
  const handle = (list: ReturnType<IntervalSplitter['push']>) => {
    for (const iv of list) {
      for (let c = 0; c < COMPONENTS; c++) {
        const t0 = performance.now();
        const cpu0 = process.cpuUsage();
        const r = processInterval(iv.columns[c], config);
        const cpu = process.cpuUsage(cpu0);
        procCpuUs += cpu.user + cpu.system;
        const dt = performance.now() - t0;
        perInterval.push(dt);
        procMs += dt;
        intervals++;
        for (const f of r.flags) flagCounts.set(f, (flagCounts.get(f) ?? 0) + 1);
      }
    }
  };
  for (let first = 0; first < total; first += BLOCK) {
    const t0 = performance.now();
    const block = generate(first, Math.min(BLOCK, total - first));
    const t1 = performance.now();
    genMs += t1 - t0;
    const cpu0 = process.cpuUsage();
    const done = splitter.push(block);
    const cpu = process.cpuUsage(cpu0);
    procCpuUs += cpu.user + cpu.system;
    procMs += performance.now() - t1;
    handle(done);
  }
  handle(splitter.finish());
  perInterval.sort((a, b) => a - b);
  const rssMb = process.resourceUsage().maxRSS / 1024;
  console.log(
    `samples: ${((total * COMPONENTS) / 1e6).toFixed(1)} million (${COMPONENTS} components x ${DAY_SECONDS} s x ${FS} Hz)`,
  );
  console.log(`intervals processed: ${intervals} (interval x component)`);
  console.log(`synthetic generation: ${(genMs / 1000).toFixed(2)} s (not part of the pipeline)`);
  console.log(
    `pipeline (split + process): ${(procMs / 1000).toFixed(2)} s wall, ${(procCpuUs / 1e6).toFixed(2)} s CPU, one thread (target <= 30 s)`,
  );
  console.log(
    `per interval and component: median ${perInterval[Math.floor(perInterval.length / 2)].toFixed(1)} ms, max ${perInterval[perInterval.length - 1].toFixed(1)} ms`,
  );
  console.log(`peak resident memory: ${rssMb.toFixed(0)} MB (target < 500 MB)`);
  console.log(`flags raised: ${[...flagCounts].map(([k, v]) => `${k} ${v}`).join(', ') || 'none'}`);
}
