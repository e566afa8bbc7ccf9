import type { ReactNode } from 'react';
import { Brand } from '@/src/web/shell/Brand';
import { SkipLink } from '@/src/web/shell/SkipLink';

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="grid min-h-dvh lg:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
      <SkipLink />
      <header className="relative hidden overflow-hidden bg-chrome p-10 text-chrome-fg lg:flex lg:flex-col lg:justify-between">
        <Brand />
        <div className="relative z-10 max-w-md space-y-3">
          <p className="text-2xl leading-snug font-semibold">
            Listen to the whole planet’s thunderstorms from a handful of quiet valleys.
          </p>
          <p className="text-sm text-chrome-muted">
            Cavitas turns ELF station records into spectra and mode fits, and inverts many stations together for regional
            thunderstorm intensity in the Earth–ionosphere cavity.
          </p>
        </div>
        <svg aria-hidden viewBox="0 0 400 120" className="absolute right-0 bottom-24 left-0 w-full opacity-70">
          {[0, 1, 2].map((k) => (
            <path
              key={k}
              d={`M0 ${60 + k * 6} C 50 ${10 + k * 10}, 83 ${10 + k * 10}, 133 ${60 + k * 6} S 216 ${110 - k * 10}, 266 ${60 + k * 6} S 350 ${10 + k * 10}, 400 ${60 + k * 6}`}
              fill="none"
              stroke={k === 0 ? 'var(--color-signal-300)' : 'var(--color-ink-400)'}
              strokeWidth={k === 0 ? 2 : 1}
              strokeOpacity={k === 0 ? 1 : 0.5}
            />
          ))}
          <circle cx="302" cy="34" r="4" fill="var(--color-storm-300)" />
        </svg>
        <p className="relative z-10 text-xs text-chrome-muted">Research software · times in UTC</p>
      </header>
      <main id="main" tabIndex={-1} className="flex items-center justify-center px-4 py-10 focus:outline-none">
        <div className="w-full max-w-sm">
          <div className="mb-8 rounded-md bg-chrome p-3 lg:hidden">
            <Brand />
          </div>
          {children}
        </div>
      </main>
    </div>
  );
}
