'use client';
/**
 * "Bring back a case file": reads a case JSON file the user picks and sends it
 * to the import API; on success opens the new run, otherwise says which field
 * of the case is wrong.
 */
import { useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import { buttonClass } from '@/src/web/ui/Button';
import { Notice } from '@/src/web/ui/Notice';
import { ApiError, apiSend } from '@/src/web/swr';

export function ImportCaseButton({ networkId }: { networkId: string }) {
  const router = useRouter();
  const input = useRef<HTMLInputElement>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function send(file: File) {
    setProblem(null);
    setBusy(true);
    try {
      let body: unknown;
      try {
        body = JSON.parse(await file.text());
      } catch {
        throw new Error(`${file.name} is not a JSON file.`);
      }
      const r = await apiSend<{ runId: string }>('POST', `/api/networks/${networkId}/runs/import`, body);
      router.push(`/n/${networkId}/runs/${r.runId}`);
    } catch (e) {
      const field = e instanceof ApiError && e.field ? ` (field ${e.field})` : '';
      setProblem(`${(e as Error).message}${field}`);
      setBusy(false);
    } finally {
      if (input.current) input.current.value = '';
    }
  }

  return (
    <>
      <label className={buttonClass('secondary', 'md', busy ? 'opacity-60' : undefined)}>
        {busy ? 'Importing…' : 'Import a case file'}
        <input
          ref={input}
          type="file"
          accept="application/json,.json"
          className="sr-only"
          disabled={busy}
          onChange={(e) => {
            const f = e.target.files?.[0];
            if (f) void send(f);
          }}
        />
      </label>
      {problem ? (
        <div className="basis-full">
          <Notice tone="error" title="The case file was not imported">
            {problem}
          </Notice>
        </div>
      ) : null}
    </>
  );
}
