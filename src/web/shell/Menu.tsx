'use client';
/**
 * A small disclosure menu on <details>: opens with Enter/Space, closes on
 * Escape (focus back to the button) or a click outside.
 */
import { useEffect, useRef, type ReactNode } from 'react';
import { cx } from '@/src/web/ui/cx';

export function Menu({
  label,
  summary,
  children,
  align = 'left',
  className,
}: {
  label: string;
  summary: ReactNode;
  children: ReactNode;
  align?: 'left' | 'right';
  className?: string;
}) {
  const ref = useRef<HTMLDetailsElement>(null);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const onDoc = (e: MouseEvent) => {
      if (el.open && !el.contains(e.target as Node)) el.open = false;
    };
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape' && el.open) {
        el.open = false;
        el.querySelector('summary')?.focus();
      }
    };
    document.addEventListener('click', onDoc);
    el.addEventListener('keydown', onKey);
    return () => {
      document.removeEventListener('click', onDoc);
      el.removeEventListener('keydown', onKey);
    };
  }, []);
  return (
    <details ref={ref} className={cx('group relative', className)}>
      <summary className="flex cursor-pointer list-none items-center gap-1.5 rounded-md px-2 py-1.5 text-sm text-chrome-fg hover:bg-raised [&::-webkit-details-marker]:hidden">
        {summary}
        {/* Named by its visible text plus this hint: a name that repeats what is shown (WCAG 2.5.3). */}
        <span className="sr-only">{label}</span>
        <svg aria-hidden viewBox="0 0 12 12" className="size-3 text-chrome-muted transition-transform group-open:rotate-180">
          <path d="M2.5 4.5 6 8l3.5-3.5" fill="none" stroke="currentColor" strokeWidth="1.5" />
        </svg>
      </summary>
      <div
        className={cx(
          'absolute z-40 mt-1 min-w-60 rounded-[var(--radius-card)] border border-line bg-surface p-1.5 text-fg shadow-lg',
          align === 'right' ? 'right-0' : 'left-0',
        )}
      >
        {children}
      </div>
    </details>
  );
}

export function MenuLink({ href, children, current }: { href: string; children: ReactNode; current?: boolean }) {
  return (
    <a
      href={href}
      aria-current={current ? 'page' : undefined}
      className={cx(
        'block rounded-md px-2.5 py-1.5 text-sm no-underline hover:bg-raised',
        current && 'bg-accent-soft font-medium',
      )}
    >
      {children}
    </a>
  );
}
