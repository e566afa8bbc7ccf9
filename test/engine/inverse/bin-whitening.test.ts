import { Matrix, inverse } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { bandedWhitener, gridPositions, whitenColumns, whitenResiduals } from '@/src/engine/inverse/bin-whitening';
import { mulberry32 } from '@/src/engine/random';
import { hannWelchBinCorrelation } from '@/src/engine/stats/welch-bin-correlation';

describe('banded whitening of correlated bins', () => {
  // kept bins of a 0.1 Hz grid with one bin (1.3 Hz) and three bins (2.0-2.2 Hz) left out
  const listed = Array.from({ length: 30 }, (_, k) => 0.5 + 0.1 * k);
  const kept = listed.filter((f) => Math.abs(f - 1.3) > 1e-9 && !(f > 1.95 && f < 2.25));
  const pos = gridPositions(listed, kept);
  const lag = hannWelchBinCorrelation(40, 0.5);
  const n = kept.length;
  const dense = Matrix.zeros(n, n);
  for (let a = 0; a < n; a++)
    for (let b = 0; b < n; b++) {
      const d = Math.abs(pos[a] - pos[b]);
      dense.set(a, b, d === 0 ? 1 : d === 1 ? lag[0] : d === 2 ? lag[1] : 0);
    }
  const cinv = inverse(dense); // ml-matrix, an outside implementation

  it('gives r^T C^-1 r and J^T C^-1 J as a dense inverse does (ml-matrix)', () => {
    const rnd = mulberry32(7);
    const r = Float64Array.from({ length: n }, () => rnd() - 0.5);
    const cols = 3;
    const jac = Float64Array.from({ length: n * cols }, () => rnd() - 0.5);
    const w = bandedWhitener(pos, lag);
    const z = Float64Array.from(r);
    whitenResiduals(w, z, 0);
    // the Jacobian as the objective holds it: column-major, the series at an offset inside each column
    const offset = 2;
    const stride = n + 5;
    const zj = new Float64Array(cols * stride).fill(7);
    for (let a = 0; a < cols; a++) for (let k = 0; k < n; k++) zj[a * stride + offset + k] = jac[k * cols + a];
    whitenColumns(w, zj, offset, stride, cols);
    for (let a = 0; a < cols; a++) {
      expect(zj[a * stride + offset - 1]).toBe(7); // rows outside the series untouched
      expect(zj[a * stride + offset + n]).toBe(7);
    }
    const rm = Matrix.columnVector(Array.from(r));
    const chi2 = rm.transpose().mmul(cinv).mmul(rm).get(0, 0);
    expect(z.reduce((s, v) => s + v * v, 0)).toBeCloseTo(chi2, 10);
    const jm = new Matrix(Array.from({ length: n }, (_, k) => Array.from(jac.subarray(k * cols, (k + 1) * cols))));
    const ref = jm.transpose().mmul(cinv).mmul(jm);
    for (let a = 0; a < cols; a++)
      for (let b = 0; b < cols; b++) {
        let v = 0;
        for (let k = 0; k < n; k++) v += zj[a * stride + offset + k] * zj[b * stride + offset + k];
        expect(v).toBeCloseTo(ref.get(a, b), 10);
      }
  });

  it('breaks the chain where bins are missing: positions skip them', () => {
    expect(Array.from(pos.slice(6, 10))).toEqual([6, 7, 9, 10]);
    const w = bandedWhitener(pos, lag);
    // after a gap of three bins the next bin is uncorrelated with the ones before it
    const after = kept.findIndex((f) => f > 2.25);
    expect(w.sub1[after]).toBe(0);
    expect(w.sub2[after]).toBe(0);
    expect(w.diag[after]).toBe(1);
  });

  it('works at an offset inside a longer vector and refuses a matrix that is not positive definite', () => {
    const w = bandedWhitener([0, 1, 2], lag);
    const r = Float64Array.from([9, 1, 2, 3, 9]);
    whitenResiduals(w, r, 1);
    expect(r[0]).toBe(9);
    expect(r[4]).toBe(9);
    expect(() => bandedWhitener([0, 1, 2, 3], [0.9, 0.9])).toThrow(/not positive definite/);
  });
});
