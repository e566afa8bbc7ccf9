'use client';
import { useActionState } from 'react';
import { Button, FormField, Notice, inputClass } from '@/src/web/ui';

interface Settings {
  openSignUp: boolean;
  signInNotice: string;
}
interface State {
  ok: boolean;
  message: string;
  field?: string;
}

export function SettingsForm({
  initial,
  action,
}: {
  initial: Settings;
  action: (prev: State | null, form: FormData) => Promise<State>;
}) {
  const [state, formAction, pending] = useActionState(action, null);
  return (
    <form action={formAction} className="max-w-xl space-y-5">
      {state ? <Notice tone={state.ok ? 'success' : 'error'}>{state.message}</Notice> : null}
      <div className="flex items-start gap-3">
        <input
          id="openSignUp"
          name="openSignUp"
          type="checkbox"
          defaultChecked={initial.openSignUp}
          className="mt-1 size-4 accent-[var(--c-accent)]"
        />
        <label htmlFor="openSignUp" className="text-sm">
          <span className="font-medium">Anyone may create an account</span>
          <span className="block text-muted">When off, new accounts are only made by accepting an invitation.</span>
        </label>
      </div>
      <FormField
        id="signInNotice"
        label="Notice on the sign-in page"
        hint="Optional, up to 500 characters — e.g. planned maintenance."
        error={state?.field === 'signInNotice' ? state.message : null}
      >
        <textarea name="signInNotice" rows={3} defaultValue={initial.signInNotice} maxLength={500} className={inputClass} />
      </FormField>
      <Button type="submit" busy={pending}>
        Save settings
      </Button>
    </form>
  );
}
