import type { ReactNode } from 'react';
import { pageNetworkAction } from '@/src/auth/pages';
import { listNetworksForUser } from '@/src/auth/networks';
import { AppShell } from '@/src/web/shell/AppShell';

export default async function NetworkLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ networkId: string }>;
}) {
  const { networkId } = await params;
  const { user, membership } = await pageNetworkAction(networkId, 'network.read');
  const networks = await listNetworksForUser(user.id);
  return (
    <AppShell
      user={user}
      networks={networks}
      current={{ id: membership.networkId, name: membership.networkName, role: membership.role }}
    >
      {children}
    </AppShell>
  );
}
