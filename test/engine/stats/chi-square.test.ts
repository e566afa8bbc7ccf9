import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { chiSquareTail } from '@/src/engine/stats/chi-square';

// Reference values: scipy.stats.chi2.sf, written by fixtures/chi2/make_fixture.py.
const fixture = JSON.parse(readFileSync('fixtures/chi2/chi2_sf.json', 'utf8')) as {
  source: string;
  cases: { chi2: number; dof: number; sf: number }[];
};

describe('chiSquareTail', () => {
  it('matches scipy.stats.chi2.sf to 1e-10 relative over both tails, fractional and very large dof included', () => {
    expect(fixture.cases.length).toBeGreaterThan(100);
    for (const c of fixture.cases) {
      const p = chiSquareTail(c.chi2, c.dof);
      expect(Math.abs(p - c.sf) / c.sf, `chi2=${c.chi2} dof=${c.dof}`).toBeLessThan(1e-10);
    }
  });

  it('keeps tiny tail probabilities (no 1 - CDF cancellation)', () => {
    const tiny = fixture.cases.filter((c) => c.sf < 1e-12);
    expect(tiny.length).toBeGreaterThan(5);
    for (const c of tiny) expect(chiSquareTail(c.chi2, c.dof)).toBeGreaterThan(0);
  });

  it('has the closed forms of small dof: dof 2 gives exp(-chi2/2), dof 1 gives erfc(sqrt(chi2/2)) (A&S 26.4.4, 26.4.2)', () => {
    for (const x of [0.1, 1, 4, 20]) expect(Math.abs(chiSquareTail(x, 2) / Math.exp(-x / 2) - 1)).toBeLessThan(1e-12);
    // erfc(1/sqrt2) = 0.31731050786291415 (P(|Z| > 1) of a standard normal, common practice)
    expect(Math.abs(chiSquareTail(1, 1) / 0.31731050786291415 - 1)).toBeLessThan(1e-12);
  });

  it('is 1 at chi2 = 0 and NaN for a meaningless degree of freedom', () => {
    expect(chiSquareTail(0, 5)).toBe(1);
    expect(chiSquareTail(3, 0)).toBeNaN();
    expect(chiSquareTail(Number.NaN, 3)).toBeNaN();
  });
});
