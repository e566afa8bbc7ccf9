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

/**
 * A number for people: `digits` significant figures in exponent form outside [1e-3, 1e5),
 * otherwise `digits + 1` significant figures with thousands commas, as en-GB Intl.NumberFormat
 * writes them. Done by hand: the browser's first Intl formatter on a page costs 60–130 ms of
 * locale set-up (measured in headless chromium), which the run page would pay while hydrating.
 */
export function fmt(v: number | undefined | null, digits = 3): string {
  if (v === undefined || v === null || !Number.isFinite(v)) return '—';
  const a = Math.abs(v);
  if (a !== 0 && (a >= 1e5 || a < 1e-3)) return v.toExponential(digits - 1);
  const { whole, fraction } = significant(a, digits + 1);
  return `${v < 0 ? '-' : ''}${whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',')}${fraction ? `.${fraction}` : ''}`;
}

/**
 * |x| to n significant figures as decimal digits, rounding half away from zero on the shortest
 * decimal form of x (what Intl does; `toPrecision` rounds the binary value, so 0.0012345 -> 0.001234).
 */
function significant(x: number, n: number): { whole: string; fraction: string } {
  const [mantissa, e] = x.toExponential().split('e'); // shortest round-trip digits, e.g. "1.2345", "-3"
  let digits = mantissa.replace('.', '');
  let exponent = Number(e);
  if (digits.length > n) {
    const up = digits.charCodeAt(n) >= 53; // next digit >= '5'
    digits = digits.slice(0, n);
    if (up) {
      const bumped = (BigInt(digits) + 1n).toString();
      if (bumped.length > n) exponent += 1; // 9.999 -> 10.00
      digits = bumped.slice(0, n);
    }
  }
  digits = digits.replace(/0+$/, '') || '0';
  const point = exponent + 1; // digits before the decimal point
  if (point <= 0) return { whole: '0', fraction: '0'.repeat(-point) + digits };
  if (point >= digits.length) return { whole: digits + '0'.repeat(point - digits.length), fraction: '' };
  return { whole: digits.slice(0, point), fraction: digits.slice(point) };
}
