import { notFound } from 'next/navigation';
import { pageNetworkAction } from '@/src/auth/pages';
import { can } from '@/src/auth/permissions';
import { listGridVersions } from '@/src/runs/catalogue';
import { regionSchema } from '@/src/runs/grid-spec';
import { ButtonLink, Panel } from '@/src/web/ui';
import { GridPreview } from '@/src/web/grids/GridPreview';
import { isId } from '@/src/server/ids';

export const metadata = { title: 'Source grid · Cavitas' };

export default async function GridPage({ params }: { params: Promise<{ networkId: string; gridId: string }> }) {
  const { networkId, gridId } = await params;
  const { membership } = await pageNetworkAction(networkId, 'network.read');
  if (!isId(gridId)) notFound();
  const versions = await listGridVersions(networkId, gridId);
  const grid = versions.find((v) => v.id === gridId);
  if (!grid) notFound();
  return (
    <div className="space-y-6">
      <Panel
        level={1}
        heading={`${grid.name} · version ${grid.version}`}
        description={`${grid.cellSizeDeg}° cells, ${grid.regions.length} regions.${grid.notes ? ` ${grid.notes}` : ''}`}
        actions={
          can(membership.role, 'grids.edit') ? (
            <ButtonLink href={`/n/${networkId}/grids/${grid.id}/edit`} tone="primary">
              Edit as a new version
            </ButtonLink>
          ) : null
        }
      >
        <GridPreview cellSizeDeg={grid.cellSizeDeg} regions={grid.regions.map((r) => regionSchema.parse(r))} />
      </Panel>
      <Panel heading="Versions">
        <ul className="text-sm">
          {versions.map((v) => (
            <li key={v.id}>
              <a className="text-accent underline underline-offset-2" href={`/n/${networkId}/grids/${v.id}`}>
                v{v.version}
              </a>{' '}
              · saved {v.createdAt.toISOString().slice(0, 16).replace('T', ' ')} UT{v.id === grid.id ? ' (shown)' : ''}
            </li>
          ))}
        </ul>
      </Panel>
    </div>
  );
}
