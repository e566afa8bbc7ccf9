'use client';
/**
 * The run's read-only links: who made each and when, until when it opens the
 * run, and whether it was revoked. Owners and analysts make new links (for a
 * number of days) and revoke them; viewers see the list without the addresses.
 */
import { useState } from 'react';
import { Button } from '@/src/web/ui/Button';
import { Notice } from '@/src/web/ui/Notice';
import { apiSend, useApi } from '@/src/web/swr';
import { formatUtc } from '@/src/web/ui/format';
import type { RunLinkView } from '@/src/sharing/links';

const STATE_WORDS: Record<RunLinkView['state'], string> = { active: 'Open', revoked: 'Revoked', expired: 'Expired' };

export function RunLinksPanel({ base, canShare }: { base: string; canShare: boolean }) {
  const url = `${base}/links`;
  const { data, error, mutate } = useApi<{ links: RunLinkView[] }>(url);
  const [days, setDays] = useState('7');
  const [made, setMade] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function make() {
    setProblem(null);
    setBusy(true);
    try {
      const r = await apiSend<{ url: string }>('POST', url, { expiresInDays: Number(days) });
      setMade(r.url);
      await mutate();
    } catch (e) {
      setProblem((e as Error).message);
    } finally {
      setBusy(false);
    }
  }
  async function revoke(id: string) {
    setProblem(null);
    try {
      await apiSend('DELETE', `${url}/${id}`);
      await mutate();
    } catch (e) {
      setProblem((e as Error).message);
    }
  }

  return (
    <div className="space-y-3 text-sm">
      {canShare ? (
        <div className="flex flex-wrap items-end gap-2">
          <label className="flex flex-col gap-1">
            <span>Link lasts (days)</span>
            <input
              type="number"
              min={1}
              max={365}
              value={days}
              onChange={(e) => setDays(e.target.value)}
              className="w-24 rounded border border-line-strong bg-surface px-2 py-1"
            />
          </label>
          <Button type="button" onClick={make} busy={busy}>
            Make a read-only link
          </Button>
        </div>
      ) : null}
      {made ? (
        <label className="block">
          <span className="mb-1 block">New link — anyone holding it can read this run (map, minima, fits) until it expires:</span>
          <input
            readOnly
            value={made}
            data-testid="new-link-url"
            onFocus={(e) => e.currentTarget.select()}
            className="w-full rounded border border-line-strong bg-surface px-2 py-1 font-mono text-xs"
          />
        </label>
      ) : null}
      {problem ? (
        <Notice tone="error" title="That did not work">
          {problem}
        </Notice>
      ) : null}
      {error ? <p className="text-muted">The links could not be loaded: {error.message}</p> : null}
      {data && data.links.length === 0 ? <p className="text-muted">No link has been made to this run.</p> : null}
      {data && data.links.length > 0 ? (
        <table className="w-full text-left" data-testid="run-links">
          <thead>
            <tr className="border-b border-line">
              <th scope="col" className="py-1 pr-3 font-medium">
                Made by
              </th>
              <th scope="col" className="py-1 pr-3 font-medium">
                Made (UT)
              </th>
              <th scope="col" className="py-1 pr-3 font-medium">
                Opens until (UT)
              </th>
              <th scope="col" className="py-1 pr-3 font-medium">
                State
              </th>
              {canShare ? <th scope="col" className="py-1 font-medium" /> : null}
            </tr>
          </thead>
          <tbody>
            {data.links.map((l) => (
              <tr key={l.id} className="border-b border-line">
                <td className="py-1 pr-3">{l.createdBy ?? 'a former member'}</td>
                <td className="num py-1 pr-3">{formatUtc(l.createdAt)}</td>
                <td className="num py-1 pr-3">{formatUtc(l.expiresAt)}</td>
                <td className="py-1 pr-3">
                  {STATE_WORDS[l.state]}
                  {l.state === 'revoked' && l.revokedBy ? ` by ${l.revokedBy}` : ''}
                </td>
                {canShare ? (
                  <td className="py-1 text-right">
                    {l.state === 'active' ? (
                      <Button type="button" size="sm" tone="quiet" onClick={() => revoke(l.id)}>
                        Revoke
                      </Button>
                    ) : null}
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
    </div>
  );
}
