'use client';
/** Asks why runs should leave an interval out, then flags it. */
import { useState } from 'react';
import { Button, FormField, inputClass } from '@/src/web/ui';

export function FlagForm({
  start,
  error,
  onFlag,
  onCancel,
}: {
  start: string;
  error: string | null;
  onFlag: (reason: string) => void;
  onCancel: () => void;
}) {
  const [reason, setReason] = useState('');
  return (
    <form
      className="flex flex-wrap items-end gap-3 rounded-[var(--radius-card)] border border-line bg-surface p-3"
      onSubmit={(e) => {
        e.preventDefault();
        onFlag(reason);
      }}
    >
      <FormField
        id="dv-flag-reason"
        label={`Why should runs leave out the interval from ${start.slice(11, 16)} UTC?`}
        error={error}
        className="min-w-80 flex-1"
      >
        <input
          className={inputClass}
          value={reason}
          autoFocus
          onChange={(e) => setReason(e.target.value)}
          placeholder="e.g. generator running next to the antenna"
        />
      </FormField>
      <Button type="submit" size="sm">
        Flag interval
      </Button>
      <Button type="button" size="sm" tone="quiet" onClick={onCancel}>
        Cancel
      </Button>
    </form>
  );
}
