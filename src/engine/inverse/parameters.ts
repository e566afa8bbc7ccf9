/**
 * Parameterisation of the unknowns. Per region: intensity (optimised as its
 * natural logarithm, so it stays > 0), centre latitude and longitude in
 * degrees, optional spread in degrees. Any of them may be fixed (a number)
 * or free (a {min, max} range). Names follow the region: R1.intensity,
 * R1.lat, R1.lon, R1.spread. A longitude range may cross the antimeridian
 * (e.g. min 150, max -150, or max above 180): it is unwrapped so that
 * min < max internally; outputs are wrapped to (-180, 180].
 */
import { wrapLon } from '@/src/engine/geometry/great-circle';
import { SPOT_STRIDE } from '@/src/engine/sources/spot';
import { InversionInputError } from './errors';
import type { ParamKind, Range, RegionUnknown } from './types';

export interface ParamSlot {
  name: string;
  region: number;
  kind: ParamKind;
  /** Internal bounds (log intensity for 'intensity'). */
  lower: number;
  upper: number;
}

export interface RegionLayout {
  name: string;
  /** Index into the free vector for each quantity, or -1 when fixed. */
  index: Record<ParamKind, number>;
  /** Internal value used when fixed (log intensity for 'intensity'). */
  fixed: Record<ParamKind, number>;
  hasSpread: boolean;
  /** A fixed footprint as spot-style nodes (SPOT_STRIDE doubles each, centre derivatives of a rigid point), or null. */
  footprint: Float64Array | null;
}

export interface Parameterisation {
  slots: ParamSlot[];
  regions: RegionLayout[];
  names: string[];
  lower: Float64Array;
  upper: Float64Array;
}

const KINDS: ParamKind[] = ['intensity', 'lat', 'lon', 'spread'];

function range(v: Range | number | undefined, where: string): { min: number; max: number } | number | undefined {
  if (v === undefined || typeof v === 'number') {
    if (typeof v === 'number' && !Number.isFinite(v)) throw new InversionInputError(`${where} must be a finite number`);
    return v;
  }
  if (!Number.isFinite(v.min) || !Number.isFinite(v.max))
    throw new InversionInputError(`${where}: min and max must be finite numbers`);
  return v;
}

/** Checks a footprint (fixed place, no spread, positive weights adding up to 1) and packs its nodes. */
function footprintNodes(u: RegionUnknown, where: string): Float64Array {
  const f = u.footprint!;
  if (f.length === 0) throw new InversionInputError(`${where}.footprint has no nodes`);
  if (typeof u.lat !== 'number' || typeof u.lon !== 'number')
    throw new InversionInputError(`${where}: a region with a fixed footprint cannot move (lat and lon must be numbers)`);
  if (u.spread !== undefined) throw new InversionInputError(`${where}: a region with a fixed footprint has no spread`);
  let total = 0;
  const out = new Float64Array(f.length * SPOT_STRIDE);
  f.forEach((q, k) => {
    if (!(q.weight > 0) || !(Math.abs(q.lat) <= 90) || !Number.isFinite(q.lon))
      throw new InversionInputError(`${where}.footprint[${k}] needs lat within -90..90, a finite lon and a weight above 0`);
    total += q.weight;
    out.set([q.lat, q.lon, q.weight, 1, 0, 0, 1], k * SPOT_STRIDE);
  });
  if (Math.abs(total - 1) > 1e-9) throw new InversionInputError(`${where}.footprint weights add up to ${total}, not 1`);
  return out;
}

export function buildParameterisation(unknowns: RegionUnknown[]): Parameterisation {
  if (unknowns.length === 0) throw new InversionInputError('unknowns: at least one region is needed');
  const seen = new Set<string>();
  const slots: ParamSlot[] = [];
  const regions: RegionLayout[] = unknowns.map((u, ri) => {
    const where = `unknowns[${ri}] (${u.name})`;
    if (!u.name) throw new InversionInputError(`unknowns[${ri}].name is empty`);
    if (seen.has(u.name)) throw new InversionInputError(`unknowns: region name "${u.name}" is used twice`);
    seen.add(u.name);
    const layout: RegionLayout = {
      name: u.name,
      index: { intensity: -1, lat: -1, lon: -1, spread: -1 },
      fixed: { intensity: 0, lat: 0, lon: 0, spread: 0 },
      hasSpread: u.spread !== undefined,
      footprint: u.footprint ? footprintNodes(u, where) : null,
    };
    for (const kind of KINDS) {
      const v = range(u[kind], `${where}.${kind}`);
      if (v === undefined) {
        if (kind !== 'spread') throw new InversionInputError(`${where}.${kind} is missing`);
        continue;
      }
      const lo = typeof v === 'number' ? v : v.min;
      let hi = typeof v === 'number' ? v : v.max;
      if (kind === 'intensity' && lo <= 0) throw new InversionInputError(`${where}.intensity must be above 0 (got ${lo})`);
      if (kind === 'lat' && (lo < -90 || hi > 90)) throw new InversionInputError(`${where}.lat must lie within -90..90`);
      if (kind === 'spread' && lo < 0) throw new InversionInputError(`${where}.spread must not be negative`);
      if (kind === 'lon') {
        if (lo < -360 || hi > 360) throw new InversionInputError(`${where}.lon must lie within -360..360`);
        if (typeof v !== 'number' && hi < lo) hi += 360; // range crossing the antimeridian
        if (hi - lo > 360) throw new InversionInputError(`${where}.lon range spans more than 360 degrees`);
      } else if (hi < lo) {
        throw new InversionInputError(`${where}.${kind}: min ${lo} is greater than max ${hi}`);
      }
      const internal = (x: number) => (kind === 'intensity' ? Math.log(x) : x);
      if (typeof v === 'number' || lo === hi) {
        layout.fixed[kind] = internal(lo);
      } else {
        layout.index[kind] = slots.length;
        slots.push({ name: `${u.name}.${kind}`, region: ri, kind, lower: internal(lo), upper: internal(hi) });
      }
    }
    return layout;
  });
  return {
    slots,
    regions,
    names: slots.map((s) => s.name),
    lower: Float64Array.from(slots, (s) => s.lower),
    upper: Float64Array.from(slots, (s) => s.upper),
  };
}

/** Value of one quantity of one region (internal units) from the free vector. */
export function regionValue(layout: RegionLayout, kind: ParamKind, x: ArrayLike<number>): number {
  const i = layout.index[kind];
  return i >= 0 ? x[i] : layout.fixed[kind];
}

/** The physical sources described by a free vector: intensity exp'd, longitude wrapped. */
export function sourcesOf(par: Parameterisation, x: ArrayLike<number>) {
  return par.regions.map((r) => {
    const s: { name: string; lat: number; lon: number; intensity: number; spread?: number } = {
      name: r.name,
      lat: regionValue(r, 'lat', x),
      lon: wrapLon(regionValue(r, 'lon', x)),
      intensity: Math.exp(regionValue(r, 'intensity', x)),
    };
    if (r.hasSpread) s.spread = regionValue(r, 'spread', x);
    return s;
  });
}

/** Physical value of each free parameter (intensity exp'd, longitude wrapped), by name. */
export function physicalParams(par: Parameterisation, x: ArrayLike<number>): Record<string, number> {
  const out: Record<string, number> = {};
  par.slots.forEach((s, i) => {
    out[s.name] = s.kind === 'intensity' ? Math.exp(x[i]) : s.kind === 'lon' ? wrapLon(x[i]) : x[i];
  });
  return out;
}
