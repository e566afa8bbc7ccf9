'use client';
/** Owners remove a station with everything stored for it, after typing its code. */
import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button, FormField, Notice, inputClass } from '@/src/web/ui';
import { api, ApiFailure } from './api';

export function DeleteStation({ networkId, stationId, code }: { networkId: string; stationId: string; code: string }) {
  const router = useRouter();
  const [typed, setTyped] = useState('');
  const [error, setError] = useState<string | null>(null);
  async function remove() {
    try {
      await api(`/api/networks/${networkId}/stations/${stationId}`, { method: 'DELETE' });
      router.push(`/n/${networkId}/stations`);
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiFailure ? e.message : String(e));
    }
  }
  return (
    <div className="space-y-3">
      <p className="text-sm text-muted">Removes the station with its files, intervals, fits and push tokens.</p>
      <FormField id="del-code" label={`Type ${code} to confirm`}>
        <input className={inputClass} value={typed} onChange={(e) => setTyped(e.target.value)} />
      </FormField>
      {error ? <Notice tone="error">{error}</Notice> : null}
      <Button tone="danger" disabled={typed !== code} onClick={remove}>
        Remove station
      </Button>
    </div>
  );
}
