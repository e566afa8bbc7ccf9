import type { Metadata } from 'next';
import Link from 'next/link';
import { ForgotPasswordForm } from '@/src/web/account/ForgotPasswordForm';

export const metadata: Metadata = { title: 'Reset your password' };

export default function ForgotPasswordPage() {
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-semibold tracking-tight">Reset your password</h1>
        <p className="mt-1 text-sm text-muted">We e-mail a link that lets you choose a new one. It works once, for one hour.</p>
      </div>
      <ForgotPasswordForm />
      <p className="text-sm">
        <Link href="/sign-in" className="text-accent underline underline-offset-2">
          Back to sign in
        </Link>
      </p>
    </div>
  );
}
