/**
 * A case file brought back as a run. The case is checked as the command line
 * checks it (the engine's case schema), then against the network: every
 * station must be one of its stations and list the case's components. Its
 * cavity becomes a new model version, its unknowns a new source grid (cell
 * regions by their cells, moving regions by their ranges), and its own
 * observations are what the run solves (stored with the run, not looked up).
 * Every refusal names the case's field; nothing is stored unless all is well.
 */
import type { ZodError } from 'zod';
import { listStations } from '@/db/repo/stations';
import { enqueue } from '@/db/jobs';
import { caseSolveSchema } from '@/src/engine/case/solve-options';
import { invertAnyCaseSchema, caseModes } from '@/src/engine/case/mode-input';
import { resolveCavity } from '@/src/engine/cavity/resolve';
import type { CavityConfig } from '@/src/engine/cavity/types';
import { LM_INITIAL_DAMPING, LM_MAX_ITERATIONS } from '@/src/engine/tolerances';
import { badRequest } from '@/src/server/errors';
import { saveGrid, saveModel } from './catalogue';
import { runConfigSchema, type RunConfig } from './config';
import { gridInputSchema, gridProblems, type GridInput } from './grid-spec';
import { regionColour } from '@/src/design/tokens';
import { logPowerVariance } from '@/src/engine/stats/log-power';
import { RUN_JOB_OPTIONS, RUN_QUEUE } from './queues';
import { record } from '@/src/audit';
import type { ObservedSeries } from './types';
import { storeRun } from './launch';

type Range = { min: number; max: number };
type RawUnknown = {
  name: string;
  intensity: Range;
  lat?: number | Range;
  lon?: number | Range;
  cells?: { cellSizeDeg: number; ids: number[] };
  spread?: unknown;
};

/** Intensities are searched as logarithms: a lower bound of 0 becomes max * 1e-9, as the command line does. */
const ZERO_INTENSITY_FLOOR = 1e-9;
const TEN_MINUTES_MS = 600_000;

function refuse(field: string, message: string): never {
  throw badRequest(`${field}: ${message}`, field);
}

/** A zod failure of an internal shape, reported at the case field it came from. */
function firstIssue(e: ZodError, at: (path: string) => string): never {
  const issue = e.issues[0];
  const path = issue.path.map(String).join('.');
  refuse(at(path), issue.message);
}

function slug(i: number): string {
  return `case-region-${i + 1}`;
}

function regionOf(u: RawUnknown, i: number, cellSizeDeg: number): GridInput['regions'][number] {
  const base = { key: slug(i), name: u.name.slice(0, 60), colour: regionColour(i) };
  if (u.cells) {
    if (u.cells.cellSizeDeg !== cellSizeDeg)
      refuse(`unknowns.${i}.cells.cellSizeDeg`, `all regions of cells must use one cell size (${cellSizeDeg}° here)`);
    return { ...base, kind: 'cells', cells: u.cells.ids };
  }
  if (u.spread !== undefined && typeof u.spread !== 'number')
    refuse(`unknowns.${i}.spread`, 'a run keeps a region’s spread fixed: give one number of degrees');
  const axis = (v: number | Range | undefined, lo: number, hi: number, field: string) => {
    if (v === undefined) refuse(`unknowns.${i}.${field}`, `${field} is required (or give cells)`);
    const r = typeof v === 'number' ? { min: v, max: v } : v;
    if (r.min < lo || r.max > hi) refuse(`unknowns.${i}.${field}`, `a run's regions lie within ${lo}..${hi} degrees`);
    return r;
  };
  const lat = axis(u.lat, -90, 90, 'lat');
  const lon = axis(u.lon, -180, 180, 'lon');
  const widen = (r: Range, lo: number, hi: number) =>
    r.min < r.max ? r : { min: Math.max(lo, r.min - 1), max: Math.min(hi, r.max + 1) };
  return {
    ...base,
    kind: 'moving',
    centre: { lat: (lat.min + lat.max) / 2, lon: (lon.min + lon.max) / 2 },
    bounds: { lat: widen(lat, -90, 90), lon: widen(lon, -180, 180) },
    spreadDeg: typeof u.spread === 'number' ? u.spread : 0,
  };
}

function regionUnknown(u: RawUnknown, i: number): RunConfig['regions'][number] {
  const intensity = u.intensity.min > 0 ? u.intensity : { min: u.intensity.max * ZERO_INTENSITY_FLOOR, max: u.intensity.max };
  if (!(intensity.min < intensity.max))
    refuse(`unknowns.${i}.intensity`, 'the intensity range must have its minimum below its maximum');
  const free = (v: number | Range | undefined) => (v !== undefined && typeof v !== 'number' && v.min < v.max ? v : undefined);
  const lat = u.cells ? undefined : free(u.lat);
  const lon = u.cells ? undefined : free(u.lon);
  return { region: slug(i), intensity, ...(lat ? { lat } : {}), ...(lon ? { lon } : {}) };
}

function intervalOf(body: Record<string, unknown>): string {
  const at = (body.run as { interval?: unknown } | undefined)?.interval;
  const t = typeof at === 'string' ? Date.parse(at) : NaN;
  return new Date(Number.isFinite(t) ? t : Math.floor(Date.now() / TEN_MINUTES_MS) * TEN_MINUTES_MS).toISOString();
}

/** The imported run's name: the case's `name` or `run.name`, else one made from the time. */
function nameOf(body: Record<string, unknown>): string {
  const given = typeof body.name === 'string' ? body.name : (body.run as { name?: unknown } | undefined)?.name;
  const name = typeof given === 'string' && given.trim() ? given.trim() : 'Case';
  return `Imported: ${name}`.slice(0, 120);
}

export async function importCase(networkId: string, userId: string, raw: unknown): Promise<{ runId: string }> {
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) refuse('(top level)', 'a case file is a JSON object');
  const c = invertAnyCaseSchema.parse(raw); // ZodError → 400 naming the field
  const body = raw as Record<string, unknown>;
  const solve = caseSolveSchema.parse(body);

  // Stations: the network's, by code, with the components the case lists.
  const mine = new Map((await listStations(networkId)).map((s) => [s.code, s]));
  const stationIds: string[] = [];
  c.stations.forEach((s, i) => {
    const st = mine.get(s.code);
    if (!st) refuse(`stations.${i}.code`, `this network has no station "${s.code}"`);
    const has = new Set(st.components.map((x) => x.component));
    const missing = s.components.filter((x) => !has.has(x));
    if (missing.length) refuse(`stations.${i}.components`, `station "${s.code}" has no ${missing.join(', ')} component here`);
    stationIds.push(st.id);
  });

  // Cavity: a model version of its own.
  const cavity = c.cavity as CavityConfig;
  try {
    resolveCavity(cavity);
  } catch (e) {
    refuse('cavity', (e as Error).message);
  }

  // Unknowns: a source grid of their own, one region each.
  const unknowns = (body.unknowns as RawUnknown[]) ?? [];
  const cellSizeDeg = unknowns.find((u) => u.cells)?.cells?.cellSizeDeg ?? 10;
  const grid: GridInput = {
    name: nameOf(body).slice(0, 80),
    notes: 'Regions of an imported case file.',
    cellSizeDeg,
    regions: unknowns.map((u, i) => regionOf(u, i, cellSizeDeg)),
  };
  const gridParsed = gridInputSchema.safeParse(grid);
  if (!gridParsed.success)
    firstIssue(gridParsed.error, (p) =>
      p.startsWith('cellSizeDeg')
        ? `unknowns.${unknowns.findIndex((u) => u.cells)}.cells.cellSizeDeg`
        : `unknowns.${p.split('.')[1] ?? ''}`,
    );
  const problem = gridProblems(gridParsed.data)[0];
  if (problem) refuse(`unknowns.${problem.field.split('.')[1] ?? ''}`, problem.message);

  // Observations: the case's own, as the run will solve them.
  const modes = caseModes(c);
  const observed: ObservedSeries[] = (c.observed ?? []).map((o) => ({
    station: o.station,
    component: o.component,
    frequencies: o.frequencies,
    power: o.power,
    // With Welch statistics the engine takes sigma from them (they win); sigmaLog then says the same.
    sigmaLog: o.welch ? Math.sqrt(logPowerVariance(o.welch.effectiveAverages)) : o.sigmaLog!,
    ...(o.welch ? { welch: o.welch } : {}),
  }));
  const components = [...new Set([...observed.map((o) => o.component), ...(modes ?? []).map((m) => m.component)])];
  const at = intervalOf(body);
  const draft = {
    name: nameOf(body),
    modelId: '00000000-0000-4000-8000-000000000000',
    gridId: '00000000-0000-4000-8000-000000000000',
    data: { stationIds, components, from: at, to: at, includeFlagged: false },
    observables: modes
      ? { kind: 'modes' as const, modes: Math.max(...modes.map((m) => m.modes.length)) }
      : { kind: 'spectrum' as const, minHz: c.band.minHz, maxHz: c.band.maxHz, every: 1 },
    regions: unknowns.map(regionUnknown),
    damping: {
      initialLambda: solve.solver?.initialDamping ?? LM_INITIAL_DAMPING,
      maxIterations: solve.solver?.maxIterations ?? LM_MAX_ITERATIONS,
      scaleCovariance: solve.solver?.scaleErrors ?? false,
    },
    starts: solve.starts ?? 64,
    seed: solve.seed ?? 1,
    imported: { observed, ...(modes ? { modes: modes as NonNullable<RunConfig['imported']>['modes'] } : {}) },
  };
  const parsed = runConfigSchema.safeParse(draft);
  if (!parsed.success) firstIssue(parsed.error, configFieldToCase);

  // All is well: store the model, the grid and the run, and queue it.
  const model = await saveModel(networkId, userId, {
    name: grid.name,
    notes: 'Cavity of an imported case file.',
    config: cavity,
  });
  const savedGrid = await saveGrid(networkId, userId, gridParsed.data);
  const config: RunConfig = { ...parsed.data, modelId: model.id, gridId: savedGrid.id };
  const run = await storeRun(networkId, userId, config, [at]);
  await enqueue(RUN_QUEUE, { runId: run.id }, RUN_JOB_OPTIONS);
  await record({
    networkId,
    actorId: userId,
    action: 'imported',
    subject: 'run',
    subjectId: run.id,
    summary: `case file as run "${run.name}"`,
  });
  return { runId: run.id };
}

/** A run-configuration field in the case's own terms. */
function configFieldToCase(path: string): string {
  if (path.startsWith('starts') || path.startsWith('seed')) return path;
  if (path.startsWith('damping.initialLambda')) return 'solver.initialDamping';
  if (path.startsWith('damping.maxIterations')) return 'solver.maxIterations';
  if (path.startsWith('regions.')) return `unknowns.${path.slice('regions.'.length)}`;
  if (path.startsWith('observables')) return 'band';
  if (path.startsWith('data.stationIds')) return 'stations';
  return path || '(top level)';
}
