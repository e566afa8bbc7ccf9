/**
 * Cavitas design tokens: the one place where the product's colours are set.
 *
 * Everything here was designed for Cavitas, in OKLCH (lightness, chroma, hue),
 * and written down as sRGB hex:
 * - UI: a warm "chart-paper" canvas with graphite ink, one accent ("iris", a
 *   violet) for interaction, and a warm orange ("storm") used for thunderstorm
 *   activity and nothing else; a dark theme with the same meanings.
 *   `app/globals.css` declares the same values as CSS variables (a test keeps
 *   the two equal and checks text contrast against WCAG 2.1).
 * - REGION_COLOURS: eight categorical colours for regions and series, apart
 *   from one another for normal vision and for simulated protan, deutan and
 *   tritan vision (tested), and none of them the storm orange.
 * - RAMPS: sequential ramps with lightness that changes monotonically in
 *   CIELAB ("activity", paper to deep red-brown, for storm intensity;
 *   "depth", plum to ice, for spectrograms and misfit surfaces) and a
 *   diverging ramp whose pale middle stands for zero ("signed", indigo to
 *   paper to brick red). Between the stops colours are interpolated in CIELAB.
 *
 * No imports but d3-interpolate and d3-color: shared by server, browser and `src/runs`.
 */
import { interpolateLab, piecewise } from 'd3-interpolate';
import { rgb } from 'd3-color';

/** UI colours of the light (default) and the dark theme, by role. */
export const UI = {
  light: {
    canvas: '#f9f6f0',
    surface: '#fefcf9',
    raised: '#f1ede5',
    fg: '#21242a',
    muted: '#665f57',
    line: '#e1dcd2',
    lineStrong: '#8b857c',
    grid: '#eee9de',
    accent: '#683cc5',
    accentStrong: '#5129a1',
    accentSoft: '#edeaff',
    onAccent: '#ffffff',
    storm: '#e07a00',
    stormInk: '#a14206',
    stormSoft: '#fdecd5',
    danger: '#b32322',
    dangerSoft: '#ffe9e6',
    ok: '#21763c',
    land: '#e4dfd4',
    sea: '#fcfaf6',
  },
  dark: {
    canvas: '#14161b',
    surface: '#1b1e24',
    raised: '#252930',
    fg: '#efebe2',
    muted: '#b0aaa0',
    line: '#32353d',
    lineStrong: '#6d727b',
    grid: '#23262d',
    accent: '#ad99fb',
    accentStrong: '#c5b9ff',
    accentSoft: '#342b53',
    onAccent: '#14161b',
    storm: '#f8962d',
    stormInk: '#fda856',
    stormSoft: '#492b0f',
    danger: '#f47a79',
    dangerSoft: '#512222',
    ok: '#69c27e',
    land: '#32353c',
    sea: '#181b1f',
  },
} as const;

export type UiRole = keyof typeof UI.light;

/** CSS variable of a UI role (`--c-accent`): figures use these so they follow the theme. */
export function cssVar(role: UiRole): string {
  return `var(--c-${role.replace(/[A-Z]/g, (c) => '-' + c.toLowerCase())})`;
}

/**
 * Region and series colours, in the order new regions take them: cobalt, rose,
 * moss, straw, plum, sky, aubergine ink, heather.
 */
export const REGION_COLOURS = ['#425fe1', '#eb476b', '#356708', '#eddd7b', '#732171', '#6dc4ff', '#382832', '#c987a7'] as const;

/** The i-th categorical colour (wrapping around). */
export function regionColour(i: number): string {
  const n = REGION_COLOURS.length;
  return REGION_COLOURS[((i % n) + n) % n];
}

/** Colours with a fixed meaning in figures (CSS variables where the colour follows the theme). */
export const FIGURE = {
  /** Measured values: the ink itself. */
  observed: 'currentColor',
  /** A model's prediction. */
  predicted: REGION_COLOURS[1],
  /** A start that reached a minimum. */
  reached: cssVar('accent'),
  /** A start that stopped without converging (drawn as a triangle too). */
  stoppedShort: REGION_COLOURS[1],
  /** Thunderstorm activity (maps, daily curves' storm marks). */
  storm: cssVar('storm'),
  /** A station without data for the shown interval. */
  noData: cssVar('muted'),
} as const;

/** Ramp stops, first = low end (for `signed`: first = -1, middle = 0, last = +1). */
export const RAMP_STOPS = {
  activity: ['#fbf5df', '#f4d895', '#f2af48', '#ea7719', '#c74726', '#932b2a', '#581b1f'],
  depth: ['#2c0b2a', '#432262', '#49499b', '#467cc0', '#5aacd5', '#9ed5e3', '#ebf8ec'],
  signed: ['#253a86', '#466fbd', '#93b4dd', '#f7f3eb', '#e09d9c', '#b9454c', '#791824'],
} as const;

export type RampName = keyof typeof RAMP_STOPS;

/** Colour at t in [0, 1] (clamped) along a ramp, interpolated in CIELAB between the stops. */
export type Ramp = (t: number) => string;

function makeRamp(stops: readonly string[]): Ramp {
  const f = piecewise(interpolateLab, stops as string[]);
  return (t) => f(Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0)));
}

export const RAMPS: Record<RampName, Ramp> = {
  activity: makeRamp(RAMP_STOPS.activity),
  depth: makeRamp(RAMP_STOPS.depth),
  signed: makeRamp(RAMP_STOPS.signed),
};

/** Relative luminance of an sRGB colour (WCAG 2.1, "relative luminance"). */
function luminance(colour: string): number {
  const c = rgb(colour);
  const lin = (v: number) => {
    const x = v / 255;
    return x <= 0.04045 ? x / 12.92 : ((x + 0.055) / 1.055) ** 2.4;
  };
  return 0.2126 * lin(c.r) + 0.7152 * lin(c.g) + 0.0722 * lin(c.b);
}

/**
 * Text colour for a label drawn on `background` (a ramp cell): black or white, whichever contrasts
 * more. (Only the pure pair reaches 4.5:1 on every background: at the crossover, luminance 0.18,
 * both give about 4.58; graphite ink would drop to about 4.2.)
 */
export function inkOn(background: string): string {
  const bg = luminance(background);
  const contrast = (fg: number) => (Math.max(fg, bg) + 0.05) / (Math.min(fg, bg) + 0.05);
  return contrast(0) >= contrast(1) ? '#000000' : '#ffffff';
}
