'use client';
/**
 * Our confirmation for actions that lose stored work ("ask in place, name the
 * loss, keep by default"): the first press opens a short statement beside the
 * button of exactly what will be lost, with two answers. "Keep" comes first and
 * takes the focus, so Enter or Escape keeps everything; only the second,
 * explicitly worded button acts. Nothing to type, no browser dialog.
 */
import { useEffect, useId, useRef, useState, type ReactNode } from 'react';
import { Button, type ButtonSize } from './Button';

interface ConfirmActionProps {
  /** The first button's words, e.g. "Remove station". */
  label: string;
  /** What will be lost, in a sentence or two. */
  loss: ReactNode;
  /** The acting button's words, e.g. "Remove KESTREL-2 and its data". */
  confirmLabel: string;
  /** Runs on the second press; the component shows it busy until it settles. */
  onConfirm: () => Promise<unknown> | void;
  size?: ButtonSize;
  disabled?: boolean;
}

export function ConfirmAction({ label, loss, confirmLabel, onConfirm, size = 'md', disabled }: ConfirmActionProps) {
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState(false);
  const keep = useRef<HTMLButtonElement>(null);
  const opener = useRef<HTMLButtonElement>(null);
  const id = useId();

  useEffect(() => {
    if (open) keep.current?.focus();
  }, [open]);

  const close = () => {
    setOpen(false);
    queueMicrotask(() => opener.current?.focus());
  };

  if (!open) {
    return (
      <Button
        ref={opener}
        tone="danger"
        size={size}
        disabled={disabled}
        aria-expanded={false}
        aria-controls={id}
        onClick={() => setOpen(true)}
      >
        {label}
      </Button>
    );
  }
  return (
    <div
      id={id}
      role="group"
      aria-label={label}
      className="inline-flex max-w-md flex-col gap-2 rounded-[var(--radius-control)] border-l-4 border-danger bg-danger-soft px-3 py-2 text-left text-sm text-fg"
      onKeyDown={(e) => {
        if (e.key === 'Escape') close();
      }}
    >
      <p>{loss}</p>
      <div className="flex flex-wrap gap-2">
        <Button ref={keep} tone="secondary" size="sm" onClick={close} disabled={busy}>
          Keep
        </Button>
        <Button
          tone="danger"
          size="sm"
          busy={busy}
          onClick={async () => {
            setBusy(true);
            try {
              await onConfirm();
            } finally {
              setBusy(false);
            }
          }}
        >
          {confirmLabel}
        </Button>
      </div>
    </div>
  );
}
