/**
 * Number and time formatting shared by tables, charts and pages: `formatMeasured` is the one number
 * formatter (a value with or without its uncertainty); `formatValue` is its plain-value form.
 * Times are shown in UTC.
 */
/** "2026-03-14 06:20 UTC" */
export function formatUtc(value: Date | string | number | null | undefined, withSeconds = false): string {
  if (value == null) return '—';
  const d = value instanceof Date ? value : new Date(value);
  if (Number.isNaN(d.getTime())) return '—';
  const iso = d.toISOString();
  return `${iso.slice(0, 10)} ${iso.slice(11, withSeconds ? 19 : 16)} UTC`;
}

/** 1st, 2nd, 3rd, 4th, 11th, 12th, 13th, 21st, 102nd, … (English ordinal of a whole number). */
export function ordinal(n: number): string {
  const tens = Math.abs(n) % 100;
  const last = Math.abs(n) % 10;
  const suffix = tens >= 11 && tens <= 13 ? 'th' : last === 1 ? 'st' : last === 2 ? 'nd' : last === 3 ? 'rd' : 'th';
  return `${n}${suffix}`;
}

/** "2026-03-14" (UTC date). */
export function formatUtcDate(value: Date | string | number | null | undefined): string {
  return formatUtc(value).slice(0, 10);
}

/** SI prefixes from giga to pico (BIPM, The International System of Units, 9th ed., Table 7). */
const PREFIXES: [number, string][] = [
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
  [1, ''],
  [1e-3, 'm'],
  [1e-6, 'µ'],
  [1e-9, 'n'],
  [1e-12, 'p'],
];
/** Units written as one symbol, which take an SI prefix; any other unit gets a power of ten instead. */
const PREFIXABLE = new Set(['Hz', 's', 'm', 'V', 'T', 'C', 'A', 'W', 'Ω', 'g', 'V/m']);
const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};
const MINUS = '−';

/**
 * |x| × 10^decimals rounded to a whole number, half away from zero on the shortest decimal form of x
 * (as ECMA-402 Intl.NumberFormat does; `toFixed` rounds the binary value, so 1.005 -> "1.00").
 */
function scaledDigits(x: number, decimals: number): bigint {
  const [mantissa, e] = Math.abs(x).toExponential().split('e'); // shortest round-trip digits: "1.2345", "-3"
  const digits = mantissa.replace('.', '');
  const keep = Number(e) + 1 + decimals; // digits of `digits` left of the rounding point
  if (keep >= digits.length) return BigInt(digits) * 10n ** BigInt(keep - digits.length);
  const up = keep >= 0 && digits.charCodeAt(keep) >= 53; // next digit >= '5'
  return BigInt(keep > 0 ? digits.slice(0, keep) : '0') + (up ? 1n : 0n);
}

/** x rounded to `decimals` places (negative: to tens, hundreds, …), with a true minus sign and no "−0". */
function fixed(x: number, decimals: number): string {
  const n = scaledDigits(x, decimals);
  let text = n.toString();
  if (decimals > 0) {
    text = text.padStart(decimals + 1, '0');
    text = `${text.slice(0, -decimals)}.${text.slice(-decimals)}`;
  } else if (n !== 0n) text += '0'.repeat(-decimals);
  return x < 0 && n !== 0n ? MINUS + text : text;
}

/** Decimal places that show x to `significant` figures once rounded (9.996 to three figures is "10.0"). */
function decimalsFor(x: number, significant: number): number {
  const p = Math.floor(Math.log10(Math.abs(x)));
  const d = significant - 1 - p;
  return scaledDigits(x, d) >= 10n ** BigInt(significant) ? d - 1 : d;
}

/**
 * How a value without an error is rounded: a count of significant figures, or `{ decimals }` — a fixed
 * count of decimal places in the unit as given (no SI prefix), so a table column in one unit lines up.
 */
export type Rounding = number | { decimals: number };

/**
 * The one formatter for a measured value with its uncertainty: the error to two significant digits
 * and the value rounded to the same decimal place (common practice; also ISO/IEC Guide 98-3 (GUM)
 * §7.2.6 and Taylor, An Introduction to Error Analysis, §2.2), with an SI prefix on a one-symbol unit
 * ("1.234 ± 0.067 ms") or a power of ten before a compound unit ("(4.0 ± 1.2) × 10⁻² (mV/m)²/Hz") —
 * never a prefix stacked on a compound unit. Without a usable error the value is rounded as `rounding`
 * says (default three significant figures); a whole number rounded to `{ decimals: 0 }` (a count) is
 * written in full. Missing values are "—".
 */
export function formatMeasured(
  value: number | null | undefined,
  error?: number | null,
  unit = '',
  rounding: Rounding = 3,
): string {
  if (value == null || !Number.isFinite(value)) return '—';
  const hasError = error != null && Number.isFinite(error) && error > 0;
  const fixedPlaces = !hasError && typeof rounding !== 'number' ? rounding.decimals : null;
  const size = Math.abs(value) || (hasError ? error : 0);
  let scale = 1;
  let prefix = '';
  let power = 0;
  if (size > 0 && PREFIXABLE.has(unit) && fixedPlaces === null) {
    [scale, prefix] = PREFIXES.find(([p]) => size >= p * 0.9995) ?? PREFIXES[PREFIXES.length - 1];
  } else if (size > 0 && (size >= 1e5 || size < 1e-3) && !(fixedPlaces === 0 && Number.isInteger(value))) {
    power = Math.floor(Math.log10(size));
    scale = 10 ** power;
  }
  const v = value / scale;
  const unitText = unit ? ` ${prefix}${unit}` : '';
  const times = power ? ` × 10${String(power).replace(/./g, (c) => SUPERSCRIPT[c])}` : '';
  if (!hasError) {
    const digits = typeof rounding === 'number' ? rounding : 1;
    const d = fixedPlaces ?? (v === 0 ? digits - 1 : Math.max(0, decimalsFor(v, digits)));
    return `${fixed(v, d)}${times}${unitText}`;
  }
  const e = error / scale;
  const d = decimalsFor(e, 2); // the error's second significant digit is the last one shown
  const pair = `${fixed(v, d)} ± ${fixed(e, d)}`;
  return power ? `(${pair})${times}${unitText}` : `${pair}${unitText}`;
}

/** A value without an uncertainty, by the one formatter: "25.0 kHz", "0.0400 (mV/m)²/Hz", "1.2 × 10⁻⁶". */
export function formatValue(value: number | null | undefined, unit = '', rounding: Rounding = 3): string {
  return formatMeasured(value, null, unit, rounding);
}

export type BoundState = 'at-lower' | 'at-upper' | 'near-lower' | 'near-upper' | 'free';

/**
 * Where an estimate sits in its allowed range: at a bound (within 1e-6 of the range's size: the
 * inverter holds an estimate there, and a symmetric error means nothing), within one standard error
 * of a bound (the error bar would cross it), or free.
 */
export function boundState(
  value: number,
  error: number | null | undefined,
  bounds: { min: number; max: number } | undefined,
): BoundState {
  if (!bounds || !Number.isFinite(value)) return 'free';
  const tol = 1e-6 * Math.max(Math.abs(bounds.min), Math.abs(bounds.max), bounds.max - bounds.min);
  if (value - bounds.min <= tol) return 'at-lower';
  if (bounds.max - value <= tol) return 'at-upper';
  if (error != null && Number.isFinite(error)) {
    if (value - error < bounds.min) return 'near-lower';
    if (value + error > bounds.max) return 'near-upper';
  }
  return 'free';
}

/** A parameter estimate as a table shows it: "at lower bound 100 C² km²/s" instead of "100 ± 288". */
export function formatEstimate(
  value: number | null | undefined,
  error: number | null | undefined,
  bounds: { min: number; max: number } | undefined,
  unit = '',
): { text: string; flag: BoundState } {
  if (value == null || !Number.isFinite(value)) return { text: '—', flag: 'free' };
  const flag = boundState(value, error, bounds);
  if (flag === 'at-lower' || flag === 'at-upper') {
    return { text: `${formatValue(value, unit)} (at ${flag === 'at-lower' ? 'lower' : 'upper'} bound)`, flag };
  }
  return { text: formatMeasured(value, error, unit), flag };
}
