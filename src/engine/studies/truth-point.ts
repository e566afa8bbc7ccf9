/**
 * Where a study linearises (siting) or what it must recover (recovery): the
 * study's sources as the inverter's internal vector (ln intensity, centre in
 * degrees with the longitude unwrapped into its range, spread). Each unknown
 * needs the source of the same name, inside its ranges and agreeing with its
 * fixed quantities; a source no unknown stands for, or one outside its
 * region, is refused naming `sources[i]` and the quantity.
 */
import { InversionInputError } from '@/src/engine/inverse/errors';
import type { Parameterisation } from '@/src/engine/inverse/parameters';
import type { ParamKind } from '@/src/engine/inverse/types';
import { STUDY_PLACE_TOL_DEG } from '@/src/engine/tolerances';
import type { StudySource } from './types';

function value(s: StudySource, kind: ParamKind): number {
  if (kind === 'intensity') return s.intensity;
  if (kind === 'spread') return s.spreadDeg ?? 0;
  return s[kind];
}

/** The source's value of one quantity in internal units; a longitude is moved by whole turns towards [lo, hi]. */
function internal(kind: ParamKind, v: number, lo: number, hi: number): number {
  if (kind === 'intensity') return Math.log(v);
  if (kind !== 'lon') return v;
  let x = v;
  while (x < lo - STUDY_PLACE_TOL_DEG) x += 360;
  while (x > hi + STUDY_PLACE_TOL_DEG && x - 360 >= lo - STUDY_PLACE_TOL_DEG) x -= 360;
  return x;
}

export function truthPoint(par: Parameterisation, sources: readonly StudySource[]): Float64Array {
  const index = new Map<string, number>();
  sources.forEach((s, i) => {
    if (index.has(s.name)) throw new InversionInputError(`sources[${i}].name: "${s.name}" is used twice`);
    if (!par.regions.some((r) => r.name === s.name))
      throw new InversionInputError(`sources[${i}].name: no unknown is named "${s.name}"; every source stands for one unknown`);
    if (!(s.intensity > 0)) throw new InversionInputError(`sources[${i}].intensity must be above 0, got ${s.intensity}`);
    index.set(s.name, i);
  });
  const p = new Float64Array(par.slots.length);
  for (const r of par.regions) {
    const i = index.get(r.name);
    if (i === undefined) throw new InversionInputError(`sources: no source named "${r.name}" for the unknown of that name`);
    const s = sources[i];
    const where = `sources[${i}] (${s.name})`;
    if (!!r.footprint !== !!s.footprint?.length)
      throw new InversionInputError(`${where}: the unknown and its source must both be given by grid cells, or neither`);
    if (!r.hasSpread && (s.spreadDeg ?? 0) > 0)
      throw new InversionInputError(`${where}.spreadDeg: the unknown has no spread, so the source cannot have one`);
    for (const kind of ['intensity', 'lat', 'lon', 'spread'] as const) {
      if (kind === 'spread' && !r.hasSpread) continue;
      const j = r.index[kind];
      const lo = j >= 0 ? par.slots[j].lower : r.fixed[kind];
      const hi = j >= 0 ? par.slots[j].upper : r.fixed[kind];
      const x = internal(kind, value(s, kind), lo, hi);
      const tol = kind === 'intensity' ? 1e-9 * Math.max(1, Math.abs(lo)) : STUDY_PLACE_TOL_DEG;
      if (x < lo - tol || x > hi + tol) {
        const shown = (y: number) => (kind === 'intensity' ? Math.exp(y) : y).toPrecision(6);
        const what =
          j >= 0
            ? `lies outside the unknown's range ${shown(lo)}..${shown(hi)}`
            : `differs from the unknown's fixed ${shown(lo)}`;
        const field = kind === 'spread' ? 'spreadDeg' : kind;
        throw new InversionInputError(
          `${where}.${field}: ${value(s, kind)} ${what} (the truth must lie in the regions solved for)`,
        );
      }
      if (j >= 0) p[j] = Math.min(hi, Math.max(lo, x));
    }
  }
  return p;
}
