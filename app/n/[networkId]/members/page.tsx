import type { Metadata } from 'next';
import { pageNetworkAction } from '@/src/auth/pages';
import { can } from '@/src/auth/permissions';
import { membersOverview } from '@/src/auth/networks';
import { PageHeader } from '@/src/web/shell/PageHeader';
import { MembersManager } from '@/src/web/networks/MembersManager';

export const metadata: Metadata = { title: 'Members' };

export default async function MembersPage({ params }: { params: Promise<{ networkId: string }> }) {
  const { networkId } = await params;
  const { user, membership } = await pageNetworkAction(networkId, 'network.read');
  const canManage = can(membership.role, 'members.manage');
  const overview = await membersOverview(networkId, canManage);
  const initial = JSON.parse(JSON.stringify(overview));
  return (
    <>
      <PageHeader
        title="Members"
        subtitle="Owners manage members, stations, push tokens and deletions; analysts upload data and launch runs; viewers read and export."
      />
      <MembersManager networkId={networkId} canManage={canManage} currentUserId={user.id} initial={initial} />
    </>
  );
}
