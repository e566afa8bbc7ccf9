import type { ReactNode } from 'react';
import { cx } from './cx';

type Tone = 'neutral' | 'accent' | 'storm' | 'danger' | 'ok';

const tones: Record<Tone, string> = {
  neutral: 'bg-raised text-muted border-line',
  accent: 'bg-accent-soft text-accent-strong border-accent/30',
  storm: 'bg-storm-soft text-storm-ink border-storm/40',
  danger: 'bg-danger-soft text-danger border-danger/40',
  ok: 'bg-accent-soft text-ok border-ok/40',
};

/** A small status word (state of a run, role of a member …). */
export function Badge({ tone = 'neutral', children, className }: { tone?: Tone; children: ReactNode; className?: string }) {
  return (
    <span className={cx('inline-flex items-center rounded-full border px-2 py-0.5 text-xs font-medium', tones[tone], className)}>
      {children}
    </span>
  );
}
