/**
 * The cost of honest statistics (measurements only): the speed case's data (12 stations x 3 components x 141
 * bins, 9 free parameters) with and without Welch statistics on every series, i.e. the misfit with the
 * neighbouring-bin correlation whitened (banded Cholesky on residuals and Jacobian columns) against the plain one.
 * Times (1) one optimiser iteration's work at a point — residuals, the Jacobian by columns and the normal
 * equations, as Levenberg–Marquardt does them — repeated, and (2) a single-threaded 16-start inversion; the
 * fastest of seven rounds each (the least disturbed by other load), plain and correlated taking turns, CPU time of
 * this process. Goal: the correlated misfit at most 15 % slower.
 */
import { loadavg } from 'node:os';
import { invertSpectra } from '@/src/engine/inverse/invert';
import { prepareSpectrum, type SpectrumInversionInput } from '@/src/engine/inverse/interval-problem';
import { normalEquationsFromColumns } from '@/src/engine/optim/normal-equations';
import { hannWelchStatistics } from '@/src/engine/stats/welch-statistics';
import { synthetic } from './inverse';

const EVALUATIONS = 200;
const STARTS = 16;
const ROUNDS = 7;

function cpuSeconds(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
}

/** The fastest of ROUNDS rounds of each, the two taking turns so that both meet the same load. */
async function fastestInTurns(a: () => Promise<number> | number, b: () => Promise<number> | number): Promise<[number, number]> {
  let bestA = Infinity;
  let bestB = Infinity;
  for (let i = 0; i < ROUNDS; i++) {
    bestA = Math.min(bestA, await a());
    bestB = Math.min(bestB, await b());
  }
  return [bestA, bestB];
}

const percent = (slow: number, fast: number) => `${((slow / fast - 1) * 100).toFixed(1)} %`;

export default async function bench(): Promise<void> {
  const plain = synthetic(0.25, 99);
  const welch = hannWelchStatistics(119, 0.5);
  const correlated: SpectrumInversionInput = { ...plain, observed: plain.observed.map((o) => ({ ...o, welch })) };
  const iterationTime = (input: SpectrumInversionInput) => {
    const { problem } = prepareSpectrum(input);
    const n = problem.nParams;
    const m = problem.nResiduals;
    const p = Float64Array.from(problem.lower!, (lo, j) => 0.5 * (lo + problem.upper![j]));
    const r = new Float64Array(m);
    const jac = new Float64Array(m * n);
    const jtj = new Float64Array(n * n);
    const g = new Float64Array(n);
    const t0 = cpuSeconds();
    for (let i = 0; i < EVALUATIONS; i++) {
      p[0] += 1e-9; // a new point each time, so nothing is cached
      problem.residuals(p, r);
      problem.jacobianColumns(p, jac);
      normalEquationsFromColumns(jac, r, m, n, jtj, g);
    }
    return cpuSeconds() - t0;
  };
  const runTime = async (input: SpectrumInversionInput) => {
    const t0 = cpuSeconds();
    await invertSpectra(input, { starts: STARTS, seed: 1, threads: 1 });
    return cpuSeconds() - t0;
  };
  iterationTime(plain); // warm the kernel tables and the compiled code
  iterationTime(correlated);
  const [ePlain, eCorr] = await fastestInTurns(
    () => iterationTime(plain),
    () => iterationTime(correlated),
  );
  console.log(
    `statistics, one iteration's residuals + Jacobian + normal equations x ${EVALUATIONS}: plain ${ePlain.toFixed(3)} s, correlated ${eCorr.toFixed(3)} s (${percent(eCorr, ePlain)}); load average ${loadavg()[0].toFixed(1)}`,
  );
  const [rPlain, rCorr] = await fastestInTurns(
    () => runTime(plain),
    () => runTime(correlated),
  );
  console.log(
    `statistics, ${STARTS}-start inversion on one thread: plain ${rPlain.toFixed(2)} s, correlated ${rCorr.toFixed(2)} s (${percent(rCorr, rPlain)}; goal <= 15 %); load average ${loadavg()[0].toFixed(1)}`,
  );
}
