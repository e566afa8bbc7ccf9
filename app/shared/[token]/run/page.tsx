import { redirect } from 'next/navigation';
import { sharedRunPage } from '@/src/sharing/shared-run';
import { SharedRunView } from '@/src/web/sharing/SharedRunView';
import { RunMapFrame } from '@/src/web/runs/RunMapFrame';
import { openingInterval } from '@/src/runs/view-select';
import { BrandMark } from '@/src/web/shell/Brand';
import { CommentsPanel } from '@/src/web/sharing/CommentsPanel';
import { Panel } from '@/src/web/ui/Card';

export const metadata = { title: 'Shared run', robots: { index: false, follow: false }, referrer: 'no-referrer' as const };

/** The read-only page a shared link opens (no sign-in). A link that no longer stands goes back to its own address, which says why. */
export default async function SharedRunPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const page = await sharedRunPage(token);
  if (page.kind !== 'open') redirect(`/shared/${token}`);
  const { view, fits } = page;
  const open = openingInterval(view.intervals);
  const plain = JSON.parse(JSON.stringify(view)) as typeof view;
  return (
    <main id="main" className="mx-auto max-w-6xl space-y-6 px-4 py-6">
      <header className="space-y-1">
        <p className="flex items-center gap-2 text-sm font-semibold tracking-[0.08em] text-accent uppercase">
          <BrandMark /> Cavitas · shared run
        </p>
        <h1 className="text-2xl font-semibold tracking-tight" data-testid="shared-run-name">
          {view.run.name}
        </h1>
        <p className="text-sm text-muted">
          A read-only view of one run, shared by its network until {page.expiresAt.slice(0, 10)}. Cavity model {view.model.name} v
          {view.model.version}, source grid {view.grid.name} v{view.grid.version},{' '}
          {view.config.observables.kind === 'modes' ? 'mode parameters' : 'spectra'}, {view.run.intervalStarts.length} interval
          {view.run.intervalStarts.length === 1 ? '' : 's'}.
        </p>
      </header>
      <SharedRunView
        token={token}
        initial={plain}
        fits={open && fits ? { interval: open.startsAt, data: JSON.parse(JSON.stringify(fits)) } : null}
        map={<RunMapFrame />}
      >
        <Panel heading="Comments" description="What the network's members have noted about this run (read only).">
          <CommentsPanel url={`/api/shared/${token}/comments`} canWrite={false} />
        </Panel>
      </SharedRunView>
    </main>
  );
}
