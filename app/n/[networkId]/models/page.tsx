import { pageNetworkAction } from '@/src/auth/pages';
import { can } from '@/src/auth/permissions';
import { listModels } from '@/src/runs/catalogue';
import { ButtonLink, DataTable, EmptyState, Panel } from '@/src/web/ui';

export const metadata = { title: 'Cavity models · Cavitas' };

export default async function ModelsPage({ params }: { params: Promise<{ networkId: string }> }) {
  const { networkId } = await params;
  const { membership } = await pageNetworkAction(networkId, 'network.read');
  const models = await listModels(networkId);
  const edit = can(membership.role, 'models.edit');
  const rows = models.map((m) => {
    const c = m.config as { model: string; earthRadiusKm: number; heightKm: number };
    return {
      id: m.id,
      name: m.name,
      url: `/n/${networkId}/models/${m.id}`,
      kind: c.model,
      radius: c.earthRadiusKm,
      height: c.heightKm,
      version: m.version,
      createdAt: m.createdAt.toISOString(),
    };
  });
  return (
    <Panel
      level={1}
      heading="Cavity models"
      description="How the Earth–ionosphere cavity propagates ELF waves: the propagation parameter ν(f), Earth radius and effective height. Editing makes a new version; runs keep the version they used."
      actions={
        edit ? (
          <ButtonLink href={`/n/${networkId}/models/new`} tone="primary">
            Describe a model
          </ButtonLink>
        ) : null
      }
    >
      <DataTable
        caption="Cavity models"
        captionHidden
        rows={rows}
        initialSort={{ key: 'name' }}
        empty={
          <EmptyState
            title="No cavity models yet"
            action={
              edit ? (
                <ButtonLink href={`/n/${networkId}/models/new`} tone="primary">
                  Describe a model
                </ButtonLink>
              ) : null
            }
          >
            {edit
              ? 'Start from the Ishaq–Jones or the linear model, or type a table of your own.'
              : 'Analysts and owners describe cavity models.'}
          </EmptyState>
        }
        columns={[
          { key: 'name', header: 'Model', hrefKey: 'url' },
          { key: 'kind', header: 'ν from' },
          { key: 'radius', header: 'Earth radius', unit: 'km', numeric: true, digits: 0 },
          { key: 'height', header: 'Height', unit: 'km', numeric: true, digits: 1 },
          { key: 'version', header: 'Version', numeric: true, digits: 0 },
          { key: 'createdAt', header: 'Saved', time: true },
        ]}
      />
    </Panel>
  );
}
