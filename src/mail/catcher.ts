/**
 * The local mail catcher: an SMTP server on 127.0.0.1 that accepts every message the app sends
 * and stores it in `mail_messages` instead of delivering it. Started by `npm start`; can run
 * alone with `npx tsx src/mail/catcher-main.ts` (port from SMTP_PORT, default 2525).
 */
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import { storeMail } from '@/db/repo/mail';

/** Largest message accepted (bytes); larger ones are refused with SMTP 552. */
export const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

export interface Catcher {
  port: number;
  close(): Promise<void>;
}

function streamToBuffer(stream: NodeJS.ReadableStream): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    stream.on('data', (c: Buffer) => chunks.push(c));
    stream.on('end', () => resolve(Buffer.concat(chunks)));
    stream.on('error', reject);
  });
}

/** Starts the catcher; port 0 picks a free one (see `port` of the result). */
export function startCatcher(options: { port?: number; host?: string; log?: (l: string) => void } = {}): Promise<Catcher> {
  const log = options.log ?? (() => {});
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    banner: 'Cavitas local mail catcher (nothing leaves this machine)',
    logger: false,
    onData(stream, session, callback) {
      streamToBuffer(stream)
        .then(async (raw) => {
          if ((stream as unknown as { sizeExceeded?: boolean }).sizeExceeded) {
            const err = new Error(`message larger than ${MAX_MESSAGE_BYTES} bytes`) as Error & { responseCode: number };
            err.responseCode = 552;
            throw err;
          }
          const parsed = await simpleParser(raw);
          const envelopeFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
          const stored = await storeMail({
            from: envelopeFrom || parsed.from?.text || '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? null,
            html: typeof parsed.html === 'string' ? parsed.html : null,
            raw: raw.toString('utf8'),
            sizeBytes: raw.length,
          });
          log(`[mail] caught "${stored.subject}" for ${stored.to.join(', ')}`);
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  const host = options.host ?? '127.0.0.1';
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, host, () => {
      server.off('error', reject);
      server.on('error', (err) => log(`[mail] ${err.message}`));
      const address = server.server.address();
      const port = typeof address === 'object' && address ? address.port : (options.port ?? 0);
      resolve({ port, close: () => new Promise<void>((r) => server.close(() => r())) });
    });
  });
}
