/**
 * Number and time formatting shared by tables, charts and pages.
 * Times are shown in UTC; numbers use a fixed count of digits so columns line up.
 */
export function formatNumber(value: number | null | undefined, digits = 2): string {
  if (value == null || !Number.isFinite(value)) return '—';
  const abs = Math.abs(value);
  if (abs !== 0 && (abs >= 1e6 || abs < 10 ** -Math.max(digits, 3))) return value.toExponential(Math.max(1, digits));
  return value.toFixed(digits);
}

/** "2026-03-14 06:20 UTC" */
export function formatUtc(value: Date | string | number | null | undefined, withSeconds = false): string {
  if (value == null) return '—';
  const d = value instanceof Date ? value : new Date(value);
  if (Number.isNaN(d.getTime())) return '—';
  const iso = d.toISOString();
  return `${iso.slice(0, 10)} ${iso.slice(11, withSeconds ? 19 : 16)} UTC`;
}

/** "2026-03-14" (UTC date). */
export function formatUtcDate(value: Date | string | number | null | undefined): string {
  return formatUtc(value).slice(0, 10);
}
