/**
 * A run's interval as the engine's one interval problem (interval-problem.ts):
 * its stations, the unknowns of its regions, and the interval's observed
 * spectra or fitted modes (these on the mode grid). The run solver, the fits
 * view and the misfit surfaces all build through here, so each shows exactly
 * what the inversion fitted.
 */
import type { IntervalInput } from '@/src/engine/inverse/interval-problem';
import { MODE_BAND, type IntervalObservations } from './observations';
import type { RunContext } from './types';
import { buildUnknowns } from './unknowns';

export function intervalInput(ctx: RunContext, obs: IntervalObservations): IntervalInput {
  const stations = ctx.stations.map((s) => ({ code: s.code, lat: s.lat, lon: s.lon }));
  const unknowns = buildUnknowns(ctx.config, ctx.grid);
  return obs.modes
    ? { kind: 'modes', input: { cavity: ctx.cavity, band: MODE_BAND, stations, modes: obs.modes, unknowns } }
    : { kind: 'spectrum', input: { cavity: ctx.cavity, stations, observed: obs.observed, unknowns } };
}
