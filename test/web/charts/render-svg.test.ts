import { describe, expect, it } from 'vitest';
import { parseHTML } from 'linkedom';
import * as Plot from '@observablehq/plot';
import { renderFigureSvg } from '@/src/web/charts/render-svg';
import { plotOptions, type FigureSpec } from '@/src/web/charts/figure-spec';
import { RAMPS, REGION_COLOURS } from '@/src/design/tokens';

const points = Array.from({ length: 49 }, (_, i) => ({ f: 6 + i * 0.5, p: 1e-3 * (1 + Math.sin(i / 5) ** 2) }));
const spec: FigureSpec = {
  title: 'Power at TST, Ez',
  xLabel: 'Frequency (Hz)',
  yLabel: 'Power spectral density ((mV/m)²/Hz)',
  height: 260,
  build: (P) =>
    ({
      y: { type: 'log' },
      color: { type: 'linear', interpolate: RAMPS.depth, legend: true, label: 'bin' },
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

// Our chart style (common practice for printed journal figures: inward ticks, numbers and units on every axis).
describe('chart style', () => {
  const markup = renderFigureSvg(spec, 640)!;
  const doc = parse(markup);
  const tickPaths = (axis: 'x' | 'y') =>
    Array.from(doc.querySelectorAll(`[data-mark="${axis}-axis tick"] path`)).map((p) => p.getAttribute('d'));

  it('draws ticks inward: up from the x axis, right from the y axis', () => {
    expect(tickPaths('x').length).toBeGreaterThan(2);
    for (const d of tickPaths('x')) expect(d).toBe('M0,0L0,-4');
    expect(tickPaths('y').length).toBeGreaterThan(1);
    for (const d of tickPaths('y')) expect(d).toBe('M0,0L4,0');
  });

  it('puts numbers on both axes and both axis lines in, and labels without arrows', () => {
    for (const axis of ['x', 'y']) {
      const labels = Array.from(doc.querySelectorAll(`[data-mark="${axis}-axis tick label"] text`)).map((t) => t.textContent);
      expect(labels.length, axis).toBeGreaterThan(1);
      for (const l of labels) expect(l).toMatch(/\d/);
    }
    expect(doc.querySelectorAll('[data-mark="frame"]').length).toBe(2); // Plot draws each axis line as an anchored frame
    expect(markup).not.toMatch(/[↑↓→←]/);
  });

  it('carries no inline CSS (no <style> element, no style attribute) and our class', () => {
    expect(doc.querySelectorAll('style').length).toBe(0);
    expect(markup).not.toMatch(/\sstyle="/);
    expect(doc.querySelector('svg.cv-plot')).not.toBeNull();
  });

  it('gives categories the region colours of the design tokens unless the figure sets its own', () => {
    const cats: FigureSpec = {
      ...spec,
      build: (P) =>
        ({
          color: { legend: true },
          marks: [
            P.dot(['a', 'b', 'c'], { x: (_d: string, i: number) => i, y: (_d: string, i: number) => i, fill: (d: string) => d }),
          ],
        }) as Plot.PlotOptions,
    };
    const fills = Array.from(parse(renderFigureSvg(cats, 400)!).querySelectorAll('.cv-plot-swatch svg')).map((s) =>
      s.getAttribute('fill'),
    );
    expect(fills).toEqual(REGION_COLOURS.slice(0, 3));
  });
});
