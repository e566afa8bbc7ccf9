import { cx } from './cx';

interface ProgressBarProps {
  /** 0..1, or null when the amount of work is not yet known. */
  value: number | null;
  /** What the job is doing now, e.g. "Start 12 of 40: minimising". */
  label: string;
  /** Remaining time in seconds, if known. */
  remainingSeconds?: number | null;
  tone?: 'accent' | 'storm';
  className?: string;
}

export function formatDuration(seconds: number): string {
  const s = Math.max(0, Math.round(seconds));
  if (s < 60) return `${s} s`;
  const m = Math.floor(s / 60);
  if (m < 60) return `${m} min ${String(s % 60).padStart(2, '0')} s`;
  return `${Math.floor(m / 60)} h ${String(m % 60).padStart(2, '0')} min`;
}

/** A labelled progress bar with what is happening and how long is left. */
export function ProgressBar({ value, label, remainingSeconds, tone = 'accent', className }: ProgressBarProps) {
  const pct = value == null ? null : Math.round(Math.min(1, Math.max(0, value)) * 100);
  return (
    <div className={cx('space-y-1', className)}>
      <div className="flex items-baseline justify-between gap-3 text-sm">
        <span>{label}</span>
        <span className="num text-muted">
          {pct == null ? 'waiting…' : `${pct} %`}
          {remainingSeconds != null ? ` · about ${formatDuration(remainingSeconds)} left` : ''}
        </span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={pct ?? undefined}
        className="h-2 overflow-hidden rounded-full bg-raised"
      >
        <div
          className={cx(
            'h-full rounded-full transition-[width] duration-500',
            tone === 'storm' ? 'bg-storm' : 'bg-accent',
            pct == null && 'w-1/3 animate-pulse',
          )}
          style={pct == null ? undefined : { width: `${pct}%` }}
        />
      </div>
    </div>
  );
}
