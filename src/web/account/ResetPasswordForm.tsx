'use client';
import { useState } from 'react';
import Link from 'next/link';
import { apiSend } from '@/src/web/swr';
import { Button, FormField, Notice, inputClass } from '@/src/web/ui';
import { useApiForm } from './useApiForm';

export function ResetPasswordForm({ token }: { token: string }) {
  const f = useApiForm();
  const [done, setDone] = useState(false);
  const submit = f.onSubmit(async (d) => {
    await apiSend('POST', '/api/auth/password-reset/confirm', { token, password: d.get('password') });
    setDone(true);
  });
  if (done)
    return (
      <Notice tone="success" title="Password changed">
        Every earlier session of this account has been signed out.{' '}
        <Link href="/sign-in" className="text-accent underline">
          Sign in with the new password
        </Link>
        .
      </Notice>
    );
  return (
    <form onSubmit={submit} noValidate className="space-y-4">
      {f.formError(['password']) ? <Notice tone="error">{f.formError(['password'])}</Notice> : null}
      <FormField id="password" label="New password" hint="At least 10 characters." error={f.fieldError('password')}>
        <input name="password" type="password" autoComplete="new-password" required minLength={10} className={inputClass} />
      </FormField>
      <Button type="submit" busy={f.busy} className="w-full">
        Set the new password
      </Button>
    </form>
  );
}
