/**
 * covarianceFromJtJ against an independent dense inverse (ml-matrix LU
 * inverse) and against the definition of an unresolvable parameter pair.
 */
import { describe, expect, it } from 'vitest';
import { inverse, Matrix } from 'ml-matrix';
import { covarianceFromJtJ } from '@/src/engine/optim/covariance';

function jtjOf(rows: number[][]): Float64Array {
  const j = new Matrix(rows);
  return Float64Array.from(j.transpose().mmul(j).to1DArray());
}

describe('covarianceFromJtJ', () => {
  it('equals (J^T J)^-1 times the scale, with unit-diagonal correlation and identity resolution', () => {
    const rows = [
      [1, 0.3, 2],
      [0.5, -1, 0.1],
      [2, 2, -0.7],
      [0.1, 0.4, 1.3],
      [-1, 0.2, 0.6],
    ];
    const jtj = jtjOf(rows);
    const ref = inverse(new Matrix([...Array(3)].map((_, a) => [...Array(3)].map((_, b) => jtj[a * 3 + b]))));
    const out = covarianceFromJtJ(jtj, 3, { scale: 2.5 });
    expect(out.singular).toBe(false);
    expect(out.rank).toBe(3);
    for (let a = 0; a < 3; a++) {
      expect(out.stdErrors[a]).toBeCloseTo(Math.sqrt(2.5 * ref.get(a, a)), 12);
      expect(out.correlation[a * 3 + a]).toBe(1);
      for (let b = 0; b < 3; b++) {
        expect(out.covariance[a * 3 + b]).toBeCloseTo(2.5 * ref.get(a, b), 12);
        expect(out.correlation[a * 3 + b]).toBeCloseTo(ref.get(a, b) / Math.sqrt(ref.get(a, a) * ref.get(b, b)), 12);
        expect(out.resolution[a * 3 + b]).toBeCloseTo(a === b ? 1 : 0, 10);
      }
    }
  });

  it('flags two parameters that only enter as their sum as singular (rank deficient), resolution 1/2 each', () => {
    // Columns 0 and 1 are identical: only p0 + p1 is resolved; the resolution matrix is then
    // the projector onto (1, 1)/sqrt(2) in that block (Menke, Geophysical Data Analysis §4.4).
    const rows = [
      [1, 1, 0],
      [2, 2, 1],
      [3, 3, -1],
      [0.5, 0.5, 2],
    ];
    const out = covarianceFromJtJ(jtjOf(rows), 3);
    expect(out.singular).toBe(true);
    expect(out.rank).toBe(2);
    expect(out.resolution[0]).toBeCloseTo(0.5, 10);
    expect(out.resolution[1]).toBeCloseTo(0.5, 10);
    expect(out.resolution[8]).toBeCloseTo(1, 10);
  });

  it('treats a parameter with no influence (zero column) as unresolved with an infinite error', () => {
    const out = covarianceFromJtJ(
      jtjOf([
        [1, 0],
        [2, 0],
        [0.5, 0],
      ]),
      2,
    );
    expect(out.singular).toBe(true);
    expect(out.stdErrors[1]).toBe(Infinity);
    expect(out.stdErrors[0]).toBeCloseTo(1 / Math.sqrt(5.25), 12);
  });
});
