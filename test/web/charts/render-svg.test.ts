import { describe, expect, it } from 'vitest';
import { parseHTML } from 'linkedom';
import * as Plot from '@observablehq/plot';
import { renderFigureSvg } from '@/src/web/charts/render-svg';
import { plotOptions, type FigureSpec } from '@/src/web/charts/figure-spec';

const points = Array.from({ length: 49 }, (_, i) => ({ f: 6 + i * 0.5, p: 1e-3 * (1 + Math.sin(i / 5) ** 2) }));
const spec: FigureSpec = {
  title: 'Power at TST, Ez',
  xLabel: 'Frequency (Hz)',
  yLabel: 'Power spectral density ((mV/m)²/Hz)',
  height: 260,
  build: (P) =>
    ({
      y: { type: 'log' },
      color: { type: 'linear', scheme: 'viridis', legend: true, label: 'bin' },
      marks: [
        P.dot(points, { x: 'f', y: 'p', r: 2, fill: (_d: unknown, i: number) => i, title: (d: { f: number }) => `${d.f} Hz` }),
        P.line(points, { x: 'f', y: 'p' }),
      ],
    }) as Plot.PlotOptions,
};

const parse = (markup: string) => parseHTML(`<html><body>${markup}</body></html>`).document;
const circles = (doc: ReturnType<typeof parse>) =>
  Array.from(doc.querySelectorAll('circle')).map((c) => [Number(c.getAttribute('cx')), Number(c.getAttribute('cy'))]);

// Reference: Observable Plot's own drawing of the same options into a DOM (its `document` option),
// at full precision and with hover texts.
describe('renderFigureSvg', () => {
  const markup = renderFigureSvg(spec, 640)!;
  // (Without the legend, which needs a canvas; the marks do not depend on it.)
  const built = spec.build(Plot);
  const reference = Plot.plot({
    ...plotOptions({ ...built, color: { ...built.color, legend: false } }, { ...spec, width: 640 }),
    document: parse('') as unknown as Document,
  }) as unknown as Element;
  const ours = parse(markup);
  const theirs = parse(reference.outerHTML);

  it('draws the figure with its accessible name and labelled axes', () => {
    expect(ours.querySelector('svg[aria-label="Power at TST, Ez"]')).not.toBeNull();
    expect(markup).toContain('Frequency (Hz)');
    expect(markup).toContain('Power spectral density ((mV/m)²/Hz)');
  });

  it('places every mark where Plot does, to 0.05 px, with numbers written to 0.1 px', () => {
    const a = circles(ours);
    const b = circles(theirs);
    expect(a.length).toBe(points.length);
    expect(b.length).toBe(points.length);
    a.forEach(([x, y], i) => {
      expect(Math.abs(x - b[i][0])).toBeLessThanOrEqual(0.05 + 1e-9);
      expect(Math.abs(y - b[i][1])).toBeLessThanOrEqual(0.05 + 1e-9);
    });
    const attributeNumbers = [...markup.matchAll(/([\w:-]+)="([^"]*)"/g)]
      .filter((m) => !m[1].endsWith('href'))
      .flatMap((m) => m[2].match(/\d+\.\d+/g) ?? []);
    expect(attributeNumbers.length).toBeGreaterThan(0);
    for (const n of attributeNumbers) expect(n.split('.')[1].length).toBe(1);
  });

  it('leaves out the hover texts the live drawing brings', () => {
    expect(theirs.querySelectorAll('title').length).toBe(points.length);
    expect(ours.querySelectorAll('title').length).toBe(0);
  });

  it('draws a continuous legend without a canvas, its ramp an SVG image', () => {
    const href = ours.querySelector('image')?.getAttribute('xlink:href') ?? ours.querySelector('image')?.getAttribute('href');
    expect(href).toMatch(/^data:image\/svg\+xml,/);
    expect(decodeURIComponent(href!)).toContain('<linearGradient');
  });

  it('answers null when Plot refuses the options, for the browser to draw and explain', () => {
    const bad: FigureSpec = {
      ...spec,
      build: (P) => ({ marks: [P.cell([{ a: 'x' }], { x: 'a' })], x: { type: 'utc' } }) as Plot.PlotOptions,
    };
    expect(() => Plot.plot({ ...bad.build(Plot), document: parse('') as unknown as Document })).toThrow();
    expect(renderFigureSvg(bad, 300)).toBeNull();
  });
});
