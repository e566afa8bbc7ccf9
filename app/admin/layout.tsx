import type { ReactNode } from 'react';
import { pageAdmin } from '@/src/auth/pages';
import { listNetworksForUser } from '@/src/auth/networks';
import { AppShell } from '@/src/web/shell/AppShell';

/** Site administration: only administrators (others get a 404 page). */
export default async function AdminLayout({ children }: { children: ReactNode }) {
  const user = await pageAdmin();
  const networks = await listNetworksForUser(user.id);
  return (
    <AppShell
      user={user}
      networks={networks}
      navLabel="Administration"
      nav={[
        { href: '/admin/mail', label: 'Outgoing mail' },
        { href: '/admin/settings', label: 'Instance settings' },
      ]}
    >
      {children}
    </AppShell>
  );
}
