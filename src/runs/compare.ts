/**
 * Two runs (or two minima of one run) side by side, as plain rows: their
 * settings with the ones that differ marked, and each parameter of the two
 * minima with its difference and whether the two agree within their combined
 * one-sigma error, sigma_c = sqrt(sigma_a^2 + sigma_b^2) (independent
 * estimates; common practice). Pure: no database, no React.
 */
import type { Minimum } from '@/src/engine/inverse/types';
import type { RunView } from './results';
import type { Region } from './grid-spec';
import { REGION_COLOURS, regionColour } from '@/src/design/tokens';

export interface SettingRow {
  label: string;
  a: string;
  b: string;
  differs: boolean;
}

function settingsOf(v: RunView, stationCode: (id: string) => string): [string, string][] {
  const c = v.config;
  const o = c.observables;
  const m = v.model.config as { model?: string; earthRadiusKm?: number; heightKm?: number };
  const regions = c.regions.map((u) => {
    const r = v.grid.regions.find((x) => x.key === u.region);
    const where = [u.lat ? `lat ${u.lat.min}…${u.lat.max}°` : '', u.lon ? `lon ${u.lon.min}…${u.lon.max}°` : ''].filter(Boolean);
    return `${r?.name ?? u.region}: ${u.intensity.min}–${u.intensity.max}${where.length ? `, ${where.join(', ')}` : ''}`;
  });
  return [
    ['Stations', c.data.stationIds.map(stationCode).sort().join(', ')],
    ['Components', [...c.data.components].sort().join(', ')],
    ['Intervals (UT)', `${c.data.from.slice(0, 16).replace('T', ' ')} – ${c.data.to.slice(0, 16).replace('T', ' ')}`],
    ['Flagged data', c.data.includeFlagged ? 'included' : 'left out'],
    ['Observables', o.kind === 'spectrum' ? `log power ${o.minHz}–${o.maxHz} Hz, every ${o.every}` : `first ${o.modes} modes`],
    ['Cavity model', `${v.model.name} v${v.model.version} (${m.model ?? '?'}, a ${m.earthRadiusKm} km, h ${m.heightKm} km)`],
    ['Source grid', `${v.grid.name} v${v.grid.version} (${v.grid.cellSizeDeg}° cells)`],
    ['Free regions', regions.join('; ')],
    [
      'Damping',
      `λ0 ${c.damping.initialLambda}, ${c.damping.maxIterations} iterations, ${c.damping.scaleCovariance ? 'scaled' : 'stated σ'}`,
    ],
    ['Starts / seed', `${c.starts} / ${c.seed}`],
    ['Engine', v.run.engineVersion],
  ];
}

/** The settings of both runs, row by row; `differs` where the two texts are not the same. */
export function settingsDiff(a: RunView, b: RunView, stationCode: (id: string) => string = (id) => id): SettingRow[] {
  const sa = settingsOf(a, stationCode);
  const sb = settingsOf(b, stationCode);
  return sa.map(([label, va], i) => ({ label, a: va, b: sb[i][1], differs: va !== sb[i][1] }));
}

export type Agreement = 'agree' | 'within 2σ' | 'differ' | 'no error';

export interface ParameterRow {
  /** `<region>.<intensity|lat|lon>` */
  name: string;
  a: number | null;
  errorA: number | null;
  b: number | null;
  errorB: number | null;
  /** b - a */
  difference: number | null;
  /** sqrt(errorA^2 + errorB^2) */
  combinedError: number | null;
  /** |difference| / combinedError */
  z: number | null;
  agreement: Agreement | null;
}

const KINDS = ['intensity', 'lat', 'lon'] as const;

function valueOf(m: Minimum, region: string, kind: (typeof KINDS)[number]): { v: number; e: number | null } | null {
  const s = m.sources.find((x) => x.name === region);
  if (!s) return null;
  const e = m.stdErrors[region]?.[kind];
  return { v: s[kind], e: e !== undefined && Number.isFinite(e) ? e : null };
}

/** Agreement of two estimates with one-sigma errors: within 1 combined sigma, within 2, or not. */
export function agreementOf(difference: number, combinedError: number | null): { z: number | null; agreement: Agreement } {
  if (combinedError === null || !(combinedError > 0)) return { z: null, agreement: 'no error' };
  const z = Math.abs(difference) / combinedError;
  return { z, agreement: z <= 1 ? 'agree' : z <= 2 ? 'within 2σ' : 'differ' };
}

/**
 * Every parameter either minimum has (regions by name; intensity, and lat/lon where the
 * minimum reports an error for them, i.e. where they were free), in A's order then B's extras.
 */
export function parameterComparison(a: Minimum, b: Minimum): ParameterRow[] {
  const regions = [...new Set([...a.sources.map((s) => s.name), ...b.sources.map((s) => s.name)])];
  const rows: ParameterRow[] = [];
  for (const region of regions)
    for (const kind of KINDS) {
      const free = (m: Minimum) => kind === 'intensity' || m.stdErrors[region]?.[kind] !== undefined;
      if (!free(a) && !free(b)) continue;
      const va = free(a) ? valueOf(a, region, kind) : null;
      const vb = free(b) ? valueOf(b, region, kind) : null;
      const both = va && vb;
      const difference = both ? vb.v - va.v : null;
      const combinedError = both && va.e !== null && vb.e !== null ? Math.hypot(va.e, vb.e) : null;
      const g = difference !== null ? agreementOf(difference, combinedError) : null;
      rows.push({
        name: `${region}.${kind}`,
        a: va?.v ?? null,
        errorA: va?.e ?? null,
        b: vb?.v ?? null,
        errorB: vb?.e ?? null,
        difference,
        combinedError,
        z: g?.z ?? null,
        agreement: g?.agreement ?? null,
      });
    }
  return rows;
}

/**
 * One colour per region name for both picks (maps, curves, tables): A's regions keep their own
 * colours; B's regions of the same name take A's; B's other regions keep theirs unless A already
 * uses that colour, in which case they take the next design-token region colour still free.
 */
export function comparisonColours(a: readonly Region[], b: readonly Region[]): Record<string, string> {
  const out: Record<string, string> = {};
  const used = new Set<string>();
  let next = 0;
  const free = () => {
    for (let k = 0; k < REGION_COLOURS.length; k++) {
      const c = regionColour(next + k);
      if (!used.has(c)) {
        next += k + 1;
        return c;
      }
    }
    return regionColour(next++); // more regions than colours: wrap around
  };
  for (const r of [...a, ...b]) {
    if (r.name in out) continue;
    const colour = used.has(r.colour) ? free() : r.colour;
    out[r.name] = colour;
    used.add(colour);
  }
  return out;
}

/** log10 range of intensity covering the sources of every given minimum: the one colour scale of both maps. */
export function sharedLogRange(minima: readonly (Minimum | null)[]): { lo: number; hi: number } | null {
  const values = minima.flatMap((m) => (m?.sources ?? []).map((s) => Math.log10(Math.max(1, s.intensity))));
  if (!values.length) return null;
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  return hi - lo < 1e-6 ? { lo: lo - 0.5, hi: hi + 0.5 } : { lo, hi };
}
