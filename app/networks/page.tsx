import type { Metadata } from 'next';
import { pageUser } from '@/src/auth/pages';
import { listNetworksForUser } from '@/src/auth/networks';
import { AppShell } from '@/src/web/shell/AppShell';
import { PageHeader } from '@/src/web/shell/PageHeader';
import { Card, DataTable, EmptyState, Notice } from '@/src/web/ui';
import { CreateNetworkForm } from '@/src/web/networks/CreateNetworkForm';

export const metadata: Metadata = { title: 'My networks' };

export default async function NetworksPage({ searchParams }: { searchParams: Promise<{ denied?: string }> }) {
  const user = await pageUser();
  const { denied } = await searchParams;
  const networks = await listNetworksForUser(user.id);
  const rows = networks.map((n) => ({ ...n, url: `/n/${n.id}`, createdAt: n.createdAt.toISOString() }));
  return (
    <AppShell user={user} networks={networks}>
      <PageHeader
        title="My networks"
        subtitle="A network is a shared space for a team’s stations, models and runs. Your role decides what you can change."
      />
      {denied ? (
        <Notice tone="error" className="mb-4">
          Your role does not allow that page.
        </Notice>
      ) : null}
      <div className="space-y-6">
        <DataTable
          caption="Networks you belong to"
          captionHidden
          rows={rows}
          columns={[
            { key: 'name', header: 'Network', hrefKey: 'url' },
            { key: 'role', header: 'Your role' },
            { key: 'memberCount', header: 'Members', numeric: true, digits: 0 },
            { key: 'createdAt', header: 'Created', time: true },
          ]}
          initialSort={{ key: 'name' }}
          empty={
            <EmptyState title="You are not in any network yet">
              Create one below for your stations, or open the invitation link a colleague sent you.
            </EmptyState>
          }
        />
        <div id="new" className="scroll-mt-24">
          <Card title="New network">
            <CreateNetworkForm />
          </Card>
        </div>
      </div>
    </AppShell>
  );
}
