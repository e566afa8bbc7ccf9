'use client';
/**
 * Comments on a run and on its minima: author, time and text — always shown
 * as text (React escapes it; nothing is ever read as markup). Members write
 * them, on the whole run or on one minimum of one interval; a link holder
 * reads them (`canWrite` false, the link's own API).
 */
import { useState } from 'react';
import { Button } from '@/src/web/ui/Button';
import { Notice } from '@/src/web/ui/Notice';
import { apiSend, useApi } from '@/src/web/swr';
import { formatUtc } from '@/src/web/ui/format';
import type { CommentView } from '@/src/sharing/comments';

/** Keep in step with MAX_COMMENT_CHARS in src/sharing/comments.ts (the server refuses longer ones). */
const MAX_CHARS = 2000;

function target(on: CommentView['on']): string {
  if (!on) return 'on the run';
  return `on minimum ${on.minimum + 1} of ${on.interval.slice(0, 16).replace('T', ' ')} UT`;
}

export function CommentsPanel({
  url,
  canWrite,
  intervals = [],
}: {
  /** …/comments of the run API, or of the link's API (read only). */
  url: string;
  canWrite: boolean;
  /** The run's solved intervals with their minima counts, for choosing a minimum to comment on. */
  intervals?: { startsAt: string; minima: number }[];
}) {
  const { data, error, mutate } = useApi<{ comments: CommentView[] }>(url);
  const [body, setBody] = useState('');
  const [about, setAbout] = useState('run');
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const choices = intervals.flatMap((iv) =>
    Array.from({ length: iv.minima }, (_, k) => ({
      value: `${iv.startsAt}|${k}`,
      label: `Minimum ${k + 1} of ${iv.startsAt.slice(0, 16).replace('T', ' ')} UT`,
    })),
  );

  async function send() {
    setProblem(null);
    setBusy(true);
    try {
      const [interval, minimum] = about === 'run' ? [] : about.split('|');
      await apiSend('POST', url, {
        body,
        ...(interval !== undefined ? { interval, minimum: Number(minimum) } : {}),
      });
      setBody('');
      await mutate();
    } catch (e) {
      setProblem((e as Error).message);
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="space-y-3 text-sm">
      {error ? <p className="text-muted">The comments could not be loaded: {error.message}</p> : null}
      {data && data.comments.length === 0 ? <p className="text-muted">No comments yet.</p> : null}
      {data && data.comments.length > 0 ? (
        <ol className="space-y-3" data-testid="comments">
          {data.comments.map((c) => (
            <li key={c.id} className="rounded border border-line px-3 py-2">
              <p className="text-xs text-muted">
                <span className="font-medium text-fg">{c.author ?? 'a former member'}</span> · {formatUtc(c.createdAt)} UT ·{' '}
                {target(c.on)}
              </p>
              <p className="mt-1 whitespace-pre-wrap break-words" data-testid="comment-body">
                {c.body}
              </p>
            </li>
          ))}
        </ol>
      ) : null}
      {canWrite ? (
        <div className="space-y-2">
          <label className="block">
            <span className="mb-1 block">Comment</span>
            <textarea
              value={body}
              maxLength={MAX_CHARS}
              rows={3}
              onChange={(e) => setBody(e.target.value)}
              className="w-full rounded border border-line-strong bg-surface px-2 py-1"
            />
          </label>
          <div className="flex flex-wrap items-end gap-2">
            <label className="flex flex-col gap-1">
              <span>About</span>
              <select
                value={about}
                onChange={(e) => setAbout(e.target.value)}
                className="rounded border border-line-strong bg-surface px-2 py-1"
              >
                <option value="run">The whole run</option>
                {choices.map((c) => (
                  <option key={c.value} value={c.value}>
                    {c.label}
                  </option>
                ))}
              </select>
            </label>
            <Button type="button" onClick={send} busy={busy} disabled={!body.trim()}>
              Post comment
            </Button>
            <span className="text-xs text-muted">
              {body.length} / {MAX_CHARS} characters · plain text
            </span>
          </div>
          {problem ? (
            <Notice tone="error" title="The comment was not posted">
              {problem}
            </Notice>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
