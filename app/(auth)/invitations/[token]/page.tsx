import type { Metadata } from 'next';
import Link from 'next/link';
import { getSessionUser } from '@/src/auth/session';
import { viewInvitation } from '@/src/auth/networks';
import { ROLE_LABEL, ROLE_SUMMARY } from '@/src/auth/permissions';
import { AppError } from '@/src/server/errors';
import { AcceptInvitation } from '@/src/web/account/AcceptInvitation';
import { Notice, formatUtc } from '@/src/web/ui';

export const metadata: Metadata = { title: 'Invitation' };

/** Holding the token is the permission to see the invitation; accepting goes through the API. */
export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  let inv;
  try {
    inv = await viewInvitation(token);
  } catch (e) {
    if (e instanceof AppError) {
      return (
        <div className="space-y-6">
          <h1 className="text-2xl font-semibold tracking-tight">Invitation</h1>
          <Notice tone="error">{e.message}</Notice>
          <Link href="/sign-in" className="text-sm text-accent underline underline-offset-2">
            Go to sign in
          </Link>
        </div>
      );
    }
    throw e;
  }
  const user = await getSessionUser();
  const mismatch = user && user.email !== inv.email;
  return (
    <div className="space-y-6">
      <div>
        <p className="text-xs font-medium tracking-wider text-accent uppercase">Invitation</p>
        <h1 className="mt-1 text-2xl font-semibold tracking-tight">Join {inv.networkName}</h1>
        <p className="mt-2 text-sm text-muted">
          as <span className="font-medium text-fg">{ROLE_LABEL[inv.role].toLowerCase()}</span>: {ROLE_SUMMARY[inv.role]}
        </p>
        <p className="mt-1 text-xs text-muted">
          For {inv.email} · valid until {formatUtc(inv.expiresAt)}
        </p>
      </div>
      {mismatch ? (
        <Notice tone="error" title="Signed in with another address">
          This invitation was sent to {inv.email}, but you are signed in as {user.email}.{' '}
          <Link href="/sign-out" className="underline">
            Sign out
          </Link>{' '}
          and open the link again.
        </Notice>
      ) : (
        <AcceptInvitation token={token} email={inv.email} mode={user ? 'current' : inv.hasAccount ? 'sign-in' : 'sign-up'} />
      )}
    </div>
  );
}
