'use client';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { apiSend, ApiError } from '@/src/web/swr';
import { Button, FormField, Notice, inputClass } from '@/src/web/ui';
import { useApiForm } from './useApiForm';

export function SignUpForm() {
  const router = useRouter();
  const f = useApiForm();
  const fields = ['name', 'email', 'password'];
  const submit = f.onSubmit(async (d) => {
    const credentials = { email: d.get('email'), password: d.get('password') };
    // Sign-up answers the same whether or not the address had an account; signing in tells.
    await apiSend('POST', '/api/auth/sign-up', { name: d.get('name'), ...credentials });
    try {
      await apiSend('POST', '/api/auth/sign-in', credentials);
    } catch (e) {
      if (e instanceof ApiError && e.status === 401)
        throw new ApiError(
          409,
          'conflict',
          'This address already has an account, so we e-mailed its owner instead of creating one. Sign in, or reset the password.',
        );
      throw e;
    }
    router.push('/networks');
    router.refresh();
  });
  return (
    <form onSubmit={submit} noValidate className="space-y-4">
      {f.formError(fields) ? <Notice tone="error">{f.formError(fields)}</Notice> : null}
      <FormField id="name" label="Your name" error={f.fieldError('name')}>
        <input name="name" autoComplete="name" required maxLength={120} className={inputClass} />
      </FormField>
      <FormField id="email" label="E-mail address" error={f.fieldError('email')}>
        <input name="email" type="email" autoComplete="email" required className={inputClass} />
      </FormField>
      <FormField
        id="password"
        label="Password"
        hint="At least 10 characters. A few unrelated words work well."
        error={f.fieldError('password')}
      >
        <input name="password" type="password" autoComplete="new-password" required minLength={10} className={inputClass} />
      </FormField>
      <Button type="submit" busy={f.busy} className="w-full">
        Create account
      </Button>
      <p className="text-sm">
        Already have an account?{' '}
        <Link href="/sign-in" className="text-accent underline underline-offset-2">
          Sign in
        </Link>
      </p>
    </form>
  );
}
