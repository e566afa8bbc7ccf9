import type { Metadata } from 'next';
import Link from 'next/link';
import { getSessionUser } from '@/src/auth/session';
import { SignOutButton } from '@/src/web/account/SignOutButton';

export const metadata: Metadata = { title: 'Sign out' };

export default async function SignOutPage() {
  const user = await getSessionUser();
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-semibold tracking-tight">Sign out</h1>
      {user ? (
        <>
          <p className="text-sm text-muted">
            You are signed in as <span className="font-medium text-fg">{user.email}</span>. Signing out ends this session on this
            device.
          </p>
          <SignOutButton />
        </>
      ) : (
        <p className="text-sm">
          You are not signed in.{' '}
          <Link href="/sign-in" className="text-accent underline">
            Sign in
          </Link>
        </p>
      )}
    </div>
  );
}
