import type { ReactNode } from 'react';
import { cx } from './cx';

type Tone = 'info' | 'success' | 'error' | 'storm';

const tones: Record<Tone, string> = {
  info: 'border-accent/40 bg-accent-soft',
  success: 'border-ok/40 bg-accent-soft',
  error: 'border-danger/50 bg-danger-soft',
  storm: 'border-storm/50 bg-storm-soft',
};

interface NoticeProps {
  tone?: Tone;
  title?: ReactNode;
  children?: ReactNode;
  className?: string;
}

/** An inline message. Errors are announced to screen readers (role=alert). */
export function Notice({ tone = 'info', title, children, className }: NoticeProps) {
  return (
    <div
      role={tone === 'error' ? 'alert' : 'status'}
      className={cx('rounded-[var(--radius-control)] border px-3.5 py-2.5 text-sm', tones[tone], className)}
    >
      {title ? <p className="font-semibold">{title}</p> : null}
      {children ? <div className={title ? 'mt-0.5' : ''}>{children}</div> : null}
    </div>
  );
}

type CautionTopic = 'field' | 'research';

const CAUTION_TEXT: Record<CautionTopic, { title: string; body: string }> = {
  field: {
    title: 'Field safety',
    body:
      'Tall antennas and long wires attract lightning: never work on a station while thunderstorms are within earshot, ' +
      'and ground masts properly. Mark buried electrodes and cables before digging. Keep mains power away from sensors ' +
      'and wet ground, use isolating supplies, and follow local electrical codes and licensed practice.',
  },
  research: {
    title: 'Research estimate, not a lightning warning',
    body:
      'Activity estimates here are inferred from Schumann-resonance spectra for research. They are coarse, delayed ' +
      'and uncertain, and must not be used to decide whether it is safe to be outdoors. Use your national weather ' +
      'service for lightning warnings.',
  },
};

/** The standing cautions: `field` where stations are set up, `research` beside activity estimates. */
export function Caution({ topic, className }: { topic: CautionTopic; className?: string }) {
  const { title, body } = CAUTION_TEXT[topic];
  return (
    <aside
      aria-label={title}
      className={cx(
        'flex gap-3 rounded-[var(--radius-control)] border border-storm/50 bg-storm-soft px-3.5 py-2.5 text-sm',
        className,
      )}
    >
      <svg aria-hidden viewBox="0 0 20 20" className="mt-0.5 size-4 shrink-0 text-storm">
        <path d="M11 1 4 11h5l-1 8 7-10h-5z" fill="currentColor" />
      </svg>
      <div>
        <p className="font-semibold">{title}</p>
        <p className="mt-0.5 text-fg/85">{body}</p>
      </div>
    </aside>
  );
}
