'use client';
/**
 * The read-only page of a shared run, for the holder of its link: the map,
 * the minima with their errors and the fits of the chosen interval and
 * minimum — nothing to change, launch or download. Data come through the
 * link's own API (`/api/shared/<token>`), which answers for this run only.
 */
import { useMemo, useState, type ReactNode } from 'react';
import { SWRConfig } from 'swr';
import dynamic from 'next/dynamic';
import { Panel } from '@/src/web/ui/Card';
import { Caution, Notice } from '@/src/web/ui/Notice';
import { useApi } from '@/src/web/swr';
import { RunMap } from '@/src/web/runs/RunMap';
import { IntervalPicker } from '@/src/web/runs/IntervalPicker';
import { MinimaTable } from '@/src/web/runs/MinimaTable';
import { FitsPanel, useFits } from '@/src/web/runs/FitsPanel';
import { fitsUrl, intervalUrl, type RunJson } from '@/src/web/runs/types';
import type { IntervalView } from '@/src/runs/results';
import { solvedIntervals } from '@/src/runs/view-select';
import type { RunFits } from '@/src/runs/fits';

const ModeFitsPanel = dynamic(() => import('@/src/web/runs/ModeFitsPanel').then((m) => m.ModeFitsPanel), {
  ssr: false,
  loading: () => <p className="text-sm text-muted">Loading mode fits…</p>,
});

export function sharedApi(token: string): string {
  return `/api/shared/${token}`;
}

interface Props {
  token: string;
  initial: RunJson;
  /** Fits of the opening interval's best minimum, so the first view needs no fetch. */
  fits: { interval: string; data: RunFits } | null;
  map: ReactNode;
  /** Shown below the result (the run's comments). */
  children?: ReactNode;
}

export function SharedRunView({ fits, ...props }: Props) {
  const base = sharedApi(props.token);
  const fallback = useMemo(() => (fits ? { [fitsUrl(base, fits.interval, 0)]: fits.data } : {}), [fits, base]);
  return (
    <SWRConfig value={{ fallback }}>
      <Body {...props} />
    </SWRConfig>
  );
}

function Body({ token, initial, map, children }: Omit<Props, 'fits'>) {
  const base = sharedApi(token);
  const view = initial;
  const solved = solvedIntervals(view.intervals);
  const [pick, setPick] = useState<string | null>(null);
  const interval = solved.find((i) => i.startsAt === pick) ?? solved.at(-1) ?? null;
  const [minimum, setMinimum] = useState(0);
  // A chosen interval that came in brief is fetched whole through the link's API.
  const chosen = useApi<{ interval: IntervalView }>(interval?.brief ? intervalUrl(base, interval.startsAt) : null, {
    revalidateOnFocus: false,
  });
  const error = chosen.error;
  const whole = interval?.brief ? (chosen.data?.interval ?? null) : interval;
  const pending = interval !== null && whole === null;
  const result = whole?.result ?? null;
  const index = Math.min(minimum, (result?.minima.length ?? 1) - 1);
  const m = result?.minima[index] ?? null;
  const fits = useFits(base, interval?.startsAt ?? null, index);
  const modes = view.config.observables.kind === 'modes';

  return (
    <div className="space-y-6">
      {result && m && interval ? (
        <>
          <Panel
            heading="What came out"
            description="The selected minimum of the selected interval. Select another minimum in the table to update the map and the fits."
          >
            <IntervalPicker
              intervals={solved}
              value={interval.startsAt}
              onChange={(startsAt) => {
                setPick(startsAt);
                setMinimum(0);
              }}
            />
            <RunMap
              frame={map}
              regions={view.grid.regions}
              cellSizeDeg={view.grid.cellSizeDeg}
              minimum={m}
              stations={fits.data?.stations ?? []}
            />
            <h3 className="mt-4 mb-1 text-sm font-semibold">Minima</h3>
            <MinimaTable result={result} selected={index} onSelect={setMinimum} />
            <Caution topic="research" className="mt-4" />
          </Panel>
          <Panel
            heading="How good it is"
            description={
              modes
                ? 'Observed and predicted mode frequencies, peak intensities and half-widths at each station and component.'
                : 'Observed and predicted spectra at each station and component, with weighted residuals.'
            }
          >
            {modes ? <ModeFitsPanel fits={fits.data} error={fits.error} /> : <FitsPanel fits={fits.data} error={fits.error} />}
          </Panel>
        </>
      ) : (
        <Panel heading="What came out">
          {error ? (
            <Notice tone="error" title="The chosen interval could not be loaded">
              {error.message}
            </Notice>
          ) : (
            <p className="text-sm text-muted">
              {pending ? 'Loading the chosen interval…' : 'This run has no finished interval yet.'}
            </p>
          )}
        </Panel>
      )}
      {children}
    </div>
  );
}
