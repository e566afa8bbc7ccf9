/**
 * The plain pages a link answers with when it opens nothing: gone (revoked or
 * expired, status 410) or not valid (tampered or unknown, status 404). Whole
 * HTML documents with fixed wording: nothing from the request is echoed.
 */
import type { OpenedLink } from './links';

const WORDING = {
  revoked: {
    title: 'This link was withdrawn',
    body: 'The people who shared this run have withdrawn the link, so it no longer opens anything. Ask them for a new link if you still need the run.',
  },
  expired: {
    title: 'This link has expired',
    body: 'Shared links to a run last a limited number of days, and this one has run out. Ask whoever shared it for a new link.',
  },
  invalid: {
    title: 'This link is not valid',
    body: 'The address is incomplete or has been changed, so Cavitas cannot tell which run it was for. Check that the whole link was copied.',
  },
} as const;

function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex"><title>${title} · Cavitas</title>
<style>body{margin:0;font-family:system-ui,sans-serif;background:#f5f6f9;color:#1b2236}main{max-width:36rem;margin:12vh auto;padding:2rem;background:#fff;border:1px solid #d5d9e3;border-radius:8px}h1{font-size:1.3rem;margin:0 0 .75rem}p{line-height:1.5;margin:0 0 .75rem}small{color:#5b6478}@media (prefers-color-scheme:dark){body{background:#0b1020;color:#e6e9f2}main{background:#141a2e;border-color:#2a3350}small{color:#9aa3b8}}</style>
</head><body><main><h1 data-testid="link-state">${title}</h1><p>${body}</p><small>Cavitas · shared run link</small></main></body></html>`;
}

/** The page and status for a link that opens nothing. */
export function closedLinkResponse(o: Exclude<OpenedLink, { kind: 'open' }>): Response {
  const w = o.kind === 'gone' ? WORDING[o.why] : WORDING.invalid;
  return new Response(page(w.title, w.body), {
    status: o.kind === 'gone' ? 410 : 404,
    headers: { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store', 'referrer-policy': 'no-referrer' },
  });
}
