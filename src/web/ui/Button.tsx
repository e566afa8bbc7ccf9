import Link from 'next/link';
import type { AnchorHTMLAttributes, ButtonHTMLAttributes, ReactNode, Ref } from 'react';
import { cx } from './cx';

export type ButtonTone = 'primary' | 'secondary' | 'danger' | 'quiet';
export type ButtonSize = 'sm' | 'md';

const base =
  'inline-flex items-center justify-center gap-1.5 rounded-[var(--radius-control)] font-medium whitespace-nowrap transition-colors ' +
  'disabled:cursor-not-allowed disabled:opacity-55 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-focus';

const tones: Record<ButtonTone, string> = {
  primary: 'bg-accent text-on-accent hover:bg-accent-strong shadow-sm',
  secondary: 'border border-line-strong bg-surface text-fg hover:border-accent hover:text-accent',
  danger: 'border border-danger/40 bg-surface text-danger hover:bg-danger-soft',
  quiet: 'text-muted hover:text-fg hover:bg-raised',
};

const sizes: Record<ButtonSize, string> = {
  sm: 'h-8 px-2.5 text-sm',
  md: 'h-10 px-4 text-sm',
};

export function buttonClass(tone: ButtonTone = 'primary', size: ButtonSize = 'md', extra?: string): string {
  return cx(base, tones[tone], sizes[size], extra);
}

interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  tone?: ButtonTone;
  size?: ButtonSize;
  /** Shows a busy state and disables the button. */
  busy?: boolean;
  ref?: Ref<HTMLButtonElement>;
}

export function Button({ tone = 'primary', size = 'md', busy, className, children, disabled, type, ...rest }: ButtonProps) {
  return (
    <button
      type={type ?? 'button'}
      className={buttonClass(tone, size, className)}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      {...rest}
    >
      {busy ? (
        <span aria-hidden className="size-3 animate-spin rounded-full border-2 border-current border-t-transparent" />
      ) : null}
      {children}
    </button>
  );
}

interface ButtonLinkProps extends AnchorHTMLAttributes<HTMLAnchorElement> {
  href: string;
  tone?: ButtonTone;
  size?: ButtonSize;
  children: ReactNode;
}

/** A link that looks like a button (navigation, not an action). */
export function ButtonLink({ href, tone = 'secondary', size = 'md', className, children, ...rest }: ButtonLinkProps) {
  return (
    <Link href={href} className={buttonClass(tone, size, cx('no-underline', className))} {...rest}>
      {children}
    </Link>
  );
}
