'use client';
/** Owners remove a station with everything stored for it (confirmed in place, see ConfirmAction). */
import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Notice } from '@/src/web/ui/Notice';
import { ConfirmAction } from '@/src/web/ui/ConfirmAction';
import { apiSend, ApiError } from '@/src/web/swr';

export function DeleteStation({ networkId, stationId, code }: { networkId: string; stationId: string; code: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  async function remove() {
    try {
      await apiSend('DELETE', `/api/networks/${networkId}/stations/${stationId}`);
      router.push(`/n/${networkId}/stations`);
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : String(e));
    }
  }
  return (
    <div className="space-y-3">
      <p className="text-sm text-muted">Removes the station with its files, intervals, fits and push tokens.</p>
      <ConfirmAction
        label="Remove station"
        loss={`${code} goes with every file, interval, spectrum, fit and push token stored for it. Runs that used it keep their results.`}
        confirmLabel={`Remove ${code} and its data`}
        onConfirm={remove}
      />
      {error ? <Notice tone="error">{error}</Notice> : null}
    </div>
  );
}
