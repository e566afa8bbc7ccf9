'use client';
/**
 * Form state for forms that post to our JSON API: busy flag, the error
 * message, and which field it names (so the field can show it).
 */
import { useState, type FormEvent } from 'react';
import { ApiError } from '@/src/web/swr';

export function useApiForm() {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<ApiError | null>(null);

  function onSubmit(action: (data: FormData) => Promise<void>) {
    return async (e: FormEvent<HTMLFormElement>) => {
      e.preventDefault();
      setBusy(true);
      setError(null);
      try {
        await action(new FormData(e.currentTarget));
      } catch (err) {
        setError(
          err instanceof ApiError
            ? err
            : new ApiError(0, 'client', 'Something went wrong in the browser. Reload the page and try again.'),
        );
      } finally {
        setBusy(false);
      }
    };
  }

  /** The error message for a field, when the API named that field. */
  const fieldError = (name: string) => (error?.field === name ? error.message : null);
  /** The error message when it names no field shown in the form. */
  const formError = (fields: string[]) => (error && !fields.includes(error.field ?? '') ? error.message : null);

  return { busy, error, onSubmit, fieldError, formError };
}

export { safeNext } from './safe-next';
