/**
 * Inverter benchmark (measurements only): 12 stations x 3 components x 141
 * bins (5–40 Hz at 0.25 Hz), three regions with free intensity and centre
 * (9 parameters), 64 starts on all cores — cold (pool start and kernel tables
 * included) and warm; peak resident memory; and a day of 144 intervals x 16
 * warm-started starts. Data: the engine's kernels with seeded log-normal noise.
 * Also the mode-parameter inversion of fixtures/cases/modes.json (4 stations,
 * 27 fitted modes, 3 parameters): CPU time per start, in-process.
 */
import path from 'node:path';
import { projectRoot } from '@/src/ops/paths';
import { availableParallelism, loadavg } from 'node:os';
import { bandFrequencies } from '@/src/engine/band';
import { invertSpectra } from '@/src/engine/inverse/invert';
import { invertSeries } from '@/src/engine/inverse/interval-series';
import { closeInversionPool } from '@/src/engine/inverse/threads/pool';
import type { SpectrumInversionInput } from '@/src/engine/inverse/interval-problem';
import { syntheticObserved } from '@/src/engine/inverse/synthetic';
import { invertModes } from '@/src/engine/inverse/invert';
import { invertAnyCaseSchema, modeInputFromCase } from '@/src/engine/case/mode-input';
import { readFileSync } from 'node:fs';

export const cavity = { model: 'linear' as const, earthRadiusKm: 6371, heightKm: 60 };
export const band = { minHz: 5, maxHz: 40, stepHz: 0.25 };
const freqs = bandFrequencies(band);
// Invented station layout for the benchmark.
export const stations = Array.from({ length: 12 }, (_, i) => ({
  code: `B${String(i + 1).padStart(2, '0')}`,
  lat: -55 + ((i * 37) % 110),
  lon: -170 + i * 29,
}));
export const unknowns = [
  { name: 'R1', intensity: { min: 1e3, max: 1e6 }, lat: { min: -25, max: 25 }, lon: { min: -90, max: -40 } },
  { name: 'R2', intensity: { min: 1e3, max: 1e6 }, lat: { min: -25, max: 25 }, lon: { min: -10, max: 40 } },
  { name: 'R3', intensity: { min: 1e3, max: 1e6 }, lat: { min: -25, max: 25 }, lon: { min: 90, max: 150 } },
];

export function synthetic(t: number, seed: number): SpectrumInversionInput {
  // Three regions drifting slowly over the day (t in [0, 1)).
  const truth = [
    { lat: -5 + 6 * t, lon: -62 + 10 * t, intensity: 3e4 * (1 + Math.sin(2 * Math.PI * t)) + 5e3 },
    { lat: 4 - 5 * t, lon: 18 + 8 * t, intensity: 4e4 * (1 + Math.cos(2 * Math.PI * t)) + 5e3 },
    { lat: 2 + 4 * t, lon: 118 - 12 * t, intensity: 2e4 * (1.2 + Math.sin(2 * Math.PI * (t + 0.3))) },
  ];
  const observed = syntheticObserved(cavity, stations, truth, freqs, 0.1, seed);
  return { cavity, stations, observed, unknowns };
}

function rssMb(): string {
  return `${(process.memoryUsage().rss / 2 ** 20).toFixed(0)} MB now, peak ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB`;
}

export default async function bench(): Promise<void> {
  const threads = availableParallelism();
  const input = synthetic(0.25, 99);
  console.log(
    `data: 12 stations x 3 components x ${freqs.length} bins; 9 free parameters; threads ${threads}; load average ${loadavg()[0].toFixed(1)}`,
  );
  // wall time, and CPU time of all threads of this process (less sensitive to other load)
  const timed = async (label: string, t: number) => {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    const r = await invertSpectra(input, { starts: 64, seed: 1, threads: t });
    const s = (performance.now() - t0) / 1000;
    const c = process.cpuUsage(c0);
    console.log(
      `64 starts, ${label}: ${s.toFixed(2)} s wall, ${((c.user + c.system) / 1e6).toFixed(2)} s CPU; ${r.minima.length} minima, best misfit ${r.minima[0].misfit.toFixed(1)} (N = ${r.nData}), best count ${r.minima[0].count}`,
    );
  };
  await timed('cold (pool start + kernel tables in workers)', threads);
  await timed('warm', threads);
  await timed('in-process (1 thread)', 1);
  console.log(`memory after the 64-start runs: ${rssMb()}`);
  const day = Array.from({ length: 144 }, (_, i) => synthetic(i / 144, 1000 + i));
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  let good = 0;
  await invertSeries(
    day,
    { starts: 16, seed: 1, threads },
    {
      onInterval: ({ result }) => {
        if (result.minima[0].reducedChi2 < 1.2) good++;
      },
    },
  );
  const c = process.cpuUsage(c0);
  console.log(
    `day: 144 intervals x 16 starts (warm-started): ${((performance.now() - t0) / 1000).toFixed(1)} s wall, ${((c.user + c.system) / 1e6).toFixed(1)} s CPU; intervals with reduced chi2 < 1.2: ${good}; load average ${loadavg()[0].toFixed(1)}`,
  );
  console.log(`memory after the day: ${rssMb()}`);
  await modeStarts();
  await closeInversionPool();
}

/** Mode-parameter inversion: every misfit evaluation fits each predicted spectrum with the pipeline's mode fit. */
async function modeStarts(): Promise<void> {
  const c = invertAnyCaseSchema.parse(
    JSON.parse(readFileSync(path.join(projectRoot, 'fixtures', 'cases', 'modes.json'), 'utf8')),
  );
  const input = modeInputFromCase(c);
  await invertModes(input, { starts: 1, seed: 2, threads: 1 }); // kernel tables
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const r = await invertModes(input, { starts: 4, seed: 1, threads: 1 });
  const cpu = process.cpuUsage(c0);
  const s = r.minima[0].sources[0];
  console.log(
    `modes: ${r.nData / 3} fitted modes, 4 starts in-process: ${((cpu.user + cpu.system) / 4e6).toFixed(2)} s CPU per start (${((performance.now() - t0) / 4000).toFixed(2)} s wall); best misfit ${r.minima[0].misfit.toFixed(1)} (N = ${r.nData}) at ${s.lat.toFixed(2)}, ${s.lon.toFixed(2)}; load average ${loadavg()[0].toFixed(1)}`,
  );
}
