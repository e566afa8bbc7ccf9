/**
 * Run-page figures tell the truth at a glance: text on correlation cells meets WCAG 2.1 contrast
 * (1.4.3, 4.5:1, measured with culori's wcagContrast, a reference library), the starts figure has
 * numbers on its value axis even when every start ends at the same misfit.
 */
import { describe, expect, it } from 'vitest';
import { parseHTML } from 'linkedom';
import { wcagContrast } from 'culori';
import { renderFigureSvg } from '@/src/web/charts/render-svg';
import { correlationFigure } from '@/src/web/runs/figures/correlation';
import { startsFigure } from '@/src/web/runs/figures/starts';
import type { InversionResult, Minimum } from '@/src/engine/inverse/types';

const parse = (markup: string) => parseHTML(`<html><body>${markup}</body></html>`).document;

function minimum(names: string[], matrix: number[][], misfit = 12.5): Minimum {
  return {
    misfit,
    reducedChi2: 1.1,
    count: 4,
    startIndexes: [0, 1, 2, 3],
    sources: [],
    params: {},
    internal: [],
    stdErrors: {},
    correlation: { names, matrix },
    resolution: { names, matrix },
    singular: false,
    rank: names.length,
    stopReasons: {},
  };
}

describe('correlation matrix', () => {
  const names = ['A.intensity', 'A.lat', 'A.lon', 'B.intensity'];
  const rs = [1, -0.93, 0.41, -0.2, 0.77, 0.05, -0.55, 0.33, -0.01, 0.6];
  let k = 0;
  const matrix = names.map((_, i) => names.map((__, j) => (i === j ? 1 : rs[(k++ + i + j) % rs.length])));
  const doc = parse(renderFigureSvg(correlationFigure(minimum(names, matrix)), 580)!);

  it('writes every value on its cell with at least 4.5:1 contrast', () => {
    const cells = Array.from(doc.querySelectorAll('[data-mark="cell"] rect'));
    const texts = Array.from(doc.querySelectorAll('[data-mark="text"] text'));
    expect(cells.length).toBe(names.length ** 2);
    expect(texts.length).toBe(names.length ** 2);
    texts.forEach((t, i) => {
      expect(wcagContrast(t.getAttribute('fill')!, cells[i].getAttribute('fill')!), t.textContent!).toBeGreaterThanOrEqual(4.5);
    });
  });
});

describe('starts figure', () => {
  for (const misfits of [
    [42.123456, 42.123456, 42.123456, 42.123456],
    [42.1, 42.3, 42.6, 43.0],
    [0.5, 3, 120, 9000],
  ]) {
    it(`has numbers on the misfit axis for starts ending at ${misfits.join(', ')}`, () => {
      const m = minimum(['A.intensity'], [[1]], misfits[0]);
      const result = {
        starts: 4,
        unconverged: 0,
        minima: [m],
        startEnds: {
          index: [0, 1, 2, 3],
          misfit: misfits,
          iterations: [5, 6, 5, 7],
          stopReason: ['misfit-change', 'misfit-change', 'step-size', 'gradient'],
          minimum: [0, 0, 0, 0],
        },
      } as unknown as InversionResult;
      const doc = parse(renderFigureSvg(startsFigure(result, 0), 580)!);
      const labels = Array.from(doc.querySelectorAll('[data-mark="y-axis tick label"] text')).map((t) => t.textContent ?? '');
      expect(labels.filter((l) => /\d/.test(l)).length).toBeGreaterThanOrEqual(2); // (a log axis leaves minor ticks blank)
    });
  }
});
