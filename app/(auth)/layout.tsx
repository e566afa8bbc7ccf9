import type { ReactNode } from 'react';
import { Brand } from '@/src/web/shell/Brand';
import { SkipLink } from '@/src/web/shell/SkipLink';

/**
 * Sign-in, sign-up and password pages: one card on the chart-paper canvas,
 * the brand above it and a plain line about what Cavitas is below it.
 */
export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="chart-paper flex min-h-dvh flex-col items-center px-4 py-10">
      <SkipLink />
      <header className="mb-6 w-full max-w-sm">
        <Brand />
      </header>
      <main
        id="main"
        tabIndex={-1}
        className="w-full max-w-sm rounded-[var(--radius-card)] border border-line-strong bg-surface p-6 focus:outline-none"
      >
        {children}
      </main>
      <footer className="mt-6 w-full max-w-sm text-xs text-muted">
        Cavitas infers regional thunderstorm activity from Schumann-resonance spectra of ELF stations. Research software, not a
        lightning warning · times in UTC.
      </footer>
    </div>
  );
}
