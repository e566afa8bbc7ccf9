/**
 * The cost of honest statistics (measurements only): the speed case's data (12 stations x 3 components x 141
 * bins, 9 free parameters) with and without Welch statistics on every series, i.e. the misfit with the
 * neighbouring-bin correlation whitened (banded Cholesky on residuals and Jacobian rows) against the plain one.
 * Times (1) residuals and Jacobian at one point, repeated, and (2) a single-threaded 16-start inversion;
 * medians of three, CPU time of this process. Goal: the correlated misfit at most 15 % slower.
 */
import { loadavg } from 'node:os';
import { invertSpectra } from '@/src/engine/inverse/invert';
import { prepareSpectrum, type SpectrumInversionInput } from '@/src/engine/inverse/interval-problem';
import { hannWelchStatistics } from '@/src/engine/stats/welch-statistics';
import { synthetic } from './inverse';

const EVALUATIONS = 200;
const STARTS = 16;

function cpuSeconds(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
}

const median3 = (xs: number[]) => [...xs].sort((a, b) => a - b)[1];

export default async function bench(): Promise<void> {
  const plain = synthetic(0.25, 99);
  const welch = hannWelchStatistics(119, 0.5);
  const correlated: SpectrumInversionInput = { ...plain, observed: plain.observed.map((o) => ({ ...o, welch })) };
  const evalTime = (input: SpectrumInversionInput) => {
    const { problem } = prepareSpectrum(input);
    const p = Float64Array.from(problem.lower!, (lo, j) => 0.5 * (lo + problem.upper![j]));
    const r = new Float64Array(problem.nResiduals);
    const jac = new Float64Array(problem.nResiduals * problem.nParams);
    const t0 = cpuSeconds();
    for (let i = 0; i < EVALUATIONS; i++) {
      p[0] += 1e-9; // a new point each time, so nothing is cached
      problem.residuals(p, r);
      problem.jacobian(p, jac);
    }
    return cpuSeconds() - t0;
  };
  const runTime = async (input: SpectrumInversionInput) => {
    const t0 = cpuSeconds();
    await invertSpectra(input, { starts: STARTS, seed: 1, threads: 1 });
    return cpuSeconds() - t0;
  };
  evalTime(plain); // warm the kernel tables
  const ePlain = median3([evalTime(plain), evalTime(plain), evalTime(plain)]);
  const eCorr = median3([evalTime(correlated), evalTime(correlated), evalTime(correlated)]);
  console.log(
    `statistics, residuals + Jacobian x ${EVALUATIONS}: plain ${ePlain.toFixed(3)} s, correlated ${eCorr.toFixed(3)} s (${((eCorr / ePlain - 1) * 100).toFixed(1)} %); load average ${loadavg()[0].toFixed(1)}`,
  );
  const rPlain = median3([await runTime(plain), await runTime(plain), await runTime(plain)]);
  const rCorr = median3([await runTime(correlated), await runTime(correlated), await runTime(correlated)]);
  console.log(
    `statistics, ${STARTS}-start inversion on one thread: plain ${rPlain.toFixed(2)} s, correlated ${rCorr.toFixed(2)} s (${((rCorr / rPlain - 1) * 100).toFixed(1)} %; goal <= 15 %)`,
  );
}
