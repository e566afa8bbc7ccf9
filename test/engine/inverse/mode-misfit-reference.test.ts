/**
 * The mode-parameter misfit gives the same numbers as before it was made
 * cheaper: residuals, Jacobian and misfit at a few parameter points of two
 * cases equal the values the earlier implementation wrote
 * (fixtures/modes/misfit-reference.json, made by generate-misfit-reference.ts
 * beside it) to 1e-9 relative (each value against max(|reference|, 1): a
 * residual is in units of its sigma, so 1e-9 of a sigma at most), the round-off
 * of a fit polished to full precision.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { evaluateCase, referenceCases } from '@/fixtures/modes/generate-misfit-reference';

interface Stored {
  name: string;
  nParams: number;
  values: { p: number[]; misfit: number; residuals: number[]; jacobian: number[] }[];
}
const stored = (
  JSON.parse(readFileSync(new URL('../../../fixtures/modes/misfit-reference.json', import.meta.url), 'utf8')) as {
    cases: Stored[];
  }
).cases;

function worst(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let w = 0;
  for (let i = 0; i < b.length; i++) w = Math.max(w, Math.abs(a[i] - b[i]) / Math.max(Math.abs(b[i]), 1));
  return w;
}

describe('mode misfit equals the earlier implementation', () => {
  for (const c of referenceCases()) {
    it(`${c.name}: residuals, Jacobian and misfit at ${c.points.length} points`, () => {
      const ref = stored.find((s) => s.name === c.name)!;
      expect(ref.values.map((v) => v.p)).toEqual(c.points);
      const now = evaluateCase(c.input, c.points);
      now.forEach((v, k) => {
        const r = ref.values[k];
        expect(v.residuals.length).toBe(r.residuals.length);
        expect(v.jacobian.length).toBe(r.jacobian.length);
        expect(worst(v.residuals, r.residuals)).toBeLessThan(1e-9);
        expect(worst(v.jacobian, r.jacobian)).toBeLessThan(1e-9);
        expect(Math.abs(v.misfit - r.misfit) / r.misfit).toBeLessThan(1e-9);
      });
    });
  }
});
