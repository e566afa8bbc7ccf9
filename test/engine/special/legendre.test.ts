import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { legendreAt, legendreInto, prepareDegree, LEGENDRE_OUT } from '@/src/engine/special/legendre';
import { resolveCavity } from '@/src/engine/cavity/resolve';
import type { CavityConfig, CavityTable } from '@/src/engine/cavity/types';

const DEG = Math.PI / 180;
const rel = (a: { re: number; im: number }, b: number[]) => Math.hypot(a.re - b[0], a.im - b[1]) / Math.hypot(b[0], b[1]);

type Point = { model: string; f: number; thetaDeg: number; nu: number[]; p: number[]; dp: number[] };
const fixture = JSON.parse(readFileSync(new URL('../../../fixtures/legendre/legendre.json', import.meta.url), 'utf8')) as {
  earthRadiusKm: number;
  table: CavityTable;
  points: Point[];
};

describe('P_nu(-cos theta) against mpmath (legenp type 2 and its derivative; fixtures/legendre/make_fixture.py)', () => {
  it('matches P and dP/dtheta to 1e-10 relative over 0.05–179.95 deg, 1–60 Hz, all three models', () => {
    let worstP = 0;
    let worstD = 0;
    for (const pt of fixture.points) {
      const { p, dp } = legendreAt(pt.nu[0], pt.nu[1], pt.thetaDeg * DEG);
      worstP = Math.max(worstP, rel(p, pt.p));
      worstD = Math.max(worstD, rel(dp, pt.dp));
    }
    expect(fixture.points.length).toBe(510);
    expect(worstP).toBeLessThan(1e-10);
    expect(worstD).toBeLessThan(1e-10);
  });

  it('the cavity models reproduce the fixture propagation parameters (same formulas, evaluated by mpmath)', () => {
    const cfg = (model: CavityConfig['model']): CavityConfig => ({
      model,
      earthRadiusKm: fixture.earthRadiusKm,
      heightKm: 60,
      table: fixture.table,
    });
    const cavities = {
      linear: resolveCavity(cfg('linear')),
      'ishaq-jones': resolveCavity(cfg('ishaq-jones')),
      table: resolveCavity(cfg('table')),
    };
    for (const pt of fixture.points) {
      const nu = cavities[pt.model as keyof typeof cavities].nu(pt.f);
      expect(rel(nu, pt.nu)).toBeLessThan(1e-12);
    }
  });
});

/** Legendre polynomials P_n(x) and P_n'(x) by the three-term recurrence (A&S 8.5.3, 22.7.10). */
function zonalSums(
  nuRe: number,
  nuIm: number,
  theta: number,
  N: number,
): { s: { re: number; im: number }; ds: { re: number; im: number } } {
  const x = Math.cos(theta);
  const sx = Math.sin(theta);
  const lamRe = nuRe * (nuRe + 1) - nuIm * nuIm;
  const lamIm = nuIm * (2 * nuRe + 1);
  let pPrev = 0;
  let p = 1;
  let sRe = 0,
    sIm = 0,
    dRe = 0,
    dIm = 0;
  for (let n = 0; n <= N; n++) {
    // smooth taper: 1 up to N/2, cos^2 down to 0 at N (summation of an oscillating series)
    const u = n / N;
    const wgt = u <= 0.5 ? 1 : Math.cos(Math.PI * (u - 0.5)) ** 2;
    const dpn = n === 0 ? 0 : (n * (pPrev - x * p)) / (1 - x * x); // dP_n/dx
    const dth = -sx * dpn; // d/dtheta P_n(cos theta)
    // (2n+1) / (n(n+1) - lambda)
    const aRe = n * (n + 1) - lamRe;
    const aIm = -lamIm;
    const den = aRe * aRe + aIm * aIm;
    const cRe = ((2 * n + 1) * aRe) / den;
    const cIm = (-(2 * n + 1) * aIm) / den;
    sRe += wgt * cRe * p;
    sIm += wgt * cIm * p;
    dRe += wgt * cRe * dth;
    dIm += wgt * cIm * dth;
    const next = ((2 * n + 1) * x * p - n * pPrev) / (n + 1);
    pPrev = p;
    p = next;
  }
  return { s: { re: sRe, im: sIm }, ds: { re: dRe, im: dIm } };
}

describe('zonal harmonic series identity sum (2n+1) P_n(cos th)/(n(n+1) - nu(nu+1)) = -pi P_nu(-cos th)/sin(pi nu)', () => {
  // Eigenfunction expansion of the cavity Green's function (Nickolaenko & Hayakawa 2002; Morse & Feshbach 1953).
  const cases: [number, number][] = [
    [1.026, -0.165],
    [2.3, -0.3],
    [4.5, -0.45],
    [0.4, -0.05],
  ];
  for (const [nr, ni] of cases)
    for (const thDeg of [35, 75, 110, 150])
      it(`nu = ${nr}${ni}i, theta = ${thDeg} deg: P and dP/dtheta`, () => {
        const th = thDeg * DEG;
        const { s, ds } = zonalSums(nr, ni, th, 40000);
        const { p, dp } = legendreAt(nr, ni, th);
        // -pi / sin(pi nu)
        const sRe = Math.sin(Math.PI * nr) * Math.cosh(Math.PI * ni);
        const sIm = Math.cos(Math.PI * nr) * Math.sinh(Math.PI * ni);
        const d = sRe * sRe + sIm * sIm;
        const kRe = (-Math.PI * sRe) / d;
        const kIm = (Math.PI * sIm) / d;
        const rhs = { re: kRe * p.re - kIm * p.im, im: kRe * p.im + kIm * p.re };
        const rhsD = { re: kRe * dp.re - kIm * dp.im, im: kRe * dp.im + kIm * dp.re };
        expect(rel(s, [rhs.re, rhs.im])).toBeLessThan(1e-6);
        expect(rel(ds, [rhsD.re, rhsD.im])).toBeLessThan(1e-5);
      });
});

describe('special cases and the Legendre equation', () => {
  const Pn = [
    () => 1,
    (x: number) => x,
    (x: number) => (3 * x * x - 1) / 2,
    (x: number) => (5 * x ** 3 - 3 * x) / 2,
    (x: number) => (35 * x ** 4 - 30 * x * x + 3) / 8,
    (x: number) => (63 * x ** 5 - 70 * x ** 3 + 15 * x) / 8,
  ]; // A&S Table 22.9 (explicit Legendre polynomials)

  it('integer degree gives the Legendre polynomials (A&S 22.9), exactly and for a nearly integer complex degree', () => {
    for (let n = 0; n < Pn.length; n++)
      for (const thDeg of [0.5, 20, 60, 90, 100, 140, 179]) {
        const th = thDeg * DEG;
        const want = Pn[n](-Math.cos(th));
        expect(Math.abs(legendreAt(n, 0, th).p.re - want)).toBeLessThan(1e-13);
        // log branch (theta < 90 deg) at nu = n - 1e-9 i; P changes by O(1e-9 |log w|)
        const near = legendreAt(n, -1e-9, th).p;
        expect(Math.abs(near.re - want)).toBeLessThan(1e-7);
      }
  });

  it('P_nu(1) = 1 (theta = 180 deg) for complex degrees (A&S 8.1.2: 2F1(a, b; c; 0) = 1)', () => {
    for (const [nr, ni] of [
      [1.026, -0.165],
      [5.5, -0.6],
      [9.7, -0.86],
      [0.05, -0.02],
    ]) {
      expect(rel(legendreAt(nr, ni, Math.PI).p, [1, 0])).toBeLessThan(1e-15);
      expect(rel(legendreAt(nr, ni, Math.PI - 1e-6).p, [1, 0])).toBeLessThan(1e-10);
    }
  });

  it('satisfies y" + cot(theta) y\' + nu(nu+1) y = 0 (Legendre equation, A&S 8.1.1) by central differences', () => {
    const out = new Float64Array(LEGENDRE_OUT);
    for (const [nr, ni] of [
      [1.026, -0.165],
      [3.7, -0.4],
      [8.1, -0.7],
    ]) {
      const deg = prepareDegree(nr, ni);
      for (const thDeg of [2, 30, 89.9, 90.1, 130, 175]) {
        const th = thDeg * DEG;
        const hh = 1e-5;
        legendreInto(deg, th + hh, out);
        const up = [out[2], out[3]];
        legendreInto(deg, th - hh, out);
        const dn = [out[2], out[3]];
        legendreInto(deg, th, out);
        const y2 = [(up[0] - dn[0]) / (2 * hh), (up[1] - dn[1]) / (2 * hh)];
        const cot = Math.cos(th) / Math.sin(th);
        const lamRe = nr * (nr + 1) - ni * ni;
        const lamIm = ni * (2 * nr + 1);
        const rRe = y2[0] + cot * out[2] + lamRe * out[0] - lamIm * out[1];
        const rIm = y2[1] + cot * out[3] + lamRe * out[1] + lamIm * out[0];
        const scale = Math.hypot(y2[0], y2[1]) + Math.hypot(lamRe, lamIm) * Math.hypot(out[0], out[1]);
        expect(Math.hypot(rRe, rIm) / scale).toBeLessThan(1e-7);
      }
    }
  });
});
