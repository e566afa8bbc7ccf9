/**
 * The case file shared by the `forward` and `invert` commands: cavity, band,
 * stations, sources, observed spectra and unknowns. Extra fields are allowed
 * everywhere; the ones below mean exactly this. Every problem is reported with
 * the path of the field at fault.
 */
import { z } from 'zod';
import { bandProblem, bandSize } from '../band';
import { cavityConfigSchema } from '../cavity/schema';

const latitude = z.number().min(-90).max(90);
const longitude = z.number().min(-360).max(360);
const component = z.enum(['Ez', 'Bns', 'Bew']);

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

export const sourceSchema = z.looseObject({
  name: z.string().min(1).max(80).optional(),
  lat: latitude,
  lon: longitude,
  /** C^2 km^2 / s */
  intensity: z.number().min(0).max(1e15),
  /** Optional angular spread (degrees) of a spot region around lat/lon; 0 or absent = point source. */
  spreadDeg: z.number().min(0).max(30).optional(),
});

export const observedSchema = z
  .looseObject({
    station: z.string().min(1),
    component,
    frequencies: z.array(z.number().positive()).min(1),
    power: z.array(z.number().positive()).min(1),
    sigmaLog: z.number().positive(),
  })
  .superRefine((o, ctx) => {
    if (o.frequencies.length !== o.power.length)
      ctx.addIssue({ code: 'custom', path: ['power'], message: `power has ${o.power.length} values but frequencies has ${o.frequencies.length}` });
  });

const range = (lo: number, hi: number) =>
  z.looseObject({ min: z.number().min(lo).max(hi), max: z.number().min(lo).max(hi) }).refine((r) => r.min <= r.max, { message: 'min must not exceed max', path: ['max'] });

export const unknownSchema = z.looseObject({
  name: z.string().min(1),
  intensity: range(0, 1e15),
  /** A range to search, or a single number: fixed in place. */
  lat: z.union([latitude, range(-90, 90)]),
  lon: z.union([longitude, range(-360, 360)]),
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
      if (codes.has(s.code)) ctx.addIssue({ code: 'custom', path: ['stations', i, 'code'], message: `station code "${s.code}" is used twice` });
      codes.set(s.code, new Set(s.components));
    });
    c.observed?.forEach((o, i) => {
      const comps = codes.get(o.station);
      if (!comps) ctx.addIssue({ code: 'custom', path: ['observed', i, 'station'], message: `no station with code "${o.station}"` });
      else if (!comps.has(o.component))
        ctx.addIssue({ code: 'custom', path: ['observed', i, 'component'], message: `station "${o.station}" does not list component ${o.component}` });
    });
    const names = new Set<string>();
    c.unknowns?.forEach((u, i) => {
      if (names.has(u.name)) ctx.addIssue({ code: 'custom', path: ['unknowns', i, 'name'], message: `unknown "${u.name}" is listed twice` });
      names.add(u.name);
    });
    const t = c.cavity.table;
    if (c.cavity.model === 'table' && t && t.rows.length >= 2 && !bandProblem(c.band)) {
      const lo = t.rows[0][0];
      const hi = t.rows[t.rows.length - 1][0];
      const top = c.band.minHz + (bandSize(c.band) - 1) * c.band.stepHz;
      if (c.band.minHz < lo || top > hi)
        ctx.addIssue({ code: 'custom', path: ['band'], message: `band ${c.band.minHz}–${top} Hz reaches outside the propagation table (${lo}–${hi} Hz)` });
    }
  });

export type CaseFile = z.infer<typeof caseSchema>;

/** A case for `forward`: sources are required. */
export const forwardCaseSchema = caseSchema.superRefine((c, ctx) => {
  if (!c.sources || c.sources.length === 0) ctx.addIssue({ code: 'custom', path: ['sources'], message: 'forward needs at least one source' });
});

/** A case for `invert`: observed spectra and unknowns are required. */
export const invertCaseSchema = caseSchema.superRefine((c, ctx) => {
  if (!c.observed || c.observed.length === 0) ctx.addIssue({ code: 'custom', path: ['observed'], message: 'invert needs at least one observed spectrum' });
  if (!c.unknowns || c.unknowns.length === 0) ctx.addIssue({ code: 'custom', path: ['unknowns'], message: 'invert needs at least one unknown source' });
});
