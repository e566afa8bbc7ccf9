'use client';
/**
 * One station, one component, one UTC day: spectrogram (interval × frequency),
 * mode frequency / Q / intensity over time, the intervals table with quality
 * flags and flagging, and the spectrum of a chosen interval with its fit.
 * The pieces live in ./day/; this component holds the choices and the data.
 */
import { useMemo, useState } from 'react';
import { EmptyState, Notice } from '@/src/web/ui';
import { apiSend, ApiError, useApi } from '@/src/web/swr';
import { DayPicker, type DayChoice } from './day/DayPicker';
import { Spectrogram } from './day/Spectrogram';
import { ModeTrends } from './day/ModeTrends';
import { SpectrumWithFit } from './day/SpectrumWithFit';
import { FlagForm } from './day/FlagForm';
import { IntervalTable } from './day/IntervalTable';
import type { Interval, Spectrum } from './day/types';

export function DayView({
  networkId,
  stationId,
  components,
  days,
  canFlag,
}: {
  networkId: string;
  stationId: string;
  components: string[];
  days: string[];
  canFlag: boolean;
}) {
  const [choice, setChoice] = useState<DayChoice>({ day: days[0] ?? '', component: components[0] ?? 'Ez', show: 'all' });
  const { day, component, show } = choice;
  const [chosen, setChosen] = useState<string | null>(null);
  const [flagging, setFlagging] = useState<Interval | null>(null);
  const [flagError, setFlagError] = useState<string | null>(null);
  const q = `station=${stationId}&day=${day}&component=${component}&flagged=include`;
  const base = `/api/networks/${networkId}`;
  const list = useApi<{ intervals: Interval[] }>(day ? `${base}/intervals?${q}` : null);
  const spec = useApi<{ spectra: Spectrum[] }>(day ? `${base}/intervals/spectra?${q}&minHz=3&maxHz=45` : null);
  const dayStart = Date.parse(`${day}T00:00:00Z`);
  const intervals = useMemo(() => list.data?.intervals ?? [], [list.data]);
  const spectra = useMemo(() => spec.data?.spectra ?? [], [spec.data]);

  async function setFlag(id: string, body: { flagged: true; reason: string } | { flagged: false }) {
    setFlagError(null);
    try {
      await apiSend('PATCH', `${base}/intervals/${id}`, body);
      setFlagging(null);
      await list.mutate();
    } catch (e) {
      setFlagError(e instanceof ApiError ? e.message : String(e));
    }
  }

  if (!days.length) {
    return (
      <EmptyState title="No intervals yet">
        Upload a station file or set up a push token; processed intervals appear here by UTC day.
      </EmptyState>
    );
  }
  const selected = intervals.find((i) => i.id === chosen) ?? null;
  const selectedSpectrum = spectra.find((s) => s.intervalId === chosen) ?? null;

  return (
    <div className="space-y-6">
      <DayPicker
        days={days}
        components={components}
        choice={choice}
        onChange={(change) => {
          setChoice({ ...choice, ...change });
          if (change.day || change.component) setChosen(null); // the chosen interval belongs to the old day or component
        }}
      />
      {list.error ? <Notice tone="error">{String(list.error.message)}</Notice> : null}
      <Spectrogram spectra={spectra} component={component} day={day} dayStart={dayStart} loading={spec.isLoading} />
      <ModeTrends intervals={intervals} component={component} dayStart={dayStart} />
      {selected && selectedSpectrum ? (
        <>
          <SpectrumWithFit interval={selected} spectrum={selectedSpectrum} component={component} />
          <p className="text-sm">
            <a href={`${base}/intervals/${selected.id}/spectrum`} download className="text-accent underline underline-offset-2">
              Download this spectrum (CSV, SI units)
            </a>
          </p>
        </>
      ) : null}
      {flagging ? (
        <FlagForm
          key={flagging.id}
          start={flagging.startsAt}
          error={flagError}
          onFlag={(reason) => void setFlag(flagging.id, { flagged: true, reason })}
          onCancel={() => {
            setFlagging(null);
            setFlagError(null);
          }}
        />
      ) : flagError ? (
        <Notice tone="error">{flagError}</Notice>
      ) : null}
      <IntervalTable
        intervals={intervals}
        show={show}
        caption={`Intervals, ${component}, ${day}`}
        canFlag={canFlag}
        onSpectrum={setChosen}
        onFlag={(iv) => (iv.flagReason ? void setFlag(iv.id, { flagged: false }) : setFlagging(iv))}
      />
    </div>
  );
}
