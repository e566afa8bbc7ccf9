/**
 * A stand-in for the one canvas Observable Plot draws on while building a
 * continuous colour legend: Plot fills a 256 x 1 canvas pixel by pixel with
 * the scale's interpolator and embeds `canvas.toDataURL()` as an image. The
 * server has no canvas, so this records the colours and hands back the same
 * ramp as a small SVG image (a linear gradient through every 8th pixel's
 * colour; a smooth scheme does not change between such stops by more than the
 * eye can see at legend size).
 */
const STOP_EVERY = 8;

interface RampContext {
  fillStyle: string;
  fillRect(x: number, y: number, w: number, h: number): void;
}

export interface RampCanvas {
  width: number;
  height: number;
  getContext(kind: string): RampContext | null;
  toDataURL(): string;
}

export function rampCanvas(): RampCanvas {
  const colours: string[] = [];
  const context: RampContext = {
    fillStyle: '#000',
    fillRect(x) {
      colours[Math.round(x)] = String(this.fillStyle);
    },
  };
  return {
    width: 256,
    height: 1,
    getContext: (kind) => (kind === '2d' ? context : null),
    toDataURL() {
      const n = colours.length;
      const at = Array.from({ length: Math.ceil(n / STOP_EVERY) }, (_, k) => k * STOP_EVERY);
      if (n > 1 && at.at(-1) !== n - 1) at.push(n - 1); // the ramp's last colour too
      const stops = at
        .filter((i) => colours[i] !== undefined)
        .map((i) => `<stop offset="${n > 1 ? (i / (n - 1)).toFixed(4) : 0}" stop-color="${colours[i]}"/>`);
      const svg =
        `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${Math.max(1, n)} 1" preserveAspectRatio="none">` +
        `<linearGradient id="r">${stops.join('')}</linearGradient><rect width="${Math.max(1, n)}" height="1" fill="url(#r)"/></svg>`;
      return `data:image/svg+xml,${encodeURIComponent(svg)}`;
    },
  };
}
