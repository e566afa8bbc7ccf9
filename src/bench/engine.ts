/**
 * Engine measurements (no pass/fail): kernel-table build time for 5–40 Hz at
 * 0.25 Hz over the theta grid, one KernelTable.sample call, and one forward
 * evaluation for 12 stations x 3 components x 141 bins x 3 moving sources.
 * Figures are medians of repeats, wall clock and this process's CPU time.
 */
import os from 'node:os';
import { bandFrequencies } from '@/src/engine/band';
import { resolveCavity } from '@/src/engine/cavity/resolve';
import { buildKernelTable, createKernelSample } from '@/src/engine/kernels/kernel-table';
import { createForwardModel } from '@/src/engine/forward/forward-model';
import type { ForwardStation } from '@/src/engine/forward/types';
import type { ForwardSource } from '@/src/engine/sources/types';

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

/** Median wall time per call (ms); also records the median CPU time of this process, which is
 * less disturbed when other jobs share the machine. */
let lastCpuMs = 0;
function time(repeats: number, inner: number, fn: () => void): number {
  const out: number[] = [];
  const cpu: number[] = [];
  for (let r = 0; r < repeats; r++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    for (let k = 0; k < inner; k++) fn();
    out.push((performance.now() - t0) / inner);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000 / inner);
  }
  lastCpuMs = median(cpu);
  return median(out);
}

const cpuNote = (scale: number, unit: string, digits: number) => `(CPU time ${(lastCpuMs * scale).toFixed(digits)} ${unit})`;

/** Invented station layout: 12 sites spread over both hemispheres. */
const STATIONS: ForwardStation[] = Array.from({ length: 12 }, (_, i) => ({
  code: `S${String(i + 1).padStart(2, '0')}`,
  lat: -60 + ((i * 37) % 120),
  lon: -180 + i * 30 + 7,
  components: ['Ez', 'Bns', 'Bew'],
}));

export default async function engineBench(): Promise<void> {
  console.log(
    `machine: ${os.cpus().length} cores, load average ${os.loadavg()[0].toFixed(1)} (figures above ~1 per core are disturbed by other jobs)`,
  );
  const freqs = bandFrequencies({ minHz: 5, maxHz: 40, stepHz: 0.25 });
  for (const model of ['linear', 'ishaq-jones'] as const) {
    const cavity = resolveCavity({ model, earthRadiusKm: 6371, heightKm: 60 });
    let nodes = 0;
    const ms = time(5, 1, () => {
      nodes = buildKernelTable(cavity, freqs).nodes;
    });
    console.log(
      `kernel table build (${model}, ${freqs.length} bins x ${nodes} theta nodes): ${ms.toFixed(1)} ms (median of 5) ${cpuNote(1, 'ms', 1)}`,
    );
  }
  const cavity = resolveCavity({ model: 'ishaq-jones', earthRadiusKm: 6371, heightKm: 60 });
  const model = createForwardModel(cavity, freqs, STATIONS);
  const sample = createKernelSample(freqs.length);
  let th = 0.01;
  const us =
    time(7, 20000, () => {
      th = th > 3.1 ? 0.01 : th + 0.0137;
      model.table.sample(th, sample);
    }) * 1000;
  console.log(`KernelTable.sample (${freqs.length} bins): ${us.toFixed(2)} µs per call (median of 7) ${cpuNote(1000, 'µs', 2)}`);
  const usPower =
    time(7, 20000, () => {
      th = th > 3.1 ? 0.01 : th + 0.0137;
      model.table.samplePower(th, sample);
    }) * 1000;
  console.log(
    `KernelTable.samplePower (${freqs.length} bins, no derivatives): ${usPower.toFixed(2)} µs per call (median of 7) ${cpuNote(1000, 'µs', 2)}`,
  );
  const out = model.createOutput();
  for (const [label, spread] of [
    ['moving spots, spread 6°, 7 nodes each', 6],
    ['point sources', 0],
  ] as const) {
    const sources: ForwardSource[] = [
      { lat: 2, lon: -60, intensity: 3e4, spreadDeg: spread },
      { lat: 5, lon: 20, intensity: 5e4, spreadDeg: spread },
      { lat: 3, lon: 115, intensity: 2e4, spreadDeg: spread },
    ];
    let k = 0;
    const ms = time(9, 200, () => {
      sources[0].lat = 2 + (k++ % 10) * 0.1; // moving centre, as the inverter does
      model.evaluate(sources, out);
    });
    console.log(
      `forward evaluation, 12 stations x 3 components x ${freqs.length} bins x 3 ${label}: ${ms.toFixed(3)} ms (median of 9) ${cpuNote(1, 'ms', 3)}`,
    );
  }
}
