import { describe, expect, it } from 'vitest';
import { peakStatistics } from '@/src/engine/modes/peak-statistics';

describe('peak statistics of a mode fit', () => {
  it('propagate the full covariance to ln peak by the delta method (common practice), background included', () => {
    // one-mode-per-slot layout with 3 modes: [f, A, g] x 3, b0, b1; a covariance with background terms
    const p = [8, 2, 1, 14, 1, 1.5, 20, 0.5, 2, 0.3, 0.01];
    const np = p.length;
    const cov = new Float64Array(np * np);
    const set = (i: number, j: number, v: number) => ((cov[i * np + j] = v), (cov[j * np + i] = v));
    for (let j = 0; j < np; j++) set(j, j, 0.01 * (j + 1));
    set(4, 9, 0.003); // A_2 with b0
    set(9, 10, -0.0004); // b0 with b1
    set(3, 5, 0.002); // f_2 with g_2
    const s = peakStatistics(p, cov, 3, 1);
    const f = 14;
    const peak = 1 + 0.3 + 0.01 * f;
    expect(s.peak).toBeCloseTo(peak, 14);
    // gradient of ln peak: (b1 df + dA + db0 + f db1) / peak
    const g = new Array(np).fill(0);
    g[3] = 0.01 / peak;
    g[4] = 1 / peak;
    g[9] = 1 / peak;
    g[10] = f / peak;
    let v = 0;
    for (let i = 0; i < np; i++) for (let j = 0; j < np; j++) v += g[i] * cov[i * np + j] * g[j];
    expect(s.sdLnPeak).toBeCloseTo(Math.sqrt(v), 14);
    const cfg = 0.002 / Math.sqrt(cov[3 * np + 3] * cov[5 * np + 5]);
    expect(s.correlation[0][2]).toBeCloseTo(cfg, 14);
    expect(s.correlation[2][0]).toBeCloseTo(cfg, 14);
    let cfp = 0;
    for (let j = 0; j < np; j++) cfp += cov[3 * np + j] * g[j];
    expect(s.correlation[0][1]).toBeCloseTo(cfp / Math.sqrt(cov[3 * np + 3] * v), 14);
  });
});
