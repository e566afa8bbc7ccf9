import type { ReactNode } from 'react';

interface EmptyStateProps {
  title: string;
  /** What to do next. */
  children?: ReactNode;
  action?: ReactNode;
}

/** What an empty list shows: what is missing and what to do next. */
export function EmptyState({ title, children, action }: EmptyStateProps) {
  return (
    <div className="flex flex-col items-center gap-2 rounded-[var(--radius-card)] border border-dashed border-line-strong px-6 py-10 text-center">
      <svg aria-hidden viewBox="0 0 48 16" className="h-4 w-12 text-accent">
        <path d="M0 8 Q6 0 12 8 T24 8 T36 8 T48 8" fill="none" stroke="currentColor" strokeWidth="1.6" />
      </svg>
      <p className="font-medium">{title}</p>
      {children ? <div className="max-w-md text-sm text-muted">{children}</div> : null}
      {action ? <div className="mt-2">{action}</div> : null}
    </div>
  );
}
