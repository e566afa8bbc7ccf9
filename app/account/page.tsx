import type { Metadata } from 'next';
import { pageUser } from '@/src/auth/pages';
import { listNetworksForUser } from '@/src/auth/networks';
import { AppShell } from '@/src/web/shell/AppShell';
import { PageHeader } from '@/src/web/shell/PageHeader';
import { Card } from '@/src/web/ui';
import { ChangePasswordForm } from '@/src/web/account/ChangePasswordForm';

export const metadata: Metadata = { title: 'My account' };

export default async function AccountPage() {
  const user = await pageUser();
  const networks = await listNetworksForUser(user.id);
  return (
    <AppShell user={user} networks={networks}>
      <PageHeader title="My account" subtitle={`${user.name} · ${user.email}`} />
      <Card>
        <h2 className="mb-1 text-lg font-semibold">Password</h2>
        <p className="mb-4 text-sm text-muted">
          Changing it signs out every other browser or device where this account is signed in.
        </p>
        <ChangePasswordForm />
      </Card>
    </AppShell>
  );
}
