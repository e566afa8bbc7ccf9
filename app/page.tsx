import { redirect } from 'next/navigation';
import Link from 'next/link';
import { getSessionUser } from '@/src/auth/session';
import { Brand } from '@/src/web/shell/Brand';
import { SkipLink } from '@/src/web/shell/SkipLink';
import { ButtonLink, Caution } from '@/src/web/ui';

/** Signed in: straight to the networks. Otherwise a short introduction. */
export default async function Home() {
  if (await getSessionUser()) redirect('/networks');
  return (
    <div className="min-h-dvh bg-canvas text-fg">
      <SkipLink />
      <header className="mx-auto flex max-w-page items-center justify-between px-6 py-5">
        <Brand />
        <nav aria-label="Account" className="flex gap-2">
          <ButtonLink href="/sign-in" tone="quiet" className="text-fg hover:bg-raised">
            Sign in
          </ButtonLink>
          <ButtonLink href="/sign-up" tone="primary">
            Create an account
          </ButtonLink>
        </nav>
      </header>
      <main id="main" className="mx-auto max-w-page px-6 pt-16 pb-20">
        <div className="max-w-2xl space-y-5">
          <p className="text-sm font-medium tracking-wider text-accent uppercase">Schumann-resonance workbench</p>
          <h1 className="text-4xl leading-tight font-semibold tracking-tight sm:text-5xl">
            From quiet ELF records to a map of the world’s thunderstorms.
          </h1>
          <p className="text-lg text-muted">
            Upload station data, turn it into 10-minute spectra and Lorentzian mode fits, set up a cavity model and source
            regions, and invert many stations at once for regional activity — with every estimate carrying its error.
          </p>
          <div className="flex gap-3 pt-2">
            <ButtonLink href="/sign-up" tone="primary">
              Start a network
            </ButtonLink>
            <Link href="/sign-in" className="self-center text-sm text-accent underline-offset-4 hover:underline">
              I have an account
            </Link>
          </div>
        </div>
        <div className="mt-16 max-w-2xl text-fg">
          <Caution topic="research" />
        </div>
      </main>
    </div>
  );
}
