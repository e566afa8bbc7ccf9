/**
 * With fixed centres the predicted power is linear in the intensities. In the
 * linear-power misfit r = (P_pred / P_obs - 1) / sigma the problem is then an
 * ordinary weighted linear least-squares problem A I = b with
 * A_ir = K_r proj_r / (sigma P_obs) and b = 1 / sigma; the LM result (intensity
 * searched as ln I) must equal ml-matrix's least-squares solution
 * (`solve`, QR for overdetermined systems), and, when one intensity is pushed to
 * its lower bound, the active-set solution of the bounded problem
 * (Lawson & Hanson 1974, Solving Least Squares Problems, ch. 23: NNLS).
 */
import { describe, expect, it } from 'vitest';
import { Matrix, solve } from 'ml-matrix';
import type { Component } from '@/src/engine/components';
import { greatCircle } from '@/src/engine/geometry/great-circle';
import { buildDataLayout } from '@/src/engine/inverse/data-layout';
import { engineKernel } from '@/src/engine/inverse/kernel-sampler';
import { createKernelBuffers } from '@/src/engine/inverse/kernel-sampler';
import { buildParameterisation } from '@/src/engine/inverse/parameters';
import { spectrumProblem } from '@/src/engine/inverse/spectrum-objective';
import { mulberry32 } from '@/src/engine/random';
import type { ObservedSeries } from '@/src/engine/inverse/types';
import { levenbergMarquardt } from '@/src/engine/optim/levenberg-marquardt';

const cavity = { model: 'linear' as const, earthRadiusKm: 6371, heightKm: 60 };
const freqs = Float64Array.from({ length: 25 }, (_, i) => 6 + i);
const kernel = engineKernel(cavity, freqs);
const stations = [
  { code: 'LA1', lat: 35, lon: -20 },
  { code: 'LA2', lat: -30, lon: 40 },
  { code: 'LA3', lat: 10, lon: 120 },
];
const centres = [
  { name: 'R1', lat: 0, lon: -60 },
  { name: 'R2', lat: 5, lon: 20 },
  { name: 'R3', lat: -3, lon: 110 },
];
const comps: Component[] = ['Ez', 'Bns', 'Bew'];
const sigma = 0.2;

/** Per station/component: kernel x projection of each region (the columns of A before weighting). */
function columns() {
  const buf = createKernelBuffers(freqs.length);
  return stations.flatMap((st) =>
    comps.map((c) =>
      centres.map((r) => {
        const g = greatCircle(st.lat, st.lon, r.lat, r.lon);
        kernel.sample(g.theta, buf);
        const proj = c === 'Ez' ? 1 : c === 'Bns' ? Math.sin(g.bearing) ** 2 : Math.cos(g.bearing) ** 2;
        return Array.from(c === 'Ez' ? buf.ez : buf.bh, (k) => k * proj);
      }),
    ),
  );
}

function observe(intensities: number[], seed: number): ObservedSeries[] {
  const rnd = mulberry32(seed);
  const gauss = () => Math.sqrt(-2 * Math.log(1 - rnd())) * Math.cos(2 * Math.PI * rnd());
  const cols = columns();
  return stations.flatMap((st, si) =>
    comps.map((c, ci) => ({
      station: st.code,
      component: c,
      frequencies: freqs,
      power: Array.from(
        freqs,
        (_, k) => cols[si * 3 + ci].reduce((s, col, r) => s + intensities[r] * col[k], 0) * Math.exp(sigma * gauss()),
      ),
      sigmaLog: sigma,
    })),
  );
}

/** Weighted design matrix and right-hand side of the linear problem. */
function design(observed: ObservedSeries[]) {
  const cols = columns();
  const rows: number[][] = [];
  const rhs: number[] = [];
  observed.forEach((o, s) => {
    for (let k = 0; k < freqs.length; k++) {
      rows.push(cols[s].map((col) => col[k] / (sigma * o.power[k])));
      rhs.push(1 / sigma);
    }
  });
  return { A: new Matrix(rows), b: Matrix.columnVector(rhs) };
}

function invert(observed: ObservedSeries[], min: number) {
  const par = buildParameterisation(centres.map((c) => ({ name: c.name, lat: c.lat, lon: c.lon, intensity: { min, max: 1e7 } })));
  const prob = spectrumProblem(buildDataLayout(stations, observed), kernel, par, 'linear');
  const res = levenbergMarquardt(prob, Float64Array.from([Math.log(1e4), Math.log(1e4), Math.log(1e4)]));
  return { res, intensities: Array.from(res.params, Math.exp) };
}

describe('fixed centres: intensities against linear least squares', () => {
  it('equals the unconstrained least-squares solution when it is positive', () => {
    const observed = observe([3e4, 5e4, 2e4], 11);
    const { A, b } = design(observed);
    const ls = solve(A, b).to1DArray();
    expect(ls.every((v) => v > 0)).toBe(true);
    const { res, intensities } = invert(observed, 1);
    expect(res.converged).toBe(true);
    intensities.forEach((v, r) => expect(Math.abs(v - ls[r]) / ls[r]).toBeLessThan(1e-7));
  });

  it('holds a region at its lower bound and matches the active-set solution of the rest', () => {
    // R3 is absent from the data; a lower bound well above what the data allow makes it active.
    const observed = observe([3e4, 5e4, 0], 12);
    const min = 2000;
    const { A, b } = design(observed);
    // Active set {R3 = min}: solve for R1, R2 with R3's column moved to the right-hand side.
    const a12 = A.subMatrix(0, A.rows - 1, 0, 1);
    const rhs = b.clone().sub(A.getColumnVector(2).mul(min));
    const ls = solve(a12, rhs).to1DArray();
    // KKT: the gradient of the misfit with respect to I3 at the solution is positive (it wants to go lower).
    const resid = a12.mmul(Matrix.columnVector(ls)).add(A.getColumnVector(2).mul(min)).sub(b);
    expect(A.getColumnVector(2).transpose().mmul(resid).get(0, 0)).toBeGreaterThan(0);
    const { res, intensities } = invert(observed, min);
    expect(res.converged).toBe(true);
    expect(intensities[2]).toBeCloseTo(min, 6);
    intensities.slice(0, 2).forEach((v, r) => expect(Math.abs(v - ls[r]) / ls[r]).toBeLessThan(1e-7));
  });

  it('refineStart sets the intensities of a start to the same least-squares solution, and to the bound when active', () => {
    for (const [truthI, seed, min] of [
      [[3e4, 5e4, 2e4], 11, 1],
      [[3e4, 5e4, 0], 12, 2000],
    ] as const) {
      const observed = observe([...truthI], seed);
      const { A, b } = design(observed);
      const par = buildParameterisation(
        centres.map((c) => ({ name: c.name, lat: c.lat, lon: c.lon, intensity: { min, max: 1e7 } })),
      );
      const prob = spectrumProblem(buildDataLayout(stations, observed), kernel, par, 'log');
      const start = Float64Array.from([Math.log(5), Math.log(5e6), Math.log(77)]);
      prob.refineStart(start);
      const got = Array.from(start, Math.exp);
      if (truthI[2] > 0) {
        solve(A, b)
          .to1DArray()
          .forEach((v, r) => expect(Math.abs(got[r] - v) / v).toBeLessThan(1e-9));
      } else {
        const ls = solve(A.subMatrix(0, A.rows - 1, 0, 1), b.clone().sub(A.getColumnVector(2).mul(min))).to1DArray();
        expect(got[2]).toBeCloseTo(min, 6);
        ls.forEach((v, r) => expect(Math.abs(got[r] - v) / v).toBeLessThan(1e-9));
      }
    }
  });
});
