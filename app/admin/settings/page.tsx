import type { Metadata } from 'next';
import { pageAdmin } from '@/src/auth/pages';
import { getInstanceSettings } from '@/src/auth/settings';
import { PageHeader } from '@/src/web/shell/PageHeader';
import { Card } from '@/src/web/ui';
import { SettingsForm } from '@/src/web/account/SettingsForm';
import { saveSettingsAction } from './actions';

export const metadata: Metadata = { title: 'Instance settings' };

export default async function SettingsPage() {
  await pageAdmin();
  const settings = await getInstanceSettings();
  return (
    <>
      <PageHeader title="Instance settings" subtitle="Apply to everyone using this Cavitas installation." />
      <Card>
        <SettingsForm initial={settings} action={saveSettingsAction} />
      </Card>
    </>
  );
}
