/**
 * The case file shared by the `forward` and `invert` commands: cavity, band,
 * stations, sources, observed spectra and unknowns. Extra fields are allowed
 * everywhere; the ones below mean exactly this. Every problem is reported with
 * the path of the field at fault.
 */
import { z } from 'zod';
import { bandProblem, bandSize } from '../band';
import { cavityConfigSchema } from '../cavity/schema';
import { COMPONENTS } from '../components';
import { cellRegion } from '../sources/cell-region';
import { welchStatisticsProblem } from '../stats/welch-statistics';

const latitude = z.number().min(-90).max(90);
const longitude = z.number().min(-360).max(360);
const component = z.enum(COMPONENTS);

export const bandSchema = z
  .looseObject({ minHz: z.number().positive(), maxHz: z.number().positive(), stepHz: z.number().positive() })
  .superRefine((b, ctx) => {
    const p = bandProblem(b);
    if (p) ctx.addIssue({ code: 'custom', path: p.includes('maxHz') ? ['maxHz'] : [], message: p });
  });

export const stationSchema = z.looseObject({
  code: z.string().min(1).max(40),
  lat: latitude,
  lon: longitude,
  components: z
    .array(component)
    .min(1)
    .refine((c) => new Set(c).size === c.length, 'components must not repeat'),
});

/**
 * A region of cells of the global grid (cell ids row by row from the south-west
 * corner, as makeGlobalGrid numbers them), standing in for lat/lon: one point
 * node per cell centre, weighted by area (cellRegion).
 */
export const cellsSchema = z
  .looseObject({ cellSizeDeg: z.number().positive().max(90), ids: z.array(z.number().int().min(0)).min(1) })
  .superRefine((c, ctx) => {
    try {
      cellRegion(c.cellSizeDeg, c.ids);
    } catch (e) {
      ctx.addIssue({
        code: 'custom',
        path: (e as Error).message.startsWith('grid cell size') ? ['cellSizeDeg'] : ['ids'],
        message: (e as Error).message,
      });
    }
  });

type Placed = { lat?: number; lon?: number; cells?: z.infer<typeof cellsSchema> };
/** Either cells, or both lat and lon. */
function placement(what: string) {
  return (s: Placed, ctx: z.RefinementCtx) => {
    if (s.cells) {
      if (s.lat !== undefined || s.lon !== undefined)
        ctx.addIssue({ code: 'custom', path: ['cells'], message: `a ${what} is placed by cells or by lat/lon, not both` });
      return;
    }
    if (s.lat === undefined) ctx.addIssue({ code: 'custom', path: ['lat'], message: `lat is required (or give cells)` });
    if (s.lon === undefined) ctx.addIssue({ code: 'custom', path: ['lon'], message: `lon is required (or give cells)` });
  };
}

export const sourceSchema = z
  .looseObject({
    name: z.string().min(1).max(80).optional(),
    lat: latitude.optional(),
    lon: longitude.optional(),
    cells: cellsSchema.optional(),
    /** C^2 km^2 / s */
    intensity: z.number().min(0).max(1e15),
    /** Optional angular spread (degrees) of a spot region around lat/lon; 0 or absent = point source. */
    spreadDeg: z.number().min(0).max(30).optional(),
  })
  .superRefine(placement('source'));

/** Welch statistics of a spectrum (stats/welch-statistics.ts): contradictory or too few are refused, naming the field. */
export const welchStatisticsSchema = z
  .looseObject({
    segments: z.number().int(),
    window: z.literal('hann'),
    overlap: z.number(),
    effectiveAverages: z.number(),
  })
  .superRefine((w, ctx) => {
    const problem = welchStatisticsProblem(w);
    if (problem) {
      const field = problem.slice(0, problem.indexOf(':'));
      ctx.addIssue({ code: 'custom', path: [field], message: problem.slice(field.length + 2) });
    }
  });

export const observedSchema = z
  .looseObject({
    station: z.string().min(1),
    component,
    frequencies: z.array(z.number().positive()).min(1),
    power: z.array(z.number().positive()).min(1),
    /** Standard deviation of ln power; required unless `welch` is given (which then wins). */
    sigmaLog: z.number().positive().optional(),
    welch: welchStatisticsSchema.optional(),
  })
  .superRefine((o, ctx) => {
    if (o.sigmaLog === undefined && o.welch === undefined)
      ctx.addIssue({ code: 'custom', path: ['sigmaLog'], message: "give sigmaLog or the spectrum's welch statistics" });
    if (o.frequencies.length !== o.power.length)
      ctx.addIssue({
        code: 'custom',
        path: ['power'],
        message: `power has ${o.power.length} values but frequencies has ${o.frequencies.length}`,
      });
  });

const range = (lo: number, hi: number) =>
  z
    .looseObject({ min: z.number().min(lo).max(hi), max: z.number().min(lo).max(hi) })
    .refine((r) => r.min <= r.max, { message: 'min must not exceed max', path: ['max'] });

export const unknownSchema = z
  .looseObject({
    name: z.string().min(1),
    intensity: range(0, 1e15),
    /** A range to search, or a single number: fixed in place. */
    lat: z.union([latitude, range(-90, 90)]).optional(),
    lon: z.union([longitude, range(-360, 360)]).optional(),
    /** A fixed region of grid cells instead of lat/lon: only its intensity is searched. */
    cells: cellsSchema.optional(),
  })
  .superRefine((u, ctx) =>
    placement('region')({ lat: u.lat as number | undefined, lon: u.lon as number | undefined, cells: u.cells }, ctx),
  )
  .transform(({ cells, ...u }) => {
    type Coordinate = number | { min: number; max: number };
    type Footprint = { lat: number; lon: number; weight: number }[];
    if (!cells) return u as typeof u & { lat: Coordinate; lon: Coordinate; footprint?: Footprint };
    const region = cellRegion(cells.cellSizeDeg, cells.ids);
    return {
      ...u,
      lat: region.lat as Coordinate,
      lon: region.lon as Coordinate,
      footprint: region.nodes as Footprint | undefined,
    };
  });

export const caseSchema = z
  .looseObject({
    cavity: cavityConfigSchema,
    band: bandSchema,
    stations: z.array(stationSchema).min(1),
    sources: z.array(sourceSchema).optional(),
    observed: z.array(observedSchema).optional(),
    unknowns: z.array(unknownSchema).optional(),
  })
  .superRefine((c, ctx) => {
    const codes = new Map<string, Set<string>>();
    c.stations.forEach((s, i) => {
      if (codes.has(s.code))
        ctx.addIssue({ code: 'custom', path: ['stations', i, 'code'], message: `station code "${s.code}" is used twice` });
      codes.set(s.code, new Set(s.components));
    });
    c.observed?.forEach((o, i) => {
      const comps = codes.get(o.station);
      if (!comps)
        ctx.addIssue({ code: 'custom', path: ['observed', i, 'station'], message: `no station with code "${o.station}"` });
      else if (!comps.has(o.component))
        ctx.addIssue({
          code: 'custom',
          path: ['observed', i, 'component'],
          message: `station "${o.station}" does not list component ${o.component}`,
        });
    });
    const names = new Set<string>();
    c.unknowns?.forEach((u, i) => {
      if (names.has(u.name))
        ctx.addIssue({ code: 'custom', path: ['unknowns', i, 'name'], message: `unknown "${u.name}" is listed twice` });
      names.add(u.name);
    });
    const t = c.cavity.table;
    if (c.cavity.model === 'table' && t && t.rows.length >= 2 && !bandProblem(c.band)) {
      const lo = t.rows[0][0];
      const hi = t.rows[t.rows.length - 1][0];
      const top = c.band.minHz + (bandSize(c.band) - 1) * c.band.stepHz;
      if (c.band.minHz < lo || top > hi)
        ctx.addIssue({
          code: 'custom',
          path: ['band'],
          message: `band ${c.band.minHz}–${top} Hz reaches outside the propagation table (${lo}–${hi} Hz)`,
        });
    }
  });

export type CaseFile = z.infer<typeof caseSchema>;

/** A case for `forward`: sources are required. */
export const forwardCaseSchema = caseSchema.superRefine((c, ctx) => {
  if (!c.sources || c.sources.length === 0)
    ctx.addIssue({ code: 'custom', path: ['sources'], message: 'forward needs at least one source' });
});

/** A case for `invert`: observed spectra and unknowns are required. */
export const invertCaseSchema = caseSchema.superRefine((c, ctx) => {
  if (!c.observed || c.observed.length === 0)
    ctx.addIssue({ code: 'custom', path: ['observed'], message: 'invert needs at least one observed spectrum' });
  if (!c.unknowns || c.unknowns.length === 0)
    ctx.addIssue({ code: 'custom', path: ['unknowns'], message: 'invert needs at least one unknown source' });
});
