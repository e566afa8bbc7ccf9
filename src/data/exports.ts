/**
 * Interval and fit exports: CSV (one row per interval, mode columns side by
 * side) and JSON (the summaries as they are). Power units are SI:
 * (V/m)^2/Hz for Ez, T^2/Hz for Bns and Bew. Each fit comes with its band,
 * the equivalent number of averages its errors assume and the frequency
 * ranges it left out (empty for fits stored before these were recorded).
 */
import type { IntervalSummary } from '@/db/repo/intervals';

function cell(v: unknown): string {
  if (v === null || v === undefined) return '';
  const s = v instanceof Date ? v.toISOString() : String(v);
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

const BASE = [
  'station',
  'component',
  'starts_at_utc',
  'duration_s',
  'origin',
  'rejected_share',
  'quality_flags',
  'flag_reason',
  'fit_misfit',
  'background_b0',
  'background_b1',
  'fit_min_hz',
  'fit_max_hz',
  'fit_averages',
  'fit_excluded_hz',
];
const MODE = ['frequency_hz', 'frequency_err_hz', 'half_width_hz', 'half_width_err_hz', 'q', 'amplitude', 'amplitude_err'];

/**
 * The fit_excluded_hz cell: ranges as `min-max` (Hz) joined by `;`, e.g. `16.4-17;49.5-50.5`; `none` when
 * the fit left nothing out; empty when it did not record it (or there is no fit).
 */
export function excludedCell(excluded: { minHz: number; maxHz: number }[] | undefined): string {
  if (!excluded) return '';
  return excluded.length ? excluded.map((r) => `${r.minHz}-${r.maxHz}`).join(';') : 'none';
}

/** CSV text; the header names as many mode column groups as the most modes fitted. */
export function intervalsToCsv(rows: IntervalSummary[]): string {
  const nModes = rows.reduce((m, r) => Math.max(m, r.fit?.modes.length ?? 0), 0);
  const header = [...BASE];
  for (let n = 1; n <= nModes; n++) header.push(...MODE.map((c) => `mode${n}_${c}`));
  const lines = [header.join(',')];
  for (const r of rows) {
    const out: unknown[] = [
      r.stationCode,
      r.component,
      r.startsAt,
      r.durationS,
      r.origin,
      r.rejectedShare,
      r.qualityFlags.join(' '),
      r.flagReason,
      r.fit?.misfit,
      r.fit?.background.b0,
      r.fit?.background.b1,
      r.fit?.band?.minHz,
      r.fit?.band?.maxHz,
      r.fit?.averages,
      excludedCell(r.fit?.excluded),
    ];
    for (let n = 0; n < nModes; n++) {
      const m = r.fit?.modes[n];
      out.push(m?.frequency, m?.errors.frequency, m?.halfWidth, m?.errors.halfWidth, m?.q, m?.amplitude, m?.errors.amplitude);
    }
    lines.push(out.map(cell).join(','));
  }
  return lines.join('\n') + '\n';
}

export function intervalsToJson(networkId: string, rows: IntervalSummary[]) {
  return {
    network: networkId,
    generatedAt: new Date().toISOString(),
    units: { Ez: '(V/m)^2/Hz', Bns: 'T^2/Hz', Bew: 'T^2/Hz', frequency: 'Hz', time: 'UTC' },
    intervals: rows.map((r) => ({
      station: r.stationCode,
      component: r.component,
      startsAt: r.startsAt.toISOString(),
      durationS: r.durationS,
      origin: r.origin,
      rejectedShare: r.rejectedShare,
      qualityFlags: r.qualityFlags,
      flagReason: r.flagReason,
      fit: r.fit,
    })),
  };
}
