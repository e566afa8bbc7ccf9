/**
 * How a stored mode fit was made: the band it fitted, the equivalent number of
 * averages its errors assume (K_eff) and the frequency ranges it left out.
 * Fits stored before these were kept read "not recorded". No hooks: renders on
 * the server or inside a client view alike.
 */
import { formatValue } from '@/src/web/ui';

export interface FitSettingsInput {
  band?: { minHz: number; maxHz: number };
  averages?: number;
  excluded?: { minHz: number; maxHz: number }[];
}

export const NOT_RECORDED = 'not recorded';

/** A frequency with no trailing zeros beyond 0.01 Hz: 16.6, 50, 3.25. */
function hz(v: number): string {
  return String(Number(v.toFixed(2)));
}

/** The three settings as the page writes them. */
export function fitSettingsText(fit: FitSettingsInput): { band: string; averages: string; excluded: string } {
  return {
    band: fit.band ? `${hz(fit.band.minHz)}–${hz(fit.band.maxHz)} Hz` : NOT_RECORDED,
    averages: fit.averages !== undefined ? formatValue(fit.averages, '', { decimals: 1 }) : NOT_RECORDED,
    excluded: !fit.excluded
      ? NOT_RECORDED
      : fit.excluded.length === 0
        ? 'nothing left out'
        : fit.excluded.map((r) => (r.minHz === r.maxHz ? `${hz(r.minHz)} Hz` : `${hz(r.minHz)}–${hz(r.maxHz)} Hz`)).join(', '),
  };
}

export function FitSettings({ fit }: { fit: FitSettingsInput }) {
  const t = fitSettingsText(fit);
  const rows: [string, string, string][] = [
    ['Fitted band', t.band, 'bins outside it were not fitted'],
    ['Averages per bin (K_eff)', t.averages, 'the scatter the errors assume'],
    ['Left out of the fit', t.excluded, 'bridged interference lines'],
  ];
  return (
    <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm" aria-label="How this fit was made">
      {rows.map(([label, value, hint]) => (
        <div key={label} className="contents">
          <dt className="text-muted" title={hint}>
            {label}
          </dt>
          <dd className={value === NOT_RECORDED ? 'italic text-muted' : ''}>{value}</dd>
        </div>
      ))}
    </dl>
  );
}
