'use client';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { apiSend } from '@/src/web/swr';
import { Button, FormField, Notice, inputClass } from '@/src/web/ui';
import { useApiForm } from './useApiForm';
import { safeNext } from './safe-next';

export function SignInForm({ next }: { next?: string }) {
  const router = useRouter();
  const f = useApiForm();
  const submit = f.onSubmit(async (d) => {
    await apiSend('POST', '/api/auth/sign-in', { email: d.get('email'), password: d.get('password') });
    router.push(safeNext(next));
    router.refresh();
  });
  return (
    <form onSubmit={submit} noValidate className="space-y-4">
      {f.formError(['email', 'password']) ? <Notice tone="error">{f.formError(['email', 'password'])}</Notice> : null}
      <FormField id="email" label="E-mail address" error={f.fieldError('email')}>
        <input name="email" type="email" autoComplete="username" required className={inputClass} />
      </FormField>
      <FormField id="password" label="Password" error={f.fieldError('password')}>
        <input name="password" type="password" autoComplete="current-password" required className={inputClass} />
      </FormField>
      <Button type="submit" busy={f.busy} className="w-full">
        Sign in
      </Button>
      <p className="flex justify-between text-sm">
        <Link href="/forgot-password" className="text-accent underline underline-offset-2">
          Forgot the password?
        </Link>
        <Link href="/sign-up" className="text-accent underline underline-offset-2">
          Create an account
        </Link>
      </p>
    </form>
  );
}
