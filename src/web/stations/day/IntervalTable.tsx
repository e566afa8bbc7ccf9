'use client';
/** The day's intervals with their first modes, quality flags and a person's flag; buttons open the spectrum or (un)flag. */
import { Badge, Button, DataTable, EmptyState } from '@/src/web/ui';
import type { Interval, IntervalFilter } from './types';

const KEEP: Record<IntervalFilter, (iv: Interval) => boolean> = {
  all: () => true,
  clean: (iv) => !iv.qualityFlags.length && !iv.flagReason,
  quality: (iv) => iv.qualityFlags.length > 0,
  flagged: (iv) => !!iv.flagReason,
};

export function IntervalTable({
  intervals,
  show,
  caption,
  canFlag,
  onSpectrum,
  onFlag,
}: {
  intervals: Interval[];
  show: IntervalFilter;
  caption: string;
  canFlag: boolean;
  onSpectrum: (id: string) => void;
  onFlag: (iv: Interval) => void;
}) {
  const rows = intervals.filter(KEEP[show]).map((iv) => ({
    id: iv.id,
    startsAt: iv.startsAt,
    rejected: iv.rejectedShare * 100,
    f1: iv.fit?.modes[0]?.frequency,
    q1: iv.fit?.modes[0]?.q,
    f2: iv.fit?.modes[1]?.frequency,
    misfit: iv.fit?.misfit,
    quality: iv.qualityFlags.join(', '),
    flag: iv.flagReason ?? '',
    raw: iv,
  }));
  return (
    <DataTable
      caption={caption}
      rows={rows}
      initialSort={{ key: 'startsAt' }}
      className="max-h-[36rem] overflow-y-auto"
      empty={<EmptyState title="No intervals to show">Pick another day, component or table filter.</EmptyState>}
      columns={[
        { key: 'startsAt', header: 'Start', time: true },
        { key: 'rejected', header: 'Rejected', unit: '%', numeric: true, digits: 1 },
        { key: 'f1', header: 'f₁', unit: 'Hz', numeric: true, digits: 2 },
        { key: 'q1', header: 'Q₁', numeric: true, digits: 1 },
        { key: 'f2', header: 'f₂', unit: 'Hz', numeric: true, digits: 2 },
        { key: 'misfit', header: 'Fit misfit', numeric: true, digits: 1 },
        {
          key: 'quality',
          header: 'Quality',
          render: (r) => (r.quality ? <Badge tone="storm">{String(r.quality)}</Badge> : <Badge tone="ok">clean</Badge>),
        },
        { key: 'flag', header: 'Flag', render: (r) => (r.flag ? <Badge tone="danger">{String(r.flag)}</Badge> : '') },
        {
          key: 'id',
          header: '',
          sortable: false,
          render: (r) => (
            <span className="flex gap-2">
              <Button size="sm" tone="quiet" onClick={() => onSpectrum(String(r.id))}>
                Spectrum
              </Button>
              {canFlag ? (
                <Button size="sm" tone="secondary" onClick={() => onFlag(r.raw as Interval)}>
                  {r.flag ? 'Unflag' : 'Flag'}
                </Button>
              ) : null}
            </span>
          ),
        },
      ]}
    />
  );
}
