import { describe, expect, it } from 'vitest';
import { parseHTML } from 'linkedom';
import { color } from 'd3-color';
import { rampCanvas } from '@/src/web/charts/ramp-canvas';
import { RAMPS } from '@/src/design/tokens';

/** Fills the stand-in as Observable Plot's continuous legend does (256 x 1, one fillRect per pixel). */
function paint(interpolator: (t: number) => string) {
  const canvas = rampCanvas();
  const ctx = canvas.getContext('2d')!;
  for (let i = 0, j = 255; i < 256; i++) {
    ctx.fillStyle = interpolator(i / j);
    ctx.fillRect(i, 0, 1, 1);
  }
  const svg = decodeURIComponent(canvas.toDataURL().replace(/^data:image\/svg\+xml,/, ''));
  const { document } = parseHTML(`<html><body>${svg}</body></html>`);
  const stops = Array.from(document.querySelectorAll('stop')).map((s) => ({
    offset: Number(s.getAttribute('offset')),
    colour: s.getAttribute('stop-color')!,
  }));
  return { svg, stops };
}

const rgb = (c: string) => {
  const x = color(c)!.rgb();
  return [x.r, x.g, x.b];
};

// Reference: the ramps our legends use, evaluated directly.
describe('rampCanvas', () => {
  for (const [name, interpolator] of [
    ['signed', RAMPS.signed],
    ['depth', RAMPS.depth],
    ['activity', RAMPS.activity],
  ] as const) {
    it(`hands back the ${name} ramp as gradient stops at the interpolator's own colours, ends included`, () => {
      const { stops } = paint(interpolator);
      expect(stops[0]).toEqual({ offset: 0, colour: interpolator(0) });
      expect(stops.at(-1)).toEqual({ offset: 1, colour: interpolator(1) });
      for (const s of stops) expect(s.colour).toBe(interpolator(Math.round(s.offset * 255) / 255));
    });

    it(`stays within 2.5 of 255 per channel (whole-number colours included) of the ${name} interpolator between its stops`, () => {
      // The browser draws a linear gradient between stops (SVG 1.1 §13.2.4, interpolation in sRGB).
      const { stops } = paint(interpolator);
      let worst = 0;
      for (let i = 0; i < 256; i++) {
        const t = i / 255;
        const k = Math.max(0, stops.findIndex((s) => s.offset >= t) - 1);
        const a = stops[k];
        const b = stops[Math.min(k + 1, stops.length - 1)];
        const u = b.offset > a.offset ? (t - a.offset) / (b.offset - a.offset) : 0;
        const [ca, cb, ref] = [rgb(a.colour), rgb(b.colour), rgb(interpolator(t))];
        for (let c = 0; c < 3; c++) worst = Math.max(worst, Math.abs(ca[c] + u * (cb[c] - ca[c]) - ref[c]));
      }
      expect(worst).toBeLessThanOrEqual(2.5);
    });
  }

  it('answers no context but a 2d one', () => {
    expect(rampCanvas().getContext('webgl')).toBeNull();
  });
});
