import Link from 'next/link';
import type { DemoGuide as Guide } from '@/src/ops/seed/guide';
import { Card } from '@/src/web/ui';

const linkClass = 'font-medium text-accent underline underline-offset-2';

/** The demo network's introduction on its overview: what it is, what is finished, where to start. */
export function DemoGuide({ guide, networkId }: { guide: Guide; networkId: string }) {
  const base = `/n/${networkId}`;
  const [first, ...others] = guide.finishedRuns;
  const runLink = (r: { id: string; name: string }) => (
    <Link key={r.id} href={`${base}/runs/${r.id}`} className={linkClass}>
      {r.name}
    </Link>
  );
  return (
    <Card title="About this demo" className="mb-6">
      <div className="max-w-prose space-y-2 text-sm">
        <p>
          This network is an invented scenario, not a real observatory: {guide.stationCount} stations at made-up sites around the
          globe and one synthetic day of their recordings ({guide.day}), computed by Cavitas&apos;s own forward model from three
          invented thunderstorm centres in the tropics whose activity rises and falls over the day.
        </p>
        <p>
          Already finished: every station&apos;s 10-minute intervals of that day are processed into spectra with Lorentzian mode
          fits
          {guide.finishedRuns.length ? (
            <>
              , and {guide.finishedRuns.length === 1 ? 'the inversion' : 'the inversions'}{' '}
              {guide.finishedRuns.map((r, i) => (
                <span key={r.id}>
                  {i ? ' and ' : ''}
                  {runLink(r)}
                </span>
              ))}{' '}
              {guide.finishedRuns.length === 1 ? 'has' : 'have'} run to the end
            </>
          ) : null}
          .
        </p>
        {first || guide.station ? (
          <p>
            Where to click first:{' '}
            {first ? (
              <>
                open {runLink(first)}: its map shows where the activity was found and how sure the fit is.{' '}
                {others.length ? 'The other run infers the same from the fitted modes alone. ' : null}
              </>
            ) : null}
            {guide.station ? (
              <>
                Then open station{' '}
                <Link href={`${base}/stations/${guide.station.id}`} className={linkClass}>
                  {guide.station.name} ({guide.station.code})
                </Link>{' '}
                to see one interval&apos;s spectrum and its fitted modes, or start a run of your own under{' '}
                <Link href={`${base}/runs`} className={linkClass}>
                  Runs
                </Link>
                .
              </>
            ) : null}
          </p>
        ) : null}
      </div>
    </Card>
  );
}
