'use client';
/**
 * Setting up a run (react-hook-form, validated by the same zod schema as the
 * API). The preview asks the server to check the configuration against the
 * stored model, grid and data, and shows data, parameters, starts and a time
 * estimate — or every problem beside its field — before anything is launched.
 */
import { useEffect, useMemo, useState } from 'react';
import { useRouter } from 'next/navigation';
import { useForm, useWatch, type Resolver } from 'react-hook-form';
import { Button, Caution, Notice, formatDuration, inputClass } from '@/src/web/ui';
import { apiSend } from '@/src/web/swr';
import { INVERSION_DEFAULTS } from '@/src/engine/inverse/defaults';
import { runConfigSchema } from '@/src/runs/config';
import type { Region } from '@/src/runs/grid-spec';
import { COMPONENTS } from '@/src/engine/components';

export interface LauncherOptions {
  models: { id: string; name: string; version: number }[];
  grids: { id: string; name: string; version: number; regions: Region[] }[];
  stations: { id: string; code: string; name: string; components: string[] }[];
  range: { first: string | null; last: string | null };
}

type RegionRow = {
  region: string;
  use: boolean;
  iMin: number;
  iMax: number;
  moving: boolean;
  latMin: number;
  latMax: number;
  lonMin: number;
  lonMax: number;
};
type FormValues = {
  name: string;
  modelId: string;
  gridId: string;
  stationIds: string[];
  components: string[];
  from: string;
  to: string;
  includeFlagged: boolean;
  kind: 'spectrum' | 'modes';
  minHz: number;
  maxHz: number;
  every: number;
  modes: number;
  regions: RegionRow[];
  initialLambda: number;
  maxIterations: number;
  scaleErrorsByMisfit: boolean;
  starts: number;
  seed: number;
};
type Preview = {
  nData: number;
  nParams: number;
  starts: number;
  intervals: number;
  series: number;
  estimateSeconds: number;
  estimateBasis: 'measured' | 'built-in';
  firstInterval?: string;
  lastInterval?: string;
};
type Problem = { field: string; message: string };

/** ISO 8601 date-time in UTC, 24-hour, as the form shows it: "2026-03-14 06:20". */
export const local = (iso: string | null) => (iso ? iso.slice(0, 16).replace('T', ' ') : '');
/** The form's "YYYY-MM-DD hh:mm" (space or T) as a UTC date-time for the API; anything else is passed on for the schema to name. */
export const utc = (s: string) => {
  const t = s.trim().replace(' ', 'T');
  return /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/.test(t) ? `${t}:00.000Z` : s.trim();
};

/** The default span: the whole last stored UTC day (from its first stored interval, or midnight, to the last one). */
export function defaultSpan(range: { first: string | null; last: string | null }): { from: string; to: string } {
  if (!range.last) return { from: '', to: '' };
  const midnight = `${range.last.slice(0, 10)}T00:00:00.000Z`;
  const from = range.first && range.first > midnight ? range.first : midnight;
  return { from: local(from), to: local(range.last) };
}

const list = (x: unknown): string[] => (Array.isArray(x) ? x : typeof x === 'string' && x ? [x] : []);

export function toConfig(v: FormValues): unknown {
  return {
    name: v.name,
    modelId: v.modelId,
    gridId: v.gridId,
    data: {
      stationIds: list(v.stationIds),
      components: list(v.components),
      from: utc(v.from),
      to: utc(v.to),
      includeFlagged: v.includeFlagged,
    },
    observables:
      v.kind === 'spectrum'
        ? { kind: 'spectrum', minHz: Number(v.minHz), maxHz: Number(v.maxHz), every: Number(v.every) }
        : { kind: 'modes', modes: Number(v.modes) },
    regions: (v.regions ?? [])
      .filter((r) => r.use)
      .map((r) => ({
        region: r.region,
        intensity: { min: Number(r.iMin), max: Number(r.iMax) },
        ...(r.moving
          ? { lat: { min: Number(r.latMin), max: Number(r.latMax) }, lon: { min: Number(r.lonMin), max: Number(r.lonMax) } }
          : {}),
      })),
    damping: {
      initialLambda: Number(v.initialLambda),
      maxIterations: Number(v.maxIterations),
    },
    scaleErrorsByMisfit: v.scaleErrorsByMisfit,
    starts: Number(v.starts),
    seed: Number(v.seed),
  };
}

/** Form paths for config paths, so an error lands beside its control. */
function formPath(configPath: string): string {
  return configPath
    .replace(/^data\./, '')
    .replace(/^observables\./, '')
    .replace(/^damping\./, '')
    .replace(/^regions\.(\d+)\.intensity.*/, 'regions.$1.iMin')
    .replace(/^regions\.(\d+)\.(lat|lon).*/, 'regions.$1.$2Min')
    .replace(/\.\d+$/, '');
}

const resolver: Resolver<FormValues> = async (values) => {
  const r = runConfigSchema.safeParse(toConfig(values));
  if (r.success) return { values, errors: {} };
  const errors: Record<string, { type: string; message: string }> = {};
  for (const issue of r.error.issues) {
    const key = formPath(issue.path.join('.')) || 'root';
    errors[key] ??= { type: issue.code, message: issue.message };
  }
  return { values: {}, errors: errors as never };
};

function regionRows(regions: Region[]): RegionRow[] {
  return regions.map((r) => ({
    region: r.key,
    use: true,
    iMin: 100,
    iMax: 1e6,
    moving: r.kind === 'moving',
    latMin: r.kind === 'moving' ? r.bounds.lat.min : 0,
    latMax: r.kind === 'moving' ? r.bounds.lat.max : 0,
    lonMin: r.kind === 'moving' ? r.bounds.lon.min : 0,
    lonMax: r.kind === 'moving' ? r.bounds.lon.max : 0,
  }));
}

export function RunLauncher({ networkId, options }: { networkId: string; options: LauncherOptions }) {
  const router = useRouter();
  const firstGrid = options.grids[0];
  const form = useForm<FormValues>({
    resolver,
    mode: 'onChange',
    defaultValues: {
      name: `Run ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UT`,
      modelId: options.models[0]?.id ?? '',
      gridId: firstGrid?.id ?? '',
      stationIds: options.stations.map((s) => s.id),
      components: [...COMPONENTS],
      ...defaultSpan(options.range),
      includeFlagged: false,
      kind: 'spectrum',
      minHz: 6,
      maxHz: 30,
      every: 1,
      modes: 4,
      regions: firstGrid ? regionRows(firstGrid.regions) : [],
      initialLambda: INVERSION_DEFAULTS.lm.initialDamping,
      maxIterations: INVERSION_DEFAULTS.lm.maxIterations,
      scaleErrorsByMisfit: false,
      starts: INVERSION_DEFAULTS.seriesStarts,
      seed: INVERSION_DEFAULTS.seed,
    },
  });
  const {
    register,
    handleSubmit,
    formState: { errors },
    setValue,
    control,
  } = form;
  const values = useWatch({ control }) as FormValues;
  const grid = useMemo(() => options.grids.find((g) => g.id === values.gridId), [options.grids, values.gridId]);
  useEffect(() => {
    if (grid) setValue('regions', regionRows(grid.regions));
  }, [grid, setValue]);
  const [preview, setPreview] = useState<Preview | null>(null);
  const [problems, setProblems] = useState<Problem[]>([]);
  const [serverError, setServerError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function check(v: FormValues) {
    setServerError(null);
    try {
      const r = await apiSend<{ problems: Problem[]; preview: Preview | null }>(
        'POST',
        `/api/networks/${networkId}/runs/check`,
        toConfig(v),
      );
      setProblems(r.problems);
      setPreview(r.preview);
      return r.problems.length === 0;
    } catch (e) {
      setServerError((e as Error).message);
      return false;
    }
  }
  async function launch(v: FormValues) {
    setBusy(true);
    try {
      if (!(await check(v))) return;
      const r = await apiSend<{ run: { id: string } }>('POST', `/api/networks/${networkId}/runs`, toConfig(v));
      router.push(`/n/${networkId}/runs/${r.run.id}`);
    } catch (e) {
      setServerError((e as Error).message);
    } finally {
      setBusy(false);
    }
  }
  const err = (k: string) =>
    (errors as Record<string, { message?: string }>)[k]?.message ?? problems.find((p) => formPath(p.field) === k)?.message;
  const section = 'rounded-[var(--radius-card,0.5rem)] border border-line p-4 space-y-3';

  return (
    <form onSubmit={handleSubmit(launch)} className="space-y-5" noValidate>
      <div className={section}>
        <label className="block text-sm font-medium">
          Run name
          <input className={inputClass} {...register('name')} />
        </label>
        <FieldError message={err('name')} />
        <div className="grid gap-3 md:grid-cols-2">
          <label className="block text-sm font-medium">
            Cavity model
            <select className={inputClass} {...register('modelId')}>
              {options.models.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.name} v{m.version}
                </option>
              ))}
            </select>
          </label>
          <label className="block text-sm font-medium">
            Source grid
            <select className={inputClass} {...register('gridId')}>
              {options.grids.map((g) => (
                <option key={g.id} value={g.id}>
                  {g.name} v{g.version}
                </option>
              ))}
            </select>
          </label>
        </div>
        <FieldError message={err('modelId')} />
        <FieldError message={err('gridId')} />
      </div>

      <fieldset className={section}>
        <legend className="px-1 text-sm font-semibold">Data</legend>
        <div className="flex flex-wrap gap-3 text-sm">
          {options.stations.map((s) => (
            <label key={s.id} className="flex items-center gap-1">
              <input type="checkbox" value={s.id} {...register('stationIds')} />
              {s.code} <span className="text-muted">{s.name}</span>
            </label>
          ))}
        </div>
        <FieldError message={err('stationIds')} />
        <div className="flex gap-4 text-sm">
          {COMPONENTS.map((c) => (
            <label key={c} className="flex items-center gap-1">
              <input type="checkbox" value={c} {...register('components')} />
              {c}
            </label>
          ))}
        </div>
        <FieldError message={err('components')} />
        <div className="grid gap-3 md:grid-cols-3">
          <label className="block text-sm font-medium">
            First interval start (UTC, YYYY-MM-DD hh:mm)
            <input
              type="text"
              inputMode="numeric"
              placeholder="2026-03-14 00:00"
              autoComplete="off"
              spellCheck={false}
              className={`${inputClass} num`}
              {...register('from')}
            />
          </label>
          <label className="block text-sm font-medium">
            Last interval start (UTC, YYYY-MM-DD hh:mm)
            <input
              type="text"
              inputMode="numeric"
              placeholder="2026-03-14 23:50"
              autoComplete="off"
              spellCheck={false}
              className={`${inputClass} num`}
              {...register('to')}
            />
          </label>
          <label className="mt-6 flex items-center gap-2 text-sm">
            <input type="checkbox" {...register('includeFlagged')} />
            Include flagged intervals
          </label>
        </div>
        <FieldError message={err('from')} />
        <FieldError message={err('to')} />
        <p className="text-xs text-muted">
          Stored data: {options.range.first ? `${local(options.range.first)} to ${local(options.range.last)} UTC` : 'none yet'}.
          Times are UTC on a 24-hour clock. The same start and end take one interval.
        </p>
      </fieldset>

      <fieldset className={section}>
        <legend className="px-1 text-sm font-semibold">Observables</legend>
        <div className="flex gap-4 text-sm">
          <label className="flex items-center gap-1">
            <input type="radio" value="spectrum" {...register('kind')} />
            Spectrum bins in a band
          </label>
          <label className="flex items-center gap-1">
            <input type="radio" value="modes" {...register('kind')} />
            Mode parameters (fitted peaks)
          </label>
        </div>
        {values.kind === 'spectrum' ? (
          <div className="grid gap-3 md:grid-cols-3">
            <label className="block text-sm font-medium">
              Lowest frequency (Hz)
              <input type="number" step="any" className={inputClass} {...register('minHz', { valueAsNumber: true })} />
            </label>
            <label className="block text-sm font-medium">
              Highest frequency (Hz)
              <input type="number" step="any" className={inputClass} {...register('maxHz', { valueAsNumber: true })} />
            </label>
            <label className="block text-sm font-medium">
              Bins to use (1 = every bin, 2 = every 2nd, …)
              <input type="number" min={1} className={inputClass} {...register('every', { valueAsNumber: true })} />
            </label>
          </div>
        ) : (
          <label className="block text-sm font-medium">
            Modes
            <input type="number" className={inputClass} {...register('modes', { valueAsNumber: true })} />
          </label>
        )}
        <FieldError message={err('minHz')} />
        <FieldError message={err('maxHz')} />
        <FieldError message={err('observables')} />
      </fieldset>

      <fieldset className={section}>
        <legend className="px-1 text-sm font-semibold">Regions and bounds</legend>
        {grid && values.regions?.length ? (
          <table className="w-full text-sm tabular-nums">
            <thead className="text-left text-muted">
              <tr>
                <th>Use</th>
                <th>Region</th>
                <th>Intensity min–max (C² km²/s)</th>
                <th>Centre latitude (°)</th>
                <th>Centre longitude (°)</th>
              </tr>
            </thead>
            <tbody>
              {values.regions.map((r, i) => {
                const reg = grid.regions.find((x) => x.key === r.region);
                const num = 'w-24 rounded border border-line-strong bg-surface px-1.5 py-1';
                return (
                  <tr key={r.region} className="border-t border-line/60 align-top">
                    <td>
                      <input type="checkbox" aria-label={`Use ${reg?.name}`} {...register(`regions.${i}.use`)} />
                    </td>
                    <td>
                      <span className="mr-1 inline-block size-2.5 rounded-sm" style={{ background: reg?.colour }} />
                      {reg?.name} <span className="text-xs text-muted">{reg?.kind === 'cells' ? 'fixed cells' : 'moving'}</span>
                    </td>
                    <td>
                      <input
                        aria-label={`${reg?.name} lowest intensity`}
                        className={num}
                        type="number"
                        step="any"
                        {...register(`regions.${i}.iMin`, { valueAsNumber: true })}
                      />{' '}
                      –{' '}
                      <input
                        aria-label={`${reg?.name} highest intensity`}
                        className={num}
                        type="number"
                        step="any"
                        {...register(`regions.${i}.iMax`, { valueAsNumber: true })}
                      />
                      <FieldError message={err(`regions.${i}.iMin`)} />
                    </td>
                    <td>
                      {r.moving ? (
                        <>
                          <input
                            aria-label={`${reg?.name} lowest latitude`}
                            className={num}
                            type="number"
                            step="any"
                            {...register(`regions.${i}.latMin`, { valueAsNumber: true })}
                          />{' '}
                          –{' '}
                          <input
                            aria-label={`${reg?.name} highest latitude`}
                            className={num}
                            type="number"
                            step="any"
                            {...register(`regions.${i}.latMax`, { valueAsNumber: true })}
                          />
                          <FieldError message={err(`regions.${i}.latMin`)} />
                        </>
                      ) : (
                        'fixed'
                      )}
                    </td>
                    <td>
                      {r.moving ? (
                        <>
                          <input
                            aria-label={`${reg?.name} lowest longitude`}
                            className={num}
                            type="number"
                            step="any"
                            {...register(`regions.${i}.lonMin`, { valueAsNumber: true })}
                          />{' '}
                          –{' '}
                          <input
                            aria-label={`${reg?.name} highest longitude`}
                            className={num}
                            type="number"
                            step="any"
                            {...register(`regions.${i}.lonMax`, { valueAsNumber: true })}
                          />
                          <FieldError message={err(`regions.${i}.lonMin`)} />
                        </>
                      ) : (
                        'fixed'
                      )}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        ) : (
          <p className="text-sm text-muted">The chosen grid has no regions yet: draw some on the grid page first.</p>
        )}
        <FieldError message={err('regions')} />
      </fieldset>

      <fieldset className={section}>
        <legend className="px-1 text-sm font-semibold">Minimisation</legend>
        <div className="grid gap-3 md:grid-cols-4">
          <label className="block text-sm font-medium">
            Starts
            <input type="number" className={inputClass} {...register('starts', { valueAsNumber: true })} />
          </label>
          <label className="block text-sm font-medium">
            Seed
            <input type="number" className={inputClass} {...register('seed', { valueAsNumber: true })} />
          </label>
          <label className="block text-sm font-medium">
            Initial damping λ
            <input type="number" step="any" className={inputClass} {...register('initialLambda', { valueAsNumber: true })} />
          </label>
          <label className="block text-sm font-medium">
            Iterations per start (max)
            <input type="number" className={inputClass} {...register('maxIterations', { valueAsNumber: true })} />
          </label>
        </div>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" {...register('scaleErrorsByMisfit')} />
          Scale errors by the misfit: × √(χ²/dof) where χ²/dof is above 1 (shown errors are then labelled as scaled)
        </label>
        <FieldError message={err('starts')} />
        <FieldError message={err('seed')} />
        <FieldError message={err('initialLambda')} />
        <FieldError message={err('maxIterations')} />
      </fieldset>

      <div className={section} aria-live="polite">
        <div className="flex flex-wrap items-center gap-3">
          <Button type="button" tone="secondary" onClick={handleSubmit((v) => check(v).then(() => undefined))}>
            Check and preview
          </Button>
          <Button type="submit" busy={busy} disabled={busy}>
            Launch run
          </Button>
        </div>
        {preview ? (
          <p className="text-sm tabular-nums" data-testid="run-preview">
            {preview.intervals} interval{preview.intervals === 1 ? '' : 's'} · {preview.series} series · {preview.nData} data per
            interval · {preview.nParams} free parameters · {preview.starts} starts · about{' '}
            {formatDuration(Math.max(1, preview.estimateSeconds))}{' '}
            {preview.estimateBasis === 'measured'
              ? '(from the speed measured on this server)'
              : '(rough: nothing has run on this server yet)'}
          </p>
        ) : null}
        {problems.length ? (
          <Notice tone="error" title="This run cannot start yet">
            <ul className="list-disc pl-5">
              {problems.map((p, i) => (
                <li key={i}>
                  {p.message} <span className="text-xs text-muted">({p.field})</span>
                </li>
              ))}
            </ul>
          </Notice>
        ) : null}
        {serverError ? (
          <Notice tone="error" title="Not launched">
            {serverError}
          </Notice>
        ) : null}
        {errors.root ? <Notice tone="error">{(errors.root as { message?: string }).message}</Notice> : null}
      </div>
      <Caution topic="research" />
    </form>
  );
}

function FieldError({ message }: { message?: string }) {
  return message ? <p className="text-xs font-medium text-danger">{message}</p> : null;
}
