/** Client-side shapes of the run API (JSON of src/runs/results.ts RunView). */
import type { IntervalView, RunView } from '@/src/runs/results';
import type { Minimum, InversionResult } from '@/src/engine/inverse/types';

export type { IntervalView, RunView, Minimum, InversionResult };
export type RunJson = RunView;

export function runApi(networkId: string, runId: string): string {
  return `/api/networks/${networkId}/runs/${runId}`;
}

/** One interval of a run whole (`GET …/runs/:id?interval=`); the run itself comes as a summary. */
export function intervalUrl(base: string, interval: string): string {
  return `${base}?interval=${encodeURIComponent(interval)}`;
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
