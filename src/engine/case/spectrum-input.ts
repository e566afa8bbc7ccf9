/**
 * From a validated case file (src/engine/case) to the inverter's input.
 * Unknown intensity ranges that start at 0 start at max * 1e-9 instead,
 * because the intensity is searched as its logarithm. An optional extra
 * top-level field `selection: { mainsHz?, mainsHalfWidthHz?, exclude?: [{ minHz, maxHz }] }`
 * leaves mains bins and bands out of the misfit.
 */
import { z } from 'zod';
import type { CaseFile } from './schema';
import type { CavityConfig } from '@/src/engine/cavity';
import type { Component } from '@/src/engine/components';
import { InversionInputError } from '@/src/engine/inverse/errors';
import type { SpectrumInversionInput } from '@/src/engine/inverse/interval-problem';
import type { BinSelection, RegionUnknown } from '@/src/engine/inverse/types';

const ZERO_INTENSITY_FLOOR = 1e-9;

export const binSelectionSchema = z.object({
  mainsHz: z.number().positive().optional(),
  mainsHalfWidthHz: z.number().positive().optional(),
  exclude: z
    .array(
      z
        .object({ minHz: z.number(), maxHz: z.number() })
        .refine((b) => b.minHz <= b.maxHz, { message: 'minHz must not exceed maxHz', path: ['maxHz'] }),
    )
    .optional(),
});

function selectionOf(c: CaseFile): BinSelection | undefined {
  const raw = (c as { selection?: unknown }).selection;
  if (raw === undefined) return undefined;
  const parsed = binSelectionSchema.safeParse(raw);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new InversionInputError(`selection.${issue.path.join('.')}: ${issue.message}`);
  }
  return parsed.data;
}

/** The case's unknowns as the inverter's regions (shared by the spectrum and mode inversions). */
export function unknownsFromCase(c: CaseFile): RegionUnknown[] {
  if (!c.unknowns?.length) throw new InversionInputError('unknowns: invert needs at least one unknown source');
  return c.unknowns.map((u) => {
    const spread = (u as { spread?: number | { min: number; max: number } }).spread;
    return {
      name: u.name,
      intensity: u.intensity.min > 0 ? u.intensity : { min: u.intensity.max * ZERO_INTENSITY_FLOOR, max: u.intensity.max },
      lat: u.lat,
      lon: u.lon,
      ...(spread !== undefined ? { spread } : {}),
      ...(u.footprint ? { footprint: u.footprint } : {}), // a region given by grid cells
    };
  });
}

export function inputFromCase(c: CaseFile, selection: BinSelection | undefined = selectionOf(c)): SpectrumInversionInput {
  if (!c.observed?.length) throw new InversionInputError('observed: invert needs at least one observed spectrum');
  const unknowns = unknownsFromCase(c);
  return {
    cavity: c.cavity as CavityConfig,
    stations: c.stations.map((s) => ({ code: s.code, lat: s.lat, lon: s.lon })),
    observed: c.observed.map((o) => ({
      station: o.station,
      component: o.component as Component,
      frequencies: o.frequencies,
      power: o.power,
      sigmaLog: o.sigmaLog,
      ...(o.welch ? { welch: o.welch } : {}),
    })),
    unknowns,
    selection,
  };
}
