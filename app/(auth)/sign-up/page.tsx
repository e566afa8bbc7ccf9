import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { getSessionUser } from '@/src/auth/session';
import { getInstanceSettings } from '@/src/auth/settings';
import { SignUpForm } from '@/src/web/account/SignUpForm';
import { Notice } from '@/src/web/ui';

export const metadata: Metadata = { title: 'Create an account' };

export default async function SignUpPage() {
  if (await getSessionUser()) redirect('/networks');
  const settings = await getInstanceSettings();
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-semibold tracking-tight">Create an account</h1>
        <p className="mt-1 text-sm text-muted">Then start a network for your stations, or accept an invitation to one.</p>
      </div>
      {settings.openSignUp ? (
        <SignUpForm />
      ) : (
        <Notice title="Accounts by invitation">
          On this instance new accounts are created from an invitation sent by a network owner. Open the link in your invitation
          e-mail, or{' '}
          <Link href="/sign-in" className="text-accent underline">
            sign in
          </Link>
          .
        </Notice>
      )}
    </div>
  );
}
