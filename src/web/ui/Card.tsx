import type { ReactNode } from 'react';
import { cx } from './cx';

interface CardProps {
  title?: ReactNode;
  description?: ReactNode;
  /** Buttons or links shown at the right of the title row. */
  actions?: ReactNode;
  children?: ReactNode;
  className?: string;
  /** Remove inner padding (e.g. for a full-bleed table or map). */
  flush?: boolean;
}

/** A bordered surface with an optional title row. */
export function Card({ title, description, actions, children, className, flush }: CardProps) {
  return (
    <div
      className={cx('rounded-[var(--radius-card)] border border-line bg-surface shadow-[0_1px_2px_rgb(8_12_29/0.06)]', className)}
    >
      {title || actions ? (
        <div className="flex flex-wrap items-start justify-between gap-3 border-b border-line px-4 py-3">
          <div className="min-w-0">
            {title ? <h3 className="text-sm font-semibold tracking-tight">{title}</h3> : null}
            {description ? <p className="mt-0.5 text-sm text-muted">{description}</p> : null}
          </div>
          {actions ? <div className="flex shrink-0 items-center gap-2">{actions}</div> : null}
        </div>
      ) : null}
      <div className={flush ? '' : 'p-4'}>{children}</div>
    </div>
  );
}

interface PanelProps {
  /** Heading text; also the accessible name of the region. */
  heading: string;
  id?: string;
  description?: ReactNode;
  actions?: ReactNode;
  children?: ReactNode;
  className?: string;
  /** 1 for the page's own title (one per page), 2 (default) for its sections. */
  level?: 1 | 2;
}

/** A titled page section (a landmark region) — the building block of detail pages. */
export function Panel({ heading, id, description, actions, children, className, level = 2 }: PanelProps) {
  const Heading = level === 1 ? 'h1' : 'h2';
  const hid = `${id ?? heading.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-heading`;
  return (
    <section aria-labelledby={hid} className={cx('space-y-3', className)}>
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <Heading
            id={hid}
            className={level === 1 ? 'text-xl font-semibold tracking-tight' : 'text-base font-semibold tracking-tight'}
          >
            {heading}
          </Heading>
          {description ? <p className="mt-0.5 max-w-prose text-sm text-muted">{description}</p> : null}
        </div>
        {actions ? <div className="flex items-center gap-2">{actions}</div> : null}
      </div>
      {children}
    </section>
  );
}
