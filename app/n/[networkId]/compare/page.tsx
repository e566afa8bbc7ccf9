import type { ReactNode } from 'react';
import { pageNetworkAction } from '@/src/auth/pages';
import { listRuns } from '@/src/runs/control';
import { loadComparison, type Comparison, type PickedMinimum } from '@/src/runs/compare-load';
import { Button, Caution, EmptyState, Notice, Panel, inputClass } from '@/src/web/ui';
import { CompareView } from '@/src/web/runs/CompareView';
import { IntervalOptions } from '@/src/web/runs/IntervalPicker';
import { ParameterTable, SettingsDiffTable } from '@/src/web/runs/CompareTables';
import { SeriesGoodnessTable } from '@/src/web/runs/GoodnessTables';
import { RunMap } from '@/src/web/runs/RunMap';
import { RunMapFrame } from '@/src/web/runs/RunMapFrame';
import { solvedIntervals } from '@/src/runs/view-select';
import { isId } from '@/src/server/ids';

export const metadata = { title: 'Compare runs · Cavitas' };

type Query = { a?: string; b?: string; ai?: string; bi?: string; am?: string; bm?: string };

const minimumOf = (s: string | undefined) => (s !== undefined && /^\d{1,4}$/.test(s) ? Number(s) : undefined);

function label(k: 'A' | 'B', p: PickedMinimum): string {
  const at = p.interval ? `, ${p.interval.slice(0, 16).replace('T', ' ')} UT, minimum ${p.index + 1}` : '';
  return `${k}: ${p.view.run.name}${at}`;
}

/** Interval and minimum choices for one side, as fields of the page's GET form. */
function MinimumPicker({ side, p }: { side: 'a' | 'b'; p: PickedMinimum }) {
  const solved = solvedIntervals(p.view.intervals);
  return (
    <div className="flex flex-wrap gap-3">
      <label className="block text-sm font-medium">
        Interval of {side.toUpperCase()} (UT)
        <select name={`${side}i`} defaultValue={p.interval ?? undefined} className={inputClass}>
          <IntervalOptions intervals={solved} />
        </select>
      </label>
      <label className="block text-sm font-medium">
        Minimum of {side.toUpperCase()}
        <select name={`${side}m`} defaultValue={String(p.index)} className={inputClass}>
          {Array.from({ length: Math.max(1, p.minimaCount) }, (_, k) => (
            <option key={k} value={k}>
              {k + 1}
              {k === 0 ? ' (best)' : ''}
            </option>
          ))}
        </select>
      </label>
    </div>
  );
}

/** One section per pick, A beside B, each headed by what it shows. */
function SideBySide({
  cmp,
  what,
  className,
  children,
}: {
  cmp: Comparison;
  what: 'map' | 'fit';
  className: string;
  children: (p: PickedMinimum, k: 'A' | 'B') => ReactNode;
}) {
  return (
    <div className={className} data-testid={`compare-${what}s`}>
      {(['A', 'B'] as const).map((k) => {
        const p = k === 'A' ? cmp.a : cmp.b;
        return (
          <section key={k} aria-label={`${what === 'map' ? 'Map' : 'Fit'} of ${k}`} data-testid={`compare-${what}-${k}`}>
            <h3 className="mb-2 text-sm font-semibold">{label(k, p)}</h3>
            {children(p, k)}
          </section>
        );
      })}
    </div>
  );
}

/** Both chosen minima on maps side by side: one intensity scale, each region in its one colour. */
function Maps({ cmp }: { cmp: Comparison }) {
  return (
    <SideBySide cmp={cmp} what="map" className="grid gap-6 xl:grid-cols-2">
      {(p) => (
        <RunMap
          frame={<RunMapFrame />}
          regions={p.view.grid.regions.map((r) => ({ ...r, colour: cmp.colours[r.name] ?? r.colour }))}
          cellSizeDeg={p.view.grid.cellSizeDeg}
          minimum={p.minimum}
          stations={p.stations}
          logRange={cmp.logRange}
        />
      )}
    </SideBySide>
  );
}

/** Fit quality of each chosen minimum per station and component. */
function Fits({ cmp }: { cmp: Comparison }) {
  return (
    <SideBySide cmp={cmp} what="fit" className="grid gap-6 lg:grid-cols-2">
      {(p, k) =>
        p.fit.length ? (
          <SeriesGoodnessTable rows={p.fit} caption={`Goodness of fit of ${k} per station and component`} />
        ) : (
          <p className="text-sm text-muted">No solved minimum to judge.</p>
        )
      }
    </SideBySide>
  );
}

export default async function ComparePage({
  params,
  searchParams,
}: {
  params: Promise<{ networkId: string }>;
  searchParams: Promise<Query>;
}) {
  const { networkId } = await params;
  const q = await searchParams;
  await pageNetworkAction(networkId, 'network.read');
  const runs = await listRuns(networkId);
  const valid = q.a && q.b && isId(q.a) && isId(q.b);
  const cmp = valid
    ? await loadComparison(
        networkId,
        { runId: q.a!, interval: q.ai, minimum: minimumOf(q.am) },
        { runId: q.b!, interval: q.bi, minimum: minimumOf(q.bm) },
      ).catch(() => null)
    : null;
  return (
    <div className="space-y-6">
      <Panel
        level={1}
        heading="Compare side by side"
        description="Two runs, or two minima of one run (pick the same run twice): settings, parameters and their agreement, and the daily curves."
      >
        {runs.length < 1 ? (
          <EmptyState title="No runs yet">Launch a run first; then compare it with another, or two of its minima.</EmptyState>
        ) : (
          <form method="get" className="space-y-3">
            <div className="flex flex-wrap items-end gap-3">
              {(['a', 'b'] as const).map((k) => (
                <label key={k} className="block text-sm font-medium">
                  Run {k.toUpperCase()}
                  <select
                    name={k}
                    defaultValue={q[k] ?? runs[k === 'a' ? 0 : Math.min(1, runs.length - 1)]?.id}
                    className={inputClass}
                  >
                    {runs.map((r) => (
                      <option key={r.id} value={r.id}>
                        {r.name} ({r.state})
                      </option>
                    ))}
                  </select>
                </label>
              ))}
            </div>
            {cmp ? (
              <div className="flex flex-wrap gap-6">
                <MinimumPicker side="a" p={cmp.a} />
                <MinimumPicker side="b" p={cmp.b} />
              </div>
            ) : null}
            <Button type="submit">Compare</Button>
          </form>
        )}
        {(q.a || q.b) && !cmp ? (
          <Notice tone="error" className="mt-3" title="Cannot compare">
            One of the chosen runs is not in this network.
          </Notice>
        ) : null}
      </Panel>
      {cmp ? (
        <>
          <Panel heading="Settings" description="Rows that differ between the two are shaded.">
            <SettingsDiffTable rows={cmp.settings} labels={[label('A', cmp.a), label('B', cmp.b)]} />
          </Panel>
          <Panel
            heading="Parameters"
            description="Each parameter of the two chosen minima with its 1σ error; σc = √(σA² + σB²) is the combined error of the difference."
          >
            <ParameterTable rows={cmp.parameters} />
          </Panel>
          <Panel
            heading="Maps"
            description="Both chosen minima on one logarithmic intensity scale; a region has the same outline colour on both maps and in the curves below."
          >
            <Maps cmp={cmp} />
          </Panel>
          <Panel
            heading="Fit per station and component"
            description="How well each chosen minimum fits each station’s series: χ², its share of the degrees of freedom, and the probability of a χ² at least that large under the stated errors."
          >
            <Fits cmp={cmp} />
          </Panel>
          <Panel heading="Best minimum of each interval">
            <CompareView
              a={JSON.parse(JSON.stringify(cmp.a.view))}
              b={JSON.parse(JSON.stringify(cmp.b.view))}
              colours={cmp.colours}
            />
          </Panel>
        </>
      ) : null}
      <Caution topic="research" />
    </div>
  );
}
