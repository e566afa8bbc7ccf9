import { cloneElement, isValidElement, type ReactElement, type ReactNode } from 'react';
import { cx } from './cx';

export const inputClass =
  'block w-full rounded-[var(--radius-control)] border border-line-strong bg-surface px-3 py-2 text-sm text-fg ' +
  'placeholder:text-muted/70 focus:border-accent focus:outline-2 focus:outline-offset-0 focus:outline-focus/60 ' +
  'aria-[invalid=true]:border-danger';

interface FormFieldProps {
  /** id of the control; the label, hint and error are tied to it. */
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string | null;
  /** The single input/select/textarea. It receives id, aria-describedby and aria-invalid. */
  children: ReactElement<Record<string, unknown>>;
  className?: string;
}

/** Label + control + hint + error, wired for screen readers. */
export function FormField({ id, label, hint, error, children, className }: FormFieldProps) {
  const hintId = hint ? `${id}-hint` : undefined;
  const errId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errId].filter(Boolean).join(' ') || undefined;
  const control = isValidElement(children)
    ? cloneElement(children, { id, 'aria-describedby': describedBy, 'aria-invalid': error ? true : undefined })
    : children;
  return (
    <div className={cx('space-y-1', className)}>
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      {control}
      {hint ? (
        <p id={hintId} className="text-xs text-muted">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={errId} className="text-xs font-medium text-danger">
          {error}
        </p>
      ) : null}
    </div>
  );
}
