'use client';
import { useRouter } from 'next/navigation';
import { apiSend } from '@/src/web/swr';
import { Button, FormField, Notice, inputClass } from '@/src/web/ui';
import { useApiForm } from './useApiForm';

interface Props {
  token: string;
  email: string;
  /** How to accept: already signed in with the invited address, an existing account, or a new one. */
  mode: 'current' | 'sign-in' | 'sign-up';
}

export function AcceptInvitation({ token, email, mode }: Props) {
  const router = useRouter();
  const f = useApiForm();
  const fields = ['name', 'password'];
  const submit = f.onSubmit(async (d) => {
    const body =
      mode === 'current'
        ? { mode }
        : mode === 'sign-in'
          ? { mode, password: d.get('password') }
          : { mode, name: d.get('name'), password: d.get('password') };
    const r = await apiSend<{ networkId: string }>('POST', `/api/invitations/${encodeURIComponent(token)}/accept`, body);
    router.push(`/n/${r.networkId}`);
    router.refresh();
  });
  return (
    <form onSubmit={submit} noValidate className="space-y-4">
      {f.formError(fields) ? <Notice tone="error">{f.formError(fields)}</Notice> : null}
      {mode !== 'current' ? (
        <FormField id="invited-email" label="E-mail address" hint="The invitation is tied to this address.">
          <input value={email} readOnly className={`${inputClass} bg-raised`} />
        </FormField>
      ) : null}
      {mode === 'sign-up' ? (
        <FormField id="name" label="Your name" error={f.fieldError('name')}>
          <input name="name" autoComplete="name" required maxLength={120} className={inputClass} />
        </FormField>
      ) : null}
      {mode !== 'current' ? (
        <FormField
          id="password"
          label={mode === 'sign-up' ? 'Choose a password' : 'Your password'}
          hint={mode === 'sign-up' ? 'At least 10 characters.' : undefined}
          error={f.fieldError('password')}
        >
          <input
            name="password"
            type="password"
            autoComplete={mode === 'sign-up' ? 'new-password' : 'current-password'}
            required
            className={inputClass}
          />
        </FormField>
      ) : null}
      <Button type="submit" busy={f.busy} className="w-full">
        {mode === 'sign-up' ? 'Create account and join' : mode === 'sign-in' ? 'Sign in and join' : 'Join the network'}
      </Button>
    </form>
  );
}
