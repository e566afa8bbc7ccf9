import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { getSessionUser } from '@/src/auth/session';
import { getInstanceSettings } from '@/src/auth/settings';
import { SignInForm } from '@/src/web/account/SignInForm';
import { safeNext } from '@/src/web/account/safe-next';
import { Notice } from '@/src/web/ui';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string }> }) {
  const { next } = await searchParams;
  if (await getSessionUser()) redirect(safeNext(next));
  const settings = await getInstanceSettings();
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-semibold tracking-tight">Sign in</h1>
        <p className="mt-1 text-sm text-muted">to your station networks and runs.</p>
      </div>
      {settings.signInNotice ? <Notice>{settings.signInNotice}</Notice> : null}
      <SignInForm next={next} />
    </div>
  );
}
