'use client';
import { useState } from 'react';
import { apiSend } from '@/src/web/swr';
import { Button, FormField, Notice, inputClass } from '@/src/web/ui';
import { useApiForm } from './useApiForm';

export function ChangePasswordForm() {
  const f = useApiForm();
  const [ended, setEnded] = useState<number | null>(null);
  const fields = ['currentPassword', 'newPassword'];
  const submit = f.onSubmit(async (d) => {
    const r = await apiSend<{ otherSessionsEnded: number }>('POST', '/api/auth/password', {
      currentPassword: d.get('currentPassword'),
      newPassword: d.get('newPassword'),
    });
    setEnded(r.otherSessionsEnded);
  });
  return (
    <form onSubmit={submit} noValidate className="max-w-md space-y-4">
      {ended !== null ? (
        <Notice tone="success" title="Password changed">
          {ended === 0
            ? 'You stay signed in here; no other session was open.'
            : `You stay signed in here; ${ended} other session${ended === 1 ? ' was' : 's were'} signed out.`}
        </Notice>
      ) : null}
      {f.formError(fields) ? <Notice tone="error">{f.formError(fields)}</Notice> : null}
      <FormField id="currentPassword" label="Current password" error={f.fieldError('currentPassword')}>
        <input name="currentPassword" type="password" autoComplete="current-password" required className={inputClass} />
      </FormField>
      <FormField id="newPassword" label="New password" hint="At least 10 characters." error={f.fieldError('newPassword')}>
        <input name="newPassword" type="password" autoComplete="new-password" required minLength={10} className={inputClass} />
      </FormField>
      <Button type="submit" busy={f.busy}>
        Change password
      </Button>
    </form>
  );
}
