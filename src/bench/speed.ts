/**
 * The speed case as a whole process (measurements only): `invert` on 12 stations x 3 components x 141 bins
 * with three point regions free in intensity and centre (9 parameters), 64 starts, all cores — the process as a
 * user starts it (compiled command line, src/ops/launch.mjs), median of three. Beside it an outside comparison,
 * src/bench/peer/invert_peer.py: a vectorised numpy/scipy script doing the same inversion (given Cavitas's
 * kernel tables, so it does not pay for building them), its whole process timed once. Prints both, their ratio,
 * and both best misfits, the peer's also evaluated by Cavitas's own misfit.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import path from 'node:path';
import { sumSquares } from '@/src/engine/optim/normal-equations';
import { prepareSpectrum } from '@/src/engine/inverse/interval-problem';
import { createKernelBuffers, engineKernel } from '@/src/engine/inverse/kernel-sampler';
import { projectRoot } from '@/src/ops/paths';
import { band, cavity, stations, synthetic, unknowns } from './inverse';

const STARTS = 64;
const THETA_STEPS = 1440;

function timedProcess(command: string, args: string[]): { seconds: number; stdout: string } {
  const t0 = performance.now();
  const r = spawnSync(command, args, { cwd: projectRoot, encoding: 'utf8', maxBuffer: 64 << 20 });
  const seconds = (performance.now() - t0) / 1000;
  if (r.status !== 0) throw new Error(`${command} ${args.join(' ')} failed: ${r.stderr}`);
  return { seconds, stdout: r.stdout };
}

export default async function bench(): Promise<void> {
  const input = synthetic(0.25, 99);
  const dir = mkdtempSync(path.join(tmpdir(), 'cavitas-speed-'));
  try {
    const caseFile = path.join(dir, 'case.json');
    writeFileSync(
      caseFile,
      JSON.stringify({
        cavity,
        band,
        stations: stations.map((s) => ({ ...s, components: ['Ez', 'Bns', 'Bew'] })),
        observed: input.observed.map((o) => ({ ...o, frequencies: Array.from(o.frequencies), power: Array.from(o.power) })),
        unknowns,
      }),
    );
    const freqs = Float64Array.from(input.observed[0].frequencies);
    const kernel = engineKernel(cavity, freqs);
    const buf = createKernelBuffers(freqs.length);
    const theta: number[] = [];
    const ez: number[][] = [];
    const bh: number[][] = [];
    for (let i = 0; i <= THETA_STEPS; i++) {
      theta.push((Math.PI * i) / THETA_STEPS);
      kernel.sample(Math.max(1e-6, Math.min(Math.PI - 1e-6, theta[i])), buf);
      ez.push(Array.from(buf.ez));
      bh.push(Array.from(buf.bh));
    }
    const kernelFile = path.join(dir, 'kernels.json');
    writeFileSync(kernelFile, JSON.stringify({ frequencies: Array.from(freqs), theta, ez, bh }));

    const launcher = path.join(projectRoot, 'src', 'ops', 'launch.mjs');
    const ours = [0, 1, 2].map(() =>
      timedProcess(process.execPath, [launcher, 'cli', 'invert', caseFile, '--starts', String(STARTS), '--seed', '1']),
    );
    const median = ours.map((o) => o.seconds).sort((a, b) => a - b)[1];
    const result = JSON.parse(ours[0].stdout) as {
      minima: { misfit: number; count: number }[];
      startEnds: { stopReason: string[] };
    };
    const stopped = result.startEnds.stopReason.filter((r) => r === 'clustered').length;
    console.log(
      `speed case, invert as a whole process (${STARTS} starts, all cores): ${ours.map((o) => o.seconds.toFixed(2)).join(' / ')} s, median ${median.toFixed(2)} s; best misfit ${result.minima[0].misfit.toFixed(2)}; ${stopped} starts stopped early in a found basin; load average ${loadavg()[0].toFixed(1)}`,
    );
    const peer = timedProcess('python3', [
      path.join(projectRoot, 'src', 'bench', 'peer', 'invert_peer.py'),
      caseFile,
      kernelFile,
      String(STARTS),
      '1',
    ]);
    const p = JSON.parse(peer.stdout) as { bestMisfit: number; params: number[] };
    const { problem } = prepareSpectrum(input);
    const r = new Float64Array(problem.nResiduals);
    problem.residuals(Float64Array.from(p.params), r);
    console.log(
      `peer (numpy/scipy script, outside comparison): ${peer.seconds.toFixed(2)} s whole process; best misfit ${p.bestMisfit.toFixed(2)} by its own model, ${sumSquares(r).toFixed(2)} by Cavitas's`,
    );
    console.log(`ratio peer / invert (whole process): ${(peer.seconds / median).toFixed(1)}`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
