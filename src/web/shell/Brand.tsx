import Link from 'next/link';

/** The Cavitas mark: a globe inside the cavity shell with a standing wave. */
export function BrandMark({ className = 'size-7' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" aria-hidden className={className}>
      <circle cx="16" cy="16" r="14.5" fill="none" stroke="currentColor" strokeOpacity="0.35" strokeWidth="1.2" />
      <circle cx="16" cy="16" r="9" fill="currentColor" fillOpacity="0.14" stroke="currentColor" strokeWidth="1.2" />
      <path
        d="M3.5 16c2.1-4.4 4.2-4.4 6.3 0s4.2 4.4 6.2 0 4.2-4.4 6.3 0 4.1 4.4 6.2 0"
        fill="none"
        stroke="var(--c-accent)"
        strokeWidth="1.8"
        strokeLinecap="round"
      />
      <circle cx="22.5" cy="10" r="1.6" fill="var(--c-storm)" />
    </svg>
  );
}

export function Brand({ href = '/' }: { href?: string }) {
  return (
    <Link href={href} className="flex items-center gap-2 rounded-md text-chrome-fg no-underline">
      <BrandMark />
      <span className="text-[0.95rem] font-semibold tracking-[0.08em] uppercase max-sm:sr-only">Cavitas</span>
    </Link>
  );
}
