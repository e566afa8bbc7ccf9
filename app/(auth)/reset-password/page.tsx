import type { Metadata } from 'next';
import Link from 'next/link';
import { ResetPasswordForm } from '@/src/web/account/ResetPasswordForm';
import { Notice } from '@/src/web/ui';

export const metadata: Metadata = { title: 'Choose a new password' };

export default async function ResetPasswordPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-semibold tracking-tight">Choose a new password</h1>
      {token ? (
        <ResetPasswordForm token={token} />
      ) : (
        <Notice tone="error" title="The reset link is incomplete">
          Open the link from the e-mail exactly as sent, or{' '}
          <Link href="/forgot-password" className="underline">
            ask for a new one
          </Link>
          .
        </Notice>
      )}
    </div>
  );
}
