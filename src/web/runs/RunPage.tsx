'use client';
/**
 * The run page below its settings summary: live progress (SWR polling while
 * the run is queued or running), then the result of the chosen interval and
 * minimum — map, minima table, fits, correlation matrix, misfit surface,
 * multi-start picture — and for interval series the daily curves.
 * Selecting a minimum updates every view.
 *
 * The view it opens on (last solved interval, best minimum, first fitted
 * series) comes drawn from the server (`first`: figures as SVG markup and the
 * fits as SWR fallback), so it needs no fetch and no chart code to be seen;
 * each figure is redrawn live in the browser once the chart code is here.
 */
import { useMemo, useState, type ReactNode } from 'react';
import { SWRConfig } from 'swr';
import { useRouter } from 'next/navigation';
import dynamic from 'next/dynamic';
// Straight from each module, not the ui index: the index also brings the table and tab code.
import { Button, buttonClass } from '@/src/web/ui/Button';
import { ConfirmAction } from '@/src/web/ui/ConfirmAction';
import { Panel } from '@/src/web/ui/Card';
import { Caution, Notice } from '@/src/web/ui/Notice';
import { ProgressBar } from '@/src/web/ui/ProgressBar';
import { apiSend, useApi } from '@/src/web/swr';
import { RunMap } from './RunMap';
import { IntervalPicker } from './IntervalPicker';
import { MinimaTable, parameterBounds } from './MinimaTable';
import { FitsPanel, useFits } from './FitsPanel';
import { CorrelationHeatmap } from './CorrelationHeatmap';
import { SurfacePanel } from './SurfacePanel';
import { StartsPicture } from './StartsPicture';
import { SeriesCurves } from './SeriesCurves';
import { intervalUrl, runApi, type IntervalView, type RunJson } from './types';
import { GoodnessTables } from './GoodnessTables';
import { intervalSeriesGoodness, type GoodnessSource } from '@/src/runs/goodness';
import type { FirstFigures } from './figures/prerender';
import { openingInterval, regionColours, solvedIntervals } from '@/src/runs/view-select';
import type { RunFits } from '@/src/runs/fits';
import { hasEnded, mayCancel, mayDelete, mayPause, mayRerun, mayResume } from '@/src/runs/lifecycle';

/** What the server drew and computed for the first view. */
export interface FirstView {
  figures: FirstFigures;
  fits: { url: string; data: RunFits } | null;
}

/** Fits of a mode-parameter run: its own chunk, fetched only on a mode run's page. */
const ModeFitsPanel = dynamic(() => import('./ModeFitsPanel').then((m) => m.ModeFitsPanel), {
  ssr: false,
  loading: () => <p className="text-sm text-muted">Loading mode fits…</p>,
});

const STATE_WORDS: Record<string, string> = {
  queued: 'Waiting for a worker',
  running: 'Computing',
  paused: 'Paused',
  finished: 'Finished',
  failed: 'Stopped by an error',
  cancelled: 'Cancelled',
};

/** An export download: a plain link, so nothing fetches the file before it is asked for. */
function Download({ href, children }: { href: string; children: ReactNode }) {
  return (
    <a href={href} download className={buttonClass('secondary', 'md', 'no-underline')}>
      {children}
    </a>
  );
}

export function RunPage({ first, ...props }: RunPageProps & { first?: FirstView | null }) {
  const fallback = useMemo(() => (first?.fits ? { [first.fits.url]: first.fits.data } : {}), [first]);
  return (
    <SWRConfig value={{ fallback }}>
      <RunPageBody {...props} first={first ?? null} />
    </SWRConfig>
  );
}

interface RunPageProps {
  networkId: string;
  initial: RunJson;
  canCancel: boolean;
  canLaunch: boolean;
  canDelete: boolean;
  /** The server-drawn map frame (`RunMapFrame`) the selected minimum is drawn into. */
  map: ReactNode;
}

function RunPageBody({
  networkId,
  initial,
  map,
  canCancel,
  canLaunch,
  canDelete,
  first,
}: RunPageProps & { first: FirstView | null }) {
  const router = useRouter();
  const base = runApi(networkId, initial.run.id);
  // Poll while the run is queued or running (a fixed interval switched by the last answer:
  // SWR's function form sees no data until the first fetch).
  const [live, setLive] = useState(!hasEnded(initial.run.state));
  const {
    data,
    mutate,
    error: viewError,
  } = useApi<RunJson>(base, {
    fallbackData: initial,
    // The API and the server send a summary (every interval's best minimum, the last solved one
    // whole); a finished run's is here already, a live run's is fetched again while it runs.
    revalidateOnMount: live,
    refreshInterval: live ? 1500 : 0,
    onSuccess: (d) => setLive(!hasEnded(d.run.state)),
  });
  const view = data ?? initial;
  const { run } = view;
  const solved = solvedIntervals(view.intervals);
  const [intervalPick, setIntervalPick] = useState<string | null>(null);
  const interval = solved.find((i) => i.startsAt === intervalPick) ?? solved.at(-1) ?? null;
  const [minimum, setMinimum] = useState(0);
  // A chosen interval that came in brief is fetched whole on its own.
  const chosen = useApi<{ interval: IntervalView }>(interval?.brief ? intervalUrl(base, interval.startsAt) : null);
  const whole = interval?.brief ? (chosen.data?.interval ?? null) : interval;
  const pending = interval !== null && whole === null; // chosen, whole result not here yet
  const result = whole?.result ?? null;
  const m = result?.minima[Math.min(minimum, result.minima.length - 1)] ?? null;
  const fits = useFits(base, interval?.startsAt ?? null, Math.min(minimum, (result?.minima.length ?? 1) - 1));
  function pickInterval(startsAt: string) {
    setIntervalPick(startsAt);
    setMinimum(0);
  }
  const [actionError, setActionError] = useState<string | null>(null);
  // The server's drawings stand only for the selection they were drawn for.
  const opening = useMemo(() => openingInterval(initial.intervals)?.startsAt ?? null, [initial]);
  const drawn = first && interval?.startsAt === opening && minimum === 0 ? first.figures : null;
  const colours = useMemo(() => regionColours(view.grid.regions), [view.grid.regions]);

  const p = run.progress;
  const fraction = p.intervalsTotal
    ? (p.intervalsDone + (run.state === 'running' && p.startsTotal ? p.startsDone / p.startsTotal : 0)) / p.intervalsTotal
    : null;

  async function act(path: string, method: 'POST' | 'DELETE' = 'POST', body?: unknown) {
    setActionError(null);
    try {
      await apiSend(method, path, body);
      if (method === 'DELETE') router.push(`/n/${networkId}/runs`);
      else {
        setLive(true);
        await mutate();
      }
    } catch (e) {
      setActionError((e as Error).message);
    }
  }

  return (
    <div className="space-y-6">
      <Panel
        heading="How it went"
        actions={
          <>
            {(mayPause(run.state) || mayResume(run.state)) && !run.cancelRequested && canCancel ? (
              <Button
                type="button"
                tone="secondary"
                onClick={() => act(`${base}/pause`, 'POST', { paused: !mayResume(run.state) })}
              >
                {mayResume(run.state) ? 'Resume' : 'Pause'}
              </Button>
            ) : null}
            {mayCancel(run.state) && canCancel ? (
              <Button type="button" tone="secondary" onClick={() => act(`${base}/cancel`)} disabled={run.cancelRequested}>
                {run.cancelRequested ? 'Stopping…' : 'Cancel run'}
              </Button>
            ) : null}
            {mayRerun(run.state) && canLaunch ? (
              <Button type="button" tone="primary" onClick={() => act(`${base}/rerun`)}>
                Run the rest again
              </Button>
            ) : null}
            {mayDelete(run.state) && canDelete ? (
              <ConfirmAction
                label="Delete run"
                loss="The run goes with every interval's result, fit and misfit surface it stored. Its settings can be launched again."
                confirmLabel="Delete run and results"
                onConfirm={() => act(base, 'DELETE')}
              />
            ) : null}
          </>
        }
      >
        <p className="mb-2 text-sm">
          <span className="font-semibold" data-testid="run-state">
            {STATE_WORDS[run.state]}
          </span>{' '}
          · {p.intervalsDone} of {p.intervalsTotal} intervals · attempt {run.attempts || 0}
          {hasEnded(run.state) ? null : (
            <span data-testid="run-workers"> · {run.workers === 1 ? '1 worker' : `${run.workers} workers`} on it now</span>
          )}
        </p>
        <ProgressBar
          value={run.state === 'finished' ? 1 : fraction}
          label={p.phase}
          remainingSeconds={!hasEnded(run.state) ? p.etaSeconds : null}
        />
        {run.state === 'failed' ? (
          <Notice tone="error" className="mt-3" title="The run stopped">
            {run.error} Finished intervals are kept; fix the cause and run the rest again.
          </Notice>
        ) : null}
        {actionError ? (
          <Notice tone="error" className="mt-3" title="That did not work">
            {actionError}
          </Notice>
        ) : null}
      </Panel>

      {result && m && interval ? (
        <>
          <Panel
            heading="What came out"
            description="The selected minimum of the selected interval. Select another minimum in the table to update every figure."
            actions={
              <>
                <Download href={`${base}/export?format=csv&what=minima`}>Minima (CSV)</Download>
                <Download href={`${base}/export?format=json&what=minima`}>Minima (JSON)</Download>
                {solved.length > 1 ? <Download href={`${base}/export?format=csv&what=series`}>Series (CSV)</Download> : null}
                <Download href={`${base}/export?what=case&interval=${encodeURIComponent(interval.startsAt)}`}>
                  Case file (JSON)
                </Download>
              </>
            }
          >
            <IntervalPicker intervals={solved} value={interval.startsAt} onChange={pickInterval} />
            <RunMap
              frame={map}
              regions={view.grid.regions}
              cellSizeDeg={view.grid.cellSizeDeg}
              minimum={m}
              stations={fits.data?.stations ?? []}
            />
            <h3 className="mt-4 mb-1 text-sm font-semibold">Minima</h3>
            <MinimaTable
              result={result}
              selected={minimum}
              onSelect={setMinimum}
              bounds={parameterBounds(view.config, view.grid.regions)}
            />
            <p className="mt-1 text-xs text-muted">
              Estimates ± one standard error, the error to two significant digits. An estimate held on a bound of its range is
              marked “at lower/upper bound” (no symmetric error there); ◂ marks an error bar that reaches past a bound.
            </p>
            <Caution topic="research" className="mt-4" />
          </Panel>
          <Panel
            heading="How good it is"
            description={
              view.config.observables.kind === 'modes'
                ? 'Observed and predicted mode frequencies, peak intensities and half-widths at each station and component, with weighted residuals.'
                : 'Observed and predicted spectra at each station and component, with weighted residuals.'
            }
          >
            <GoodnessTables
              goodness={view.goodness}
              selected={whole ? intervalSeriesGoodness(whole as unknown as GoodnessSource) : []}
              selectedStartsAt={interval.startsAt}
            />
            <h3 className="mt-6 mb-2 text-sm font-semibold">Fits at each station</h3>
            {view.config.observables.kind === 'modes' ? (
              <ModeFitsPanel fits={fits.data} error={fits.error} />
            ) : (
              <FitsPanel fits={fits.data} error={fits.error} prerendered={drawn} />
            )}
          </Panel>
          <Panel
            heading="How sure we are"
            description="Trade-offs between parameters, the misfit around the minimum, and where the starts ended."
          >
            <div className="grid gap-6 lg:grid-cols-2">
              <CorrelationHeatmap minimum={m} prerendered={drawn?.correlation} />
              <StartsPicture result={result} selected={minimum} prerendered={drawn?.starts} />
            </div>
            <h3 className="mt-6 mb-2 text-sm font-semibold">Misfit surface</h3>
            <SurfacePanel
              base={base}
              interval={interval.startsAt}
              minimum={minimum}
              paramNames={result.paramNames}
              canRequest={canLaunch}
            />
          </Panel>
          {solved.length > 1 ? (
            <Panel heading="Through the day">
              <SeriesCurves
                intervals={view.intervals}
                colours={colours}
                goodness={view.goodness}
                prerendered={view === initial ? first?.figures.series : null}
              />
            </Panel>
          ) : null}
        </>
      ) : (
        <Panel heading="What came out">
          <p className="text-sm text-muted">
            {pending
              ? (chosen.error ?? viewError)
                ? `The chosen interval could not be loaded: ${(chosen.error ?? viewError)!.message}`
                : 'Loading the chosen interval…'
              : !hasEnded(run.state)
                ? 'Results appear here as soon as the first interval is finished.'
                : 'This run has no finished interval with data.'}
          </p>
        </Panel>
      )}
    </div>
  );
}
