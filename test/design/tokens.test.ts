/**
 * The design tokens keep the properties they promise, measured with culori (a
 * reference colour library, not our code): CIELAB and OKLab lightness of the
 * ramps, CIEDE2000 differences of the categorical colours under simulated
 * colour-vision deficiencies (culori's filters implement Machado, Oliveira &
 * Fernandes 2009, severity 1 = dichromacy), and WCAG 2.1 contrast ratios of
 * the UI's text colours (success criteria 1.4.3, 4.5:1, and 1.4.11, 3:1).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  converter,
  differenceCiede2000,
  filterDeficiencyDeuter,
  filterDeficiencyProt,
  filterDeficiencyTrit,
  wcagContrast,
  type Color,
} from 'culori';
import { RAMPS, RAMP_STOPS, REGION_COLOURS, UI, cssVar, inkOn, regionColour, type UiRole } from '@/src/design/tokens';

const lab = converter('lab65');
const oklab = converter('oklab');
const ciede2000 = differenceCiede2000();
type Simulate = (c: string) => Color | string;
const deltaE = (a: Color | string, b: Color | string) => ciede2000(a as Color, b as Color);
const asIs: Simulate = (c) => c;
const protan = filterDeficiencyProt(1) as unknown as Simulate;
const deutan = filterDeficiencyDeuter(1) as unknown as Simulate;
const tritan = filterDeficiencyTrit(1) as unknown as Simulate;
const samples = (n: number) => Array.from({ length: n }, (_, i) => i / (n - 1));

function lightness(ramp: (t: number) => string, space: 'lab' | 'oklab', n = 257): number[] {
  return samples(n).map((t) => (space === 'lab' ? lab(ramp(t))!.l : oklab(ramp(t))!.l));
}

function strictlyMonotonic(values: number[], direction: 1 | -1): boolean {
  return values.every((v, i) => i === 0 || direction * (v - values[i - 1]) > 0);
}

describe('sequential ramps', () => {
  for (const [name, direction] of [
    ['activity', -1],
    ['depth', 1],
  ] as const) {
    for (const space of ['lab', 'oklab'] as const) {
      it(`${name}: ${space} lightness changes monotonically over 257 samples`, () => {
        const L = lightness(RAMPS[name], space);
        expect(strictlyMonotonic(L, direction)).toBe(true);
      });
    }
    it(`${name}: spans most of the lightness range (CIELAB L* span > 70)`, () => {
      const L = lightness(RAMPS[name], 'lab');
      expect(Math.abs(L.at(-1)! - L[0])).toBeGreaterThan(70);
    });
    it(`${name}: no stretch is much flatter than the rest (each tenth moves L* by 40-250 % of the mean step)`, () => {
      const L = lightness(RAMPS[name], 'lab', 11);
      const steps = L.slice(1).map((v, i) => Math.abs(v - L[i]));
      const mean = steps.reduce((a, b) => a + b) / steps.length;
      for (const s of steps) {
        expect(s).toBeGreaterThan(0.4 * mean);
        expect(s).toBeLessThan(2.5 * mean);
      }
    });
  }

  it('clamps t outside [0, 1] and takes the end stops there', () => {
    expect(lab(RAMPS.depth(-3))!.l).toBeCloseTo(lab(RAMP_STOPS.depth[0])!.l, 6);
    expect(lab(RAMPS.depth(7))!.l).toBeCloseTo(lab(RAMP_STOPS.depth.at(-1)!)!.l, 6);
  });
});

describe('diverging ramp', () => {
  for (const space of ['lab', 'oklab'] as const) {
    it(`signed: ${space} lightness rises to the middle (zero) and falls after it`, () => {
      const L = lightness(RAMPS.signed, space);
      const mid = (L.length - 1) / 2;
      expect(strictlyMonotonic(L.slice(0, mid + 1), 1)).toBe(true);
      expect(strictlyMonotonic(L.slice(mid), -1)).toBe(true);
    });
  }
  it('signed: the two ends are equally dark (|ΔL*| < 3) and the middle is nearly grey (C* < 6)', () => {
    const [lo, hi] = [lab(RAMPS.signed(0))!, lab(RAMPS.signed(1))!];
    expect(Math.abs(lo.l - hi.l)).toBeLessThan(3);
    const mid = lab(RAMPS.signed(0.5))!;
    expect(Math.hypot(mid.a, mid.b)).toBeLessThan(6);
  });
  it('signed: the two sides differ in hue for every simulated vision (ΔE2000 of ends > 20)', () => {
    for (const f of [asIs, protan, deutan, tritan]) {
      expect(deltaE(f(RAMPS.signed(0.1)), f(RAMPS.signed(0.9)))).toBeGreaterThan(20);
    }
  });
});

describe('categorical colours', () => {
  const visions = {
    normal: asIs,
    protan,
    deutan,
    tritan,
  };
  for (const [vision, simulate] of Object.entries(visions)) {
    it(`every pair stays apart for ${vision} vision (CIEDE2000 > 15)`, () => {
      const seen = REGION_COLOURS.map((c) => simulate(c));
      let least = Infinity;
      for (let i = 0; i < seen.length; i++)
        for (let j = i + 1; j < seen.length; j++) least = Math.min(least, deltaE(seen[i], seen[j]));
      expect(least).toBeGreaterThan(15);
    });
  }
  it('none is mistaken for the storm colour (CIEDE2000 > 15 in both themes)', () => {
    for (const c of REGION_COLOURS) {
      expect(deltaE(c, UI.light.storm)).toBeGreaterThan(15);
      expect(deltaE(c, UI.dark.storm)).toBeGreaterThan(15);
    }
  });
  it('regionColour wraps around in both directions', () => {
    expect(regionColour(0)).toBe(REGION_COLOURS[0]);
    expect(regionColour(REGION_COLOURS.length + 2)).toBe(REGION_COLOURS[2]);
    expect(regionColour(-1)).toBe(REGION_COLOURS.at(-1));
  });
});

describe('UI colours', () => {
  const text: UiRole[] = ['fg', 'muted', 'accent', 'danger', 'stormInk', 'ok'];
  const grounds: UiRole[] = ['canvas', 'surface', 'raised'];
  for (const theme of ['light', 'dark'] as const) {
    const t = UI[theme];
    it(`${theme}: text colours on every background reach 4.5:1 (WCAG 2.1, 1.4.3)`, () => {
      for (const fg of text)
        for (const bg of grounds) expect(wcagContrast(t[fg], t[bg]), `${fg} on ${bg}`).toBeGreaterThanOrEqual(4.5);
      expect(wcagContrast(t.onAccent, t.accent)).toBeGreaterThanOrEqual(4.5);
      expect(wcagContrast(t.accent, t.accentSoft)).toBeGreaterThanOrEqual(4.5);
      expect(wcagContrast(t.danger, t.dangerSoft)).toBeGreaterThanOrEqual(4.5);
      expect(wcagContrast(t.fg, t.stormSoft)).toBeGreaterThanOrEqual(4.5);
    });
    it(`${theme}: control borders reach 3:1 (WCAG 2.1, 1.4.11)`, () => {
      for (const bg of grounds) expect(wcagContrast(t.lineStrong, t[bg])).toBeGreaterThanOrEqual(3);
    });
  }

  it('the stylesheet declares the same values for each role in both themes', () => {
    const css = readFileSync(new URL('../../app/globals.css', import.meta.url), 'utf8');
    const block = (selector: string) => {
      const at = css.indexOf(selector + ' {');
      expect(at, selector).toBeGreaterThanOrEqual(0);
      return css.slice(at, css.indexOf('}', at));
    };
    for (const [theme, selector] of [
      ['light', ':root'],
      ['dark', ":root[data-theme='dark']"],
      ['dark', ":root:not([data-theme='light'])"],
    ] as const) {
      const body = block(selector);
      for (const [role, value] of Object.entries(UI[theme])) {
        const name = cssVar(role as UiRole).slice(4, -1);
        expect(body, `${theme} ${name}`).toMatch(new RegExp(`${name}:\\s*${value};`, 'i'));
      }
    }
  });
});

describe('text on ramp cells', () => {
  for (const name of ['signed', 'depth', 'activity'] as const) {
    it(`${name}: the chosen ink reaches 4.5:1 on every one of 101 cell colours (WCAG 2.1, 1.4.3)`, () => {
      for (const t of samples(101)) {
        const bg = RAMPS[name](t);
        expect(wcagContrast(inkOn(bg), bg), `t = ${t}`).toBeGreaterThanOrEqual(4.5);
      }
    });
  }
});
