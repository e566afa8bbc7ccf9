/**
 * User propagation table, linearly interpolated in frequency. Rows are
 * [f, c/V, attenuation dB/Mm] (then nu from the Nickolaenko relation) or [f, Re nu, Im nu].
 */
import { nuFromSpeedAttenuation } from './propagation';
import type { CavityTable, Nu } from './types';

export type TableProblem = { path: (string | number)[]; message: string };

/** Every problem of a table, each naming its row (0-based) and column. */
export function tableProblems(table: CavityTable): TableProblem[] {
  const out: TableProblem[] = [];
  const rows = table.rows;
  if (rows.length < 2) out.push({ path: ['rows'], message: `a propagation table needs at least 2 rows, got ${rows.length}` });
  for (let i = 0; i < rows.length; i++) {
    const [f, b, c] = rows[i];
    const at = (col: number) => ['rows', i, col];
    if (![f, b, c].every(Number.isFinite)) {
      out.push({ path: ['rows', i], message: `row ${i}: all three values must be finite numbers` });
      continue;
    }
    if (f <= 0) out.push({ path: at(0), message: `row ${i}: frequency must be above 0 Hz, got ${f}` });
    if (i > 0 && !(f > rows[i - 1][0]))
      out.push({
        path: at(0),
        message: `row ${i}: frequencies must be strictly increasing (${f} Hz after ${rows[i - 1][0]} Hz)`,
      });
    if (table.columns === 'speed-attenuation') {
      if (!(b > 0)) out.push({ path: at(1), message: `row ${i}: c/V must be above 0, got ${b}` });
      if (!(c >= 0)) out.push({ path: at(2), message: `row ${i}: attenuation must be 0 dB/Mm or more, got ${c}` });
    } else if (!(c < 0)) {
      out.push({ path: at(2), message: `row ${i}: Im nu must be below 0 (time dependence exp(+iwt)), got ${c}` });
    }
  }
  return out;
}

/** Builds nu(f) for a validated table; throws a RangeError outside the table's frequencies. */
export function tableNu(table: CavityTable, radiusM: number): (fHz: number) => Nu {
  const rows = table.rows;
  const fMin = rows[0][0];
  const fMax = rows[rows.length - 1][0];
  return (fHz: number): Nu => {
    if (!(fHz >= fMin * (1 - 1e-12) && fHz <= fMax * (1 + 1e-12)))
      throw new RangeError(`frequency ${fHz} Hz is outside the propagation table (${fMin}–${fMax} Hz)`);
    let lo = 0;
    let hi = rows.length - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (rows[mid][0] <= fHz) lo = mid;
      else hi = mid;
    }
    const t = Math.min(1, Math.max(0, (fHz - rows[lo][0]) / (rows[hi][0] - rows[lo][0])));
    const b = rows[lo][1] + t * (rows[hi][1] - rows[lo][1]);
    const c = rows[lo][2] + t * (rows[hi][2] - rows[lo][2]);
    return table.columns === 'nu' ? { re: b, im: c } : nuFromSpeedAttenuation(fHz, radiusM, b, c);
  };
}
