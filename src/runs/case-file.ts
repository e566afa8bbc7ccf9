/**
 * One interval of a run as a case file for the command line's `invert`: the
 * pinned cavity model, the stations, the interval's observations exactly as
 * the run solved them (spectra, or fitted modes with the fit they came from),
 * the regions as unknowns (cell regions by their grid cells, moving regions by
 * their ranges and spread), and the run's starts, seed and solver settings.
 * `invert case.json` then repeats the run's inversion of that interval.
 */
import { getRun, listRunIntervals } from '@/db/repo/runs';
import { badRequest, notFound } from '@/src/server/errors';
import { loadRunContext } from './context';
import { MODE_BAND, loadIntervalObservations } from './observations';
import type { RunContext } from './types';
import { isId } from '@/src/server/ids';
import { record } from '@/src/audit';

/** The case's unknowns: what `buildUnknowns` gives the run's solver, in the case file's terms. */
export function caseUnknowns(ctx: RunContext): Record<string, unknown>[] {
  const byKey = new Map(ctx.grid.regions.map((r) => [r.key, r]));
  return ctx.config.regions.map((u) => {
    const r = byKey.get(u.region);
    if (!r) throw new Error(`region "${u.region}" is not in the run's grid`);
    if (r.kind === 'cells')
      return { name: r.name, intensity: u.intensity, cells: { cellSizeDeg: ctx.grid.cellSizeDeg, ids: r.cells } };
    return {
      name: r.name,
      intensity: u.intensity,
      lat: u.lat ?? r.centre.lat,
      lon: u.lon ?? r.centre.lon,
      ...(r.spreadDeg > 0 ? { spread: r.spreadDeg } : {}),
    };
  });
}

/** The run interval `interval` names (its start as ISO time, or its id); the only one when the run has one. */
async function pickInterval(runId: string, interval: string | undefined): Promise<Date> {
  const rows = await listRunIntervals(runId);
  if (interval === undefined) {
    if (rows.length === 1) return rows[0].startsAt;
    throw badRequest(
      rows.length === 0
        ? 'This run has no finished interval to export yet.'
        : `This run has ${rows.length} finished intervals: name one with interval=<start time or id>.`,
      'interval',
    );
  }
  const t = isId(interval) ? null : Date.parse(interval);
  const row = rows.find((r) => (t === null ? r.id === interval : r.startsAt.getTime() === t));
  if (!row) throw notFound(`This run has no finished interval "${interval}".`);
  return row.startsAt;
}

function spectrumBand(ctx: RunContext, frequencies: number[][]): { minHz: number; maxHz: number; stepHz: number } {
  const o = ctx.config.observables;
  if (o.kind !== 'spectrum') return MODE_BAND;
  let step = Infinity;
  for (const f of frequencies) for (let i = 1; i < f.length; i++) step = Math.min(step, f[i] - f[i - 1]);
  return { minHz: o.minHz, maxHz: o.maxHz, stepHz: Number.isFinite(step) && step > 0 ? step : o.maxHz - o.minHz };
}

export interface RunCase {
  file: string;
  body: Record<string, unknown>;
}

export async function runCaseFile(networkId: string, runId: string, actorId: string | null, interval?: string): Promise<RunCase> {
  const run = await getRun(networkId, runId);
  if (!run) throw notFound('That run is not in this network.');
  const startsAt = await pickInterval(runId, interval);
  const ctx = await loadRunContext(run);
  const obs = await loadIntervalObservations(networkId, ctx.config, startsAt);
  const modes = ctx.config.observables.kind === 'modes';
  const c = ctx.config;
  const body: Record<string, unknown> = {
    cavity: ctx.cavity,
    band: modes
      ? MODE_BAND
      : spectrumBand(
          ctx,
          obs.observed.map((s) => s.frequencies),
        ),
    stations: ctx.stations.map((s) => ({ code: s.code, lat: s.lat, lon: s.lon, components: c.data.components })),
    ...(modes
      ? {
          observedModes: (obs.modes ?? []).map((m) => ({
            station: m.station,
            component: m.component,
            modes: m.modes,
            ...(m.fit
              ? {
                  fit: {
                    modes: m.fit.modes,
                    ...(m.fit.minHz !== undefined ? { minHz: m.fit.minHz } : {}),
                    ...(m.fit.maxHz !== undefined ? { maxHz: m.fit.maxHz } : {}),
                    ...(m.fit.excludeLines ? { excludeLines: m.fit.excludeLines } : {}),
                    ...(m.fit.excludeRanges ? { excludeRanges: m.fit.excludeRanges } : {}),
                  },
                }
              : {}),
          })),
        }
      : { observed: obs.observed }),
    unknowns: caseUnknowns(ctx),
    starts: c.starts,
    seed: c.seed,
    solver: {
      initialDamping: c.damping.initialLambda,
      maxIterations: c.damping.maxIterations,
      scaleErrors: c.damping.scaleCovariance,
    },
    run: { id: run.id, name: run.name, interval: startsAt.toISOString(), engineVersion: run.engineVersion },
    note: 'Research estimates of regional thunderstorm activity; not a lightning warning.',
  };
  const stamp = startsAt.toISOString().slice(0, 16).replace(/[-:]/g, '');
  const summary = `case file of run "${run.name}", interval ${startsAt.toISOString()}`;
  await record({ networkId, actorId, action: 'exported', subject: 'run', subjectId: run.id, summary });
  return { file: `cavitas-run-${run.id.slice(0, 8)}-${stamp}-case.json`, body };
}
