/**
 * Request body limits, enforced before anything is parsed: a body announced (Content-Length) or
 * found (while streaming) to be larger than its cap is refused with 413 at once, and what the
 * client still sends is read and thrown away in the background (bounded in bytes and time), so
 * the refusal reaches the client and its keep-alive connection stays usable instead of stalling
 * on an unread body. Memory stays flat: nothing past the cap is kept.
 */
import { createWriteStream } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { settings } from '@/src/settings';
import { AppError } from './errors';

/** After a refusal: read and drop at most this much more of the body, for at most this long. */
const DRAIN_MAX_BYTES = 1024 * 1024 * 1024;
const DRAIN_MAX_MS = 15_000;

export function formatBytes(n: number): string {
  if (n >= 1024 * 1024) return `${(n / (1024 * 1024)).toFixed(n >= 10 * 1024 * 1024 ? 0 : 1)} MB`;
  if (n >= 1024) return `${(n / 1024).toFixed(0)} kB`;
  return `${n} bytes`;
}

export const tooLarge = (message: string, field = 'body') => new AppError(413, 'too_large', message, field);

/** The cap for a JSON body at this address: small for sign-in, sign-up and resets, larger for the rest. */
export function jsonBodyCap(url: string): number {
  const s = settings();
  const auth = new URL(url, 'http://localhost').pathname.startsWith('/api/auth/');
  return Math.round((auth ? s.AUTH_BODY_MAX_KB : s.JSON_BODY_MAX_KB) * 1024);
}

/** The body's announced length, or null when it is streamed without one (or the header is malformed). */
export function announcedLength(req: Request): number | null {
  const v = req.headers.get('content-length');
  if (v === null || !/^\d+$/.test(v.trim())) return null;
  return Number(v);
}

/**
 * Reads and drops the rest of a refused body in the background; past the bounds the stream is
 * cancelled (the server then closes the connection). Never throws.
 */
export function discardRest(reader: ReadableStreamDefaultReader<Uint8Array>): void {
  const until = Date.now() + DRAIN_MAX_MS;
  let dropped = 0;
  void (async () => {
    try {
      for (;;) {
        if (dropped > DRAIN_MAX_BYTES || Date.now() > until) {
          await reader.cancel();
          return;
        }
        const { done, value } = await reader.read();
        if (done) return;
        dropped += value.length;
      }
    } catch {
      // the client went away: nothing to drain
    }
  })();
}

/** Refuses a body whose announced length is over `cap` (reading none of it). */
export function refuseAnnounced(req: Request, cap: number, message: () => string): void {
  const n = announcedLength(req);
  if (n === null || n <= cap) return;
  if (req.body) discardRest(req.body.getReader());
  throw tooLarge(message());
}

/**
 * Counts the body's bytes as they are read: yields each chunk, and on passing `cap` drains the
 * rest in the background and throws the 413 from `message`.
 */
export async function* limitedChunks(
  body: ReadableStream<Uint8Array>,
  cap: number,
  message: () => string,
  field = 'body',
): AsyncGenerator<Uint8Array> {
  const reader = body.getReader();
  let size = 0;
  let finished = false;
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) {
        finished = true;
        return;
      }
      size += value.length;
      if (size > cap) {
        finished = true;
        discardRest(reader);
        throw tooLarge(message(), field);
      }
      yield value;
    }
  } finally {
    // The consumer stopped early (a parse error): drop what is left the same way.
    if (!finished) discardRest(reader);
  }
}

/** The whole body as UTF-8 text, at most `cap` bytes (announced or streamed), else 413. */
export async function readLimitedText(req: Request, cap: number, message: () => string): Promise<string> {
  refuseAnnounced(req, cap, message);
  if (!req.body) return '';
  const parts: Uint8Array[] = [];
  for await (const chunk of limitedChunks(req.body, cap, message)) parts.push(chunk);
  return Buffer.concat(parts).toString('utf8');
}

/** A JSON body's text within its cap (`jsonBodyCap`). */
export function readJsonText(req: Request): Promise<string> {
  const cap = jsonBodyCap(req.url);
  return readLimitedText(req, cap, () => `The request body is larger than the ${formatBytes(cap)} this address accepts.`);
}

/** A body written whole to a private temporary file: its size, and `remove()` to delete it. */
export interface SpooledBody {
  path: string;
  size: number;
  remove(): Promise<void>;
}

/**
 * Streams a body to a temporary file, counting its bytes: past `cap` the file is deleted and the
 * 413 thrown at once (the rest drained in the background), before anything parses or stores it.
 */
export async function spoolLimited(
  body: ReadableStream<Uint8Array>,
  cap: number,
  message: () => string,
  field = 'body',
): Promise<SpooledBody> {
  const dir = await mkdtemp(path.join(tmpdir(), 'cavitas-body-'));
  const file = path.join(dir, 'body');
  const remove = () => rm(dir, { recursive: true, force: true });
  let size = 0;
  try {
    const counted = Readable.from(
      (async function* () {
        for await (const chunk of limitedChunks(body, cap, message, field)) {
          size += chunk.length;
          yield chunk;
        }
      })(),
    );
    await pipeline(counted, createWriteStream(file, { mode: 0o600 }));
  } catch (e) {
    await remove();
    throw e;
  }
  return { path: file, size, remove };
}
