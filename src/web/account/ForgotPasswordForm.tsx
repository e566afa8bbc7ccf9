'use client';
import { useState } from 'react';
import { apiSend } from '@/src/web/swr';
import { Button, FormField, Notice, inputClass } from '@/src/web/ui';
import { useApiForm } from './useApiForm';

export function ForgotPasswordForm() {
  const f = useApiForm();
  const [done, setDone] = useState<string | null>(null);
  const submit = f.onSubmit(async (d) => {
    const r = await apiSend<{ message: string }>('POST', '/api/auth/password-reset', { email: d.get('email') });
    setDone(r.message);
  });
  if (done) return <Notice tone="success">{done}</Notice>;
  return (
    <form onSubmit={submit} noValidate className="space-y-4">
      {f.formError(['email']) ? <Notice tone="error">{f.formError(['email'])}</Notice> : null}
      <FormField id="email" label="E-mail address of your account" error={f.fieldError('email')}>
        <input name="email" type="email" autoComplete="username" required className={inputClass} />
      </FormField>
      <Button type="submit" busy={f.busy} className="w-full">
        Send a reset link
      </Button>
    </form>
  );
}
