import { pageNetworkAction } from '@/src/auth/pages';
import { listRuns } from '@/src/runs/control';
import { getRunSummary, type RunView } from '@/src/runs/results';
import { Button, Caution, EmptyState, Notice, Panel, inputClass } from '@/src/web/ui';
import { CompareView } from '@/src/web/runs/CompareView';
import { isId } from '@/src/server/ids';

export const metadata = { title: 'Compare runs · Cavitas' };

export default async function ComparePage({
  params,
  searchParams,
}: {
  params: Promise<{ networkId: string }>;
  searchParams: Promise<{ a?: string; b?: string }>;
}) {
  const { networkId } = await params;
  const { a, b } = await searchParams;
  await pageNetworkAction(networkId, 'network.read');
  const runs = await listRuns(networkId);
  const load = async (id?: string): Promise<RunView | null> =>
    id && isId(id) ? getRunSummary(networkId, id).catch(() => null) : null;
  const [va, vb] = await Promise.all([load(a), load(b)]);
  return (
    <div className="space-y-6">
      <Panel
        heading="Compare two runs"
        description="Pick two runs of this network to see their settings and results side by side."
      >
        {runs.length < 2 ? (
          <EmptyState title="Fewer than two runs">
            Launch another run to compare, for example with another cavity model or grid.
          </EmptyState>
        ) : (
          <form method="get" className="flex flex-wrap items-end gap-3">
            {(['a', 'b'] as const).map((k) => (
              <label key={k} className="block text-sm font-medium">
                Run {k.toUpperCase()}
                <select name={k} defaultValue={(k === 'a' ? a : b) ?? runs[k === 'a' ? 0 : 1]?.id} className={inputClass}>
                  {runs.map((r) => (
                    <option key={r.id} value={r.id}>
                      {r.name} ({r.state})
                    </option>
                  ))}
                </select>
              </label>
            ))}
            <Button type="submit">Compare</Button>
          </form>
        )}
        {(a || b) && (!va || !vb) ? (
          <Notice tone="error" className="mt-3" title="Cannot compare">
            One of the chosen runs is not in this network.
          </Notice>
        ) : null}
      </Panel>
      {va && vb ? (
        <Panel heading="Side by side">
          <CompareView a={JSON.parse(JSON.stringify(va))} b={JSON.parse(JSON.stringify(vb))} />
        </Panel>
      ) : null}
      <Caution topic="research" />
    </div>
  );
}
