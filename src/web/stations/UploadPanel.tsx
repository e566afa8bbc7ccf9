'use client';
/**
 * Send station files (several at once, each streamed with its own progress
 * bar), then follow their processing. Failed files show the reason and can
 * be queued again.
 */
import { useState } from 'react';
import { Badge, Button, DataTable, EmptyState, Notice, ProgressBar } from '@/src/web/ui';
import { apiSend, apiUpload, useApi } from '@/src/web/swr';

interface UploadItem {
  id: string;
  fileName: string;
  format: string;
  sizeBytes: number;
  state: 'queued' | 'processing' | 'done' | 'failed';
  progress: number;
  progressNote: string;
  error: string | null;
  intervalCount: number;
  warnings?: string[];
  createdAt: string;
  attempts: number;
  startedAt: string | null;
}

type Sending = { name: string; sent: number; total: number; error?: string; note?: string };

/** Time left from the pace so far (elapsed × (1 − p) / p), once a little progress is made. */
function remaining(u: UploadItem): number | null {
  if (u.state !== 'processing' || !u.startedAt || !(u.progress > 0.02)) return null;
  const elapsed = (Date.now() - Date.parse(u.startedAt)) / 1000;
  return (elapsed * (1 - u.progress)) / u.progress;
}

const STATE_TONE = { queued: 'neutral', processing: 'accent', done: 'ok', failed: 'danger' } as const;
const STATE_WORD = { queued: 'waiting', processing: 'processing', done: 'processed', failed: 'failed' } as const;

export function UploadPanel({
  networkId,
  stationId,
  stationCode,
  canUpload,
  maxBytesLabel,
}: {
  networkId: string;
  stationId: string;
  stationCode: string;
  canUpload: boolean;
  maxBytesLabel: string;
}) {
  const listUrl = `/api/networks/${networkId}/uploads?station=${stationId}`;
  const { data, mutate } = useApi<{ uploads: UploadItem[] }>(listUrl, {
    refreshInterval: (d) => (d?.uploads.some((u) => u.state === 'queued' || u.state === 'processing') ? 1000 : 0),
  });
  const [sending, setSending] = useState<Sending[]>([]);

  async function onFiles(files: FileList | null) {
    if (!files?.length) return;
    const list = Array.from(files);
    setSending(list.map((f) => ({ name: f.name, sent: 0, total: f.size })));
    await Promise.all(
      list.map(async (file, i) => {
        const patch = (p: Partial<Sending>) => setSending((s) => s.map((x, k) => (k === i ? { ...x, ...p } : x)));
        const url = `/api/networks/${networkId}/uploads?station=${stationId}&name=${encodeURIComponent(file.name)}`;
        try {
          const out = await apiUpload<{ upload: UploadItem; duplicate: boolean }>(url, file, (sent) => patch({ sent }));
          patch({ sent: file.size, note: out.duplicate ? 'already uploaded before — the earlier copy is kept' : 'received' });
        } catch (e) {
          patch({ error: e instanceof Error ? e.message : String(e) });
        }
        await mutate();
      }),
    );
  }

  async function retry(id: string) {
    await apiSend('POST', `/api/networks/${networkId}/uploads/${id}/retry`);
    await mutate();
  }

  const uploads = data?.uploads ?? [];
  return (
    <div className="space-y-4">
      {canUpload ? (
        <div className="space-y-2">
          <label className="block text-sm font-medium" htmlFor="upload-files">
            Add files for {stationCode}
          </label>
          <input
            id="upload-files"
            type="file"
            multiple
            accept=".csv,.json,.txt"
            onChange={(e) => onFiles(e.target.files)}
            className="block text-sm file:mr-3 file:rounded-[var(--radius-control)] file:border file:border-line file:bg-raised file:px-3 file:py-1.5"
          />
          <p className="text-xs text-muted">
            Time-series CSV, spectra CSV or JSON series; up to {maxBytesLabel} per file. The same file sent twice is recognised
            and kept once.
          </p>
          {sending.map((s) => (
            <div key={s.name} className="space-y-1">
              <ProgressBar value={s.total ? s.sent / s.total : 1} label={`Sending ${s.name}`} />
              {s.error ? (
                <Notice tone="error" title={`${s.name} was not accepted`}>
                  {s.error}
                </Notice>
              ) : null}
              {s.note ? (
                <p className="text-xs text-muted">
                  {s.name}: {s.note}
                </p>
              ) : null}
            </div>
          ))}
        </div>
      ) : (
        <Notice>Your role can read and export this station&apos;s data; analysts and owners add files.</Notice>
      )}
      {uploads
        .filter((u) => u.state === 'processing' || u.state === 'queued')
        .map((u) => (
          <ProgressBar
            key={u.id}
            value={u.state === 'queued' ? null : u.progress}
            label={`${u.fileName}: ${u.progressNote || STATE_WORD[u.state]}`}
            remainingSeconds={remaining(u)}
          />
        ))}
      <DataTable
        caption="Files of this station"
        rows={uploads as unknown as Record<string, unknown>[]}
        initialSort={{ key: 'createdAt', desc: true }}
        empty={
          <EmptyState title="No files yet">
            Choose station files above, or let the station computer send intervals with a push token.
          </EmptyState>
        }
        columns={[
          { key: 'fileName', header: 'File' },
          { key: 'createdAt', header: 'Received', time: true },
          {
            key: 'sizeBytes',
            header: 'Size',
            unit: 'kB',
            numeric: true,
            digits: 0,
            render: (r) => ((r.sizeBytes as number) / 1024).toFixed(0),
          },
          {
            key: 'state',
            header: 'State',
            render: (r) => (
              <Badge tone={STATE_TONE[r.state as UploadItem['state']]}>{STATE_WORD[r.state as UploadItem['state']]}</Badge>
            ),
          },
          { key: 'intervalCount', header: 'Intervals', numeric: true, digits: 0 },
          {
            key: 'error',
            header: 'Reason, warnings, action',
            sortable: false,
            render: (r) =>
              r.state === 'failed' ? (
                <span className="flex flex-wrap items-center gap-2">
                  <span className="text-danger">{String(r.error)}</span>
                  {canUpload ? (
                    <Button size="sm" tone="secondary" onClick={() => retry(String(r.id))}>
                      Process again
                    </Button>
                  ) : null}
                </span>
              ) : (r.warnings as string[] | undefined)?.length ? (
                <span className="text-muted">{(r.warnings as string[]).join(' ')}</span>
              ) : (
                ''
              ),
          },
        ]}
      />
    </div>
  );
}
