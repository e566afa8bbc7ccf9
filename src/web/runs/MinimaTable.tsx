'use client';
/** The distinct minima of one interval, sortable; clicking a row selects that minimum everywhere on the page. */
import { useMemo } from 'react';
import { type InversionResult } from './types';
import { formatEstimate, formatValue } from '@/src/web/ui/format';
import { saveCsv } from '@/src/web/ui/export';
import { SortHeader, useSort } from '@/src/web/ui/SortHeader';
import type { RunConfig } from '@/src/runs/config';
import type { Region } from '@/src/runs/grid-spec';

type Bounds = { min: number; max: number };

/** Allowed range of each free parameter ("Region.intensity", "Region.lat", …) from the run's settings and grid. */
export function parameterBounds(config: Pick<RunConfig, 'regions'>, regions: Region[]): Record<string, Bounds> {
  const out: Record<string, Bounds> = {};
  for (const u of config.regions) {
    const r = regions.find((x) => x.key === u.region || x.name === u.region);
    const name = r?.name ?? u.region;
    out[`${name}.intensity`] = u.intensity;
    const lat = u.lat ?? (r?.kind === 'moving' ? r.bounds.lat : undefined);
    const lon = u.lon ?? (r?.kind === 'moving' ? r.bounds.lon : undefined);
    if (lat) out[`${name}.lat`] = lat;
    if (lon) out[`${name}.lon`] = lon;
  }
  return out;
}
import { goodnessOf } from '@/src/runs/goodness';
import { errorScaleLabel } from '@/src/runs/error-scaling';

type Key = 'rank' | 'misfit' | 'reduced' | 'count';

export function MinimaTable({
  result,
  selected,
  onSelect,
  bounds = {},
}: {
  result: InversionResult;
  selected: number;
  onSelect: (i: number) => void;
  /** Allowed ranges (`parameterBounds`): an estimate on a bound is flagged instead of given a symmetric error. */
  bounds?: Record<string, Bounds>;
}) {
  const [sort, toggleSort] = useSort<Key>({ key: 'rank', desc: false });
  const names = result.paramNames;
  const dof = result.nData - result.nParams;
  const scaleOf = (m: unknown) => (m as { errorScale?: number }).errorScale;
  const rows = useMemo(() => {
    const r = result.minima.map((m, i) => ({ i, rank: i + 1, misfit: m.misfit, reduced: m.reducedChi2, count: m.count, m }));
    r.sort((a, b) => (a[sort.key] - b[sort.key]) * (sort.desc ? -1 : 1));
    return r;
  }, [result, sort]);
  const head = (key: Key, label: string) => (
    <SortHeader column={key} sort={sort} onSort={toggleSort}>
      {label}
    </SortHeader>
  );
  const value = (m: (typeof rows)[number]['m'], name: string) => {
    const [region, kind] = name.split(/\.(?=[^.]+$)/);
    const s = m.sources.find((x) => x.name === region);
    const v = s ? (s as unknown as Record<string, number>)[kind] : m.params[name];
    const e = m.stdErrors[region]?.[kind as 'lat'];
    return formatEstimate(v, e, bounds[name]);
  };
  const raw = (m: (typeof rows)[number]['m'], name: string) => {
    const [region, kind] = name.split(/\.(?=[^.]+$)/);
    const s = m.sources.find((x) => x.name === region);
    return {
      v: s ? (s as unknown as Record<string, number>)[kind] : m.params[name],
      e: m.stdErrors[region]?.[kind as 'lat'],
    };
  };
  const unitOf = (n: string) => (n.endsWith('.intensity') ? 'C² km²/s' : '°');
  const downloadCsv = () =>
    saveCsv(
      'Minima',
      [
        { key: 'rank', header: 'Minimum' },
        { key: 'misfit', header: 'Misfit chi2' },
        { key: 'reduced', header: 'Reduced chi2' },
        { key: 'count', header: 'Starts' },
        ...names.flatMap((n) => [
          { key: n, header: n, unit: unitOf(n) },
          { key: `${n}.error`, header: `${n} standard error`, unit: unitOf(n) },
          { key: `${n}.bound`, header: `${n} bound` },
        ]),
      ],
      rows.map((r) => ({
        rank: r.rank,
        misfit: r.misfit,
        reduced: r.reduced,
        count: r.count,
        ...Object.fromEntries(
          names.flatMap((n) => {
            const { v, e } = raw(r.m, n);
            return [
              [n, v],
              [`${n}.error`, e],
              [`${n}.bound`, value(r.m, n).flag],
            ];
          }),
        ),
      })),
    );
  return (
    <div className="relative overflow-x-auto">
      <button
        type="button"
        className="absolute top-0 right-0 rounded px-1.5 py-0.5 text-xs text-muted hover:bg-raised hover:text-fg"
        aria-label="Download the minima as CSV"
        onClick={downloadCsv}
      >
        CSV
      </button>
      <table className="w-full text-sm tabular-nums">
        <caption className="sr-only">Distinct minima of this interval; select a row to show it in every figure</caption>
        <thead className="border-b border-line text-muted">
          <tr>
            {head('rank', '#')}
            {head('misfit', 'Misfit χ²')}
            {head('reduced', 'Reduced χ²')}
            <th scope="col" className="px-2 py-1.5 text-right font-medium">
              P(≥ χ²)
            </th>
            {head('count', 'Starts')}
            {names.map((n) => (
              <th key={n} scope="col" className="px-2 py-1.5 text-right font-medium">
                {n}
                {n.endsWith('.intensity') ? ' (C² km²/s)' : ' (°)'}
              </th>
            ))}
            <th scope="col" className="px-2 py-1.5 text-left font-medium">
              ± 1σ
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr
              key={r.i}
              onClick={() => onSelect(r.i)}
              aria-selected={r.i === selected}
              className={`cursor-pointer border-b border-line/60 ${r.i === selected ? 'bg-accent-soft' : 'hover:bg-surface-2'}`}
            >
              <td className="px-2 py-1 text-right">
                <button
                  type="button"
                  className="underline-offset-2 hover:underline"
                  onClick={() => onSelect(r.i)}
                  aria-label={`Select minimum ${r.rank}`}
                >
                  {r.rank}
                </button>
              </td>
              <td className="px-2 py-1 text-right">{formatValue(r.misfit, '', 5)}</td>
              <td className="px-2 py-1 text-right">{formatValue(r.reduced)}</td>
              <td className="px-2 py-1 text-right">
                {formatValue(goodnessOf(r.misfit, dof).p, '', 2)}
                {goodnessOf(r.misfit, dof).implausible ? (
                  <span className="ml-1 rounded bg-danger-soft px-1 text-xs font-semibold text-danger">implausible</span>
                ) : null}
              </td>
              <td className="px-2 py-1 text-right">{r.count}</td>
              {names.map((n) => {
                const { text, flag } = value(r.m, n);
                return (
                  <td
                    key={n}
                    className={`px-2 py-1 text-right whitespace-nowrap ${flag.startsWith('at-') ? 'font-semibold text-danger' : ''}`}
                    title={
                      flag.startsWith('near-')
                        ? 'The error bar reaches past the allowed range: the error is not symmetric here.'
                        : undefined
                    }
                  >
                    {text}
                    {flag.startsWith('near-') ? ' ◂' : ''}
                  </td>
                );
              })}
              <td className="px-2 py-1 text-left text-xs text-muted">{errorScaleLabel(scaleOf(r.m))}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
