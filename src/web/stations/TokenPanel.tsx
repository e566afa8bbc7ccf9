'use client';
/**
 * Push tokens of a station (owners): create one (its secret is shown once),
 * see when each was last used, revoke.
 */
import { useState, type FormEvent } from 'react';
import { Badge, Button, DataTable, EmptyState, FormField, Notice, inputClass } from '@/src/web/ui';
import { apiSend, ApiError, useApi } from '@/src/web/swr';

interface TokenInfo {
  id: string;
  label: string;
  hint: string;
  createdAt: string;
  expiresAt: string | null;
  revokedAt: string | null;
  lastUsedAt: string | null;
}

export function TokenPanel({ networkId, stationId, pushUrl }: { networkId: string; stationId: string; pushUrl: string }) {
  const url = `/api/networks/${networkId}/stations/${stationId}/tokens`;
  const { data, mutate } = useApi<{ tokens: TokenInfo[] }>(url);
  const [label, setLabel] = useState('');
  const [days, setDays] = useState('365');
  const [secret, setSecret] = useState<string | null>(null);
  const [error, setError] = useState<{ message: string; field?: string } | null>(null);

  async function create(e: FormEvent) {
    e.preventDefault();
    setError(null);
    try {
      const out = await apiSend<{ secret: string }>('POST', url, {
        label,
        expiresInDays: days === 'never' ? null : Number(days),
      });
      setSecret(out.secret);
      setLabel('');
      await mutate();
    } catch (x) {
      setError(x instanceof ApiError ? { message: x.message, field: x.field } : { message: String(x) });
    }
  }

  async function revoke(id: string) {
    await apiSend('DELETE', `${url}/${id}`);
    await mutate();
  }

  const [now] = useState(() => Date.now()); // when the panel opened: expiry is a matter of days
  const rows = (data?.tokens ?? []).map((t) => ({
    ...t,
    status: t.revokedAt ? 'revoked' : t.expiresAt && new Date(t.expiresAt).getTime() <= now ? 'expired' : 'active',
  }));
  return (
    <div className="space-y-4">
      <form onSubmit={create} className="flex flex-wrap items-end gap-3">
        <FormField
          id="tok-label"
          label="Label"
          hint="e.g. the computer that will use it"
          error={error?.field === 'label' ? error.message : null}
        >
          <input className={inputClass} value={label} onChange={(e) => setLabel(e.target.value)} />
        </FormField>
        <FormField id="tok-days" label="Valid for">
          <select className={inputClass} value={days} onChange={(e) => setDays(e.target.value)}>
            <option value="30">30 days</option>
            <option value="365">1 year</option>
            <option value="1825">5 years</option>
            <option value="never">no end date</option>
          </select>
        </FormField>
        <Button type="submit">Create token</Button>
      </form>
      {error && error.field !== 'label' ? <Notice tone="error">{error.message}</Notice> : null}
      {secret ? (
        <Notice tone="success" title="Copy this token now — it is shown only once">
          <code className="block break-all font-mono text-xs" data-testid="push-secret">
            {secret}
          </code>
          <p className="mt-1 text-xs">
            The station computer sends it as <code>Authorization: Bearer …</code> to <code>{pushUrl}</code>.
          </p>
        </Notice>
      ) : null}
      <DataTable
        caption="Push tokens"
        rows={rows as unknown as Record<string, unknown>[]}
        initialSort={{ key: 'createdAt', desc: true }}
        empty={
          <EmptyState title="No push tokens">
            Create one to let this station&apos;s computer send its intervals directly.
          </EmptyState>
        }
        columns={[
          { key: 'label', header: 'Label' },
          { key: 'hint', header: 'Starts with' },
          { key: 'createdAt', header: 'Created', time: true },
          { key: 'expiresAt', header: 'Expires', time: true },
          { key: 'lastUsedAt', header: 'Last used', time: true },
          {
            key: 'status',
            header: 'Status',
            render: (r) => <Badge tone={r.status === 'active' ? 'ok' : 'danger'}>{String(r.status)}</Badge>,
          },
          {
            key: 'id',
            header: '',
            sortable: false,
            render: (r) =>
              r.status === 'active' ? (
                <Button size="sm" tone="danger" onClick={() => revoke(String(r.id))}>
                  Revoke
                </Button>
              ) : (
                ''
              ),
          },
        ]}
      />
    </div>
  );
}
