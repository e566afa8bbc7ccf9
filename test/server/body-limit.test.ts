/**
 * Body limits before parsing: a body announced or found to be over its cap is refused with 413
 * (RFC 9110 §15.5.14 Content Too Large) without being read whole, and the rest of it is read and
 * dropped in the background so the client's connection is not left with an unread body (common
 * practice: Node's own http server drains an unread request body once the response is sent).
 */
import { afterEach, describe, expect, it } from 'vitest';
import { existsSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { z } from 'zod';
import { jsonBodyCap, readJsonText, readLimitedText, spoolLimited } from '@/src/server/body-limit';
import { parseJson, route } from '@/src/server/route';

const MB = 1024 * 1024;

/** A body of `total` bytes made on demand, counting what has been pulled from it. */
function countedBody(total: number, chunk = 64 * 1024) {
  const block = new Uint8Array(chunk).fill(0x20);
  const state = { pulled: 0, done: false };
  const stream = new ReadableStream<Uint8Array>({
    pull(c) {
      if (state.pulled >= total) {
        state.done = true;
        c.close();
        return;
      }
      const n = Math.min(chunk, total - state.pulled);
      state.pulled += n;
      c.enqueue(n === chunk ? block : block.subarray(0, n));
    },
  });
  return { stream, state };
}

const post = (url: string, body: ReadableStream<Uint8Array> | string, headers: Record<string, string> = {}) =>
  new Request(url, { method: 'POST', body, headers, duplex: 'half' } as RequestInit);

const until = async (ok: () => boolean, ms = 5000) => {
  const end = Date.now() + ms;
  while (!ok() && Date.now() < end) await new Promise((r) => setTimeout(r, 10));
  return ok();
};

afterEach(() => {
  delete process.env.AUTH_BODY_MAX_KB;
  delete process.env.JSON_BODY_MAX_KB;
});

describe('JSON body caps', () => {
  it('are small for the sign-in routes and larger elsewhere, from the settings', () => {
    expect(jsonBodyCap('http://localhost/api/auth/sign-in')).toBe(16 * 1024);
    expect(jsonBodyCap('http://localhost/api/networks/x/grids')).toBe(1024 * 1024);
    process.env.AUTH_BODY_MAX_KB = '4';
    expect(jsonBodyCap('http://localhost/api/auth/sign-up')).toBe(4096);
  });

  it('refuses an announced 50 MB body with 413 before reading it, then drains it', async () => {
    const body = countedBody(50 * MB);
    const req = post('http://localhost/api/auth/sign-in', body.stream, { 'content-length': String(50 * MB) });
    const res = await route(async (r) => parseJson(r, z.object({})))(req);
    expect(res.status).toBe(413);
    expect((await res.json()).error).toMatchObject({ code: 'too_large', field: 'body' });
    // Nothing kept: the rest is read and dropped in the background until the body ends.
    expect(await until(() => body.state.done, 20_000)).toBe(true);
  });

  it('refuses a streamed body (no Content-Length) as soon as it passes the cap', async () => {
    process.env.JSON_BODY_MAX_KB = '256';
    const body = countedBody(8 * MB);
    const req = post('http://localhost/api/networks/x/models', body.stream);
    await expect(readJsonText(req)).rejects.toMatchObject({ status: 413, message: /larger than the 256 kB/ });
    expect(await until(() => body.state.done)).toBe(true);
  });

  it('passes a body within its cap unchanged', async () => {
    const text = JSON.stringify({ email: 'a@example.org', password: 'x'.repeat(100) });
    const req = post('http://localhost/api/auth/sign-in', text);
    expect(await readJsonText(req)).toBe(text);
    expect(await readLimitedText(post('http://localhost/x', 'é'.repeat(10)), 20, () => 'too big')).toBe('é'.repeat(10));
    await expect(readLimitedText(post('http://localhost/x', 'é'.repeat(11)), 20, () => 'too big')).rejects.toMatchObject({
      status: 413,
    });
  });
});

describe('spoolLimited', () => {
  it('writes a body within the cap to a private temporary file, removed afterwards', async () => {
    const body = countedBody(3 * MB + 17);
    const s = await spoolLimited(body.stream, 4 * MB, () => 'too big');
    expect(s.size).toBe(3 * MB + 17);
    expect((await readFile(s.path)).length).toBe(3 * MB + 17);
    await s.remove();
    expect(existsSync(s.path)).toBe(false);
  });

  it('refuses once past the cap and drains the rest', async () => {
    const body = countedBody(64 * MB);
    await expect(spoolLimited(body.stream, 4 * MB, () => 'the file is too big', 'file')).rejects.toMatchObject({
      status: 413,
      field: 'file',
    });
    expect(await until(() => body.state.done, 20_000)).toBe(true);
  });
});
