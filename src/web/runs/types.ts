/** Client-side shapes of the run API (JSON of src/runs/results.ts RunView). */
import type { RunView } from '@/src/runs/results';
import type { Minimum, InversionResult } from '@/src/engine/inverse/types';

export type { RunView, Minimum, InversionResult };
export type RunJson = RunView;

export function runApi(networkId: string, runId: string): string {
  return `/api/networks/${networkId}/runs/${runId}`;
}

/** The per-station fits of one minimum of one interval (`GET …/runs/:id/fits`). */
export function fitsUrl(base: string, interval: string, minimum: number): string {
  return `${base}/fits?interval=${encodeURIComponent(interval)}&minimum=${minimum}`;
}

/** Latitude/longitude standard errors and their correlation for one source of a minimum. */
export function centreCovariance(m: Minimum, name: string): { sLat: number; sLon: number; rho: number } | null {
  const e = m.stdErrors[name];
  if (!e || e.lat === undefined || e.lon === undefined) return null;
  const i = m.correlation.names.indexOf(`${name}.lat`);
  const j = m.correlation.names.indexOf(`${name}.lon`);
  const rho = i >= 0 && j >= 0 ? m.correlation.matrix[i][j] : 0;
  return { sLat: e.lat, sLon: e.lon, rho: Number.isFinite(rho) ? rho : 0 };
}

const formats = new Map<number, Intl.NumberFormat>(); // one formatter per precision: building one is slow

export function fmt(v: number | undefined | null, digits = 3): string {
  if (v === undefined || v === null || !Number.isFinite(v)) return '—';
  const a = Math.abs(v);
  if (a !== 0 && (a >= 1e5 || a < 1e-3)) return v.toExponential(digits - 1);
  let f = formats.get(digits);
  if (!f) formats.set(digits, (f = new Intl.NumberFormat('en-GB', { maximumSignificantDigits: digits + 1 })));
  return f.format(v);
}
