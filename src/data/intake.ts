/**
 * Upload intake: the request body is streamed to a temporary file and counted
 * against the size limit, then read once — hashed (SHA-256), stored in chunks
 * and read by the format's parser — inside one transaction. A file that fails its check stores
 * nothing; a file already held by the network is recognised by checksum and
 * not stored twice; an accepted file is queued for processing.
 */
import { createHash } from 'node:crypto';
import * as uploads from '@/db/repo/uploads';
import { enqueue } from '@/db/jobs';
import { createReadStream } from 'node:fs';
import { open } from 'node:fs/promises';
import { AppError, badRequest } from '@/src/server/errors';
import { discardRest, spoolLimited, tooLarge, type SpooledBody } from '@/src/server/body-limit';
import { formatBytes, maxUploadBytes } from './limits';
import { checkFile, sniffFormat, FileProblem } from './file-reading';
import type { Station } from '@/db/repo/stations';

export const PROCESS_UPLOAD_QUEUE = 'process-upload';

const tooLargeMessage = (name: string, limit: number) =>
  `${name} is larger than the ${formatBytes(limit)} limit for one file; split it into smaller files.`;

export interface IntakeRequest {
  station: Station;
  userId: string;
  fileName: string;
  body: ReadableStream<Uint8Array> | null;
  contentLength: number | null;
}

/**
 * The body is first written to a temporary file while its bytes are counted, so a file over the
 * limit is refused (413) as soon as the limit is passed, whether or not its length was announced,
 * before anything parses or stores it. Then the file is checked and stored in one pass.
 */
export async function receiveUpload(req: IntakeRequest): Promise<{ upload: uploads.UploadRow; duplicate: boolean }> {
  const limit = maxUploadBytes();
  const name = req.fileName;
  const refuse = () => tooLargeMessage(name, limit);
  if (!/^[^/\\\0]{1,200}$/.test(name)) {
    if (req.body) discardRest(req.body.getReader());
    throw badRequest('Give the file name (1–200 characters, no slashes).', 'name');
  }
  if (req.contentLength != null && req.contentLength > limit) {
    if (req.body) discardRest(req.body.getReader());
    throw tooLarge(refuse(), 'file');
  }
  if (!req.body) throw badRequest(`${name} is empty.`, 'file');
  const spooled = await spoolLimited(req.body, limit, refuse, 'file');
  try {
    return await storeSpooled(req, spooled);
  } finally {
    await spooled.remove();
  }
}

async function storeSpooled(
  req: IntakeRequest,
  spooled: SpooledBody,
): Promise<{ upload: uploads.UploadRow; duplicate: boolean }> {
  const name = req.fileName;
  if (spooled.size === 0) throw badRequest(`${name} is empty.`, 'file');
  // The first bytes tell the layouts apart.
  const head = Buffer.alloc(Math.min(4096, spooled.size));
  const fh = await open(spooled.path, 'r');
  try {
    await fh.read(head, 0, head.length, 0);
  } finally {
    await fh.close();
  }
  let format: uploads.UploadFormat;
  try {
    format = sniffFormat(name, new TextDecoder().decode(head));
  } catch (e) {
    if (e instanceof FileProblem) throw badRequest(e.message, e.field);
    throw e;
  }

  const result = await uploads.storeUpload(
    {
      networkId: req.station.networkId,
      stationId: req.station.id,
      uploadedBy: req.userId,
      fileName: name,
      format,
    },
    async (writer) => {
      const hash = createHash('sha256');
      let size = 0;
      const file = createReadStream(spooled.path, { highWaterMark: 256 * 1024 });
      async function* tap(): AsyncGenerator<Uint8Array> {
        for await (const chunk of file as AsyncIterable<Buffer>) {
          size += chunk.length;
          hash.update(chunk);
          await writer.append(chunk);
          yield new Uint8Array(chunk.buffer, chunk.byteOffset, chunk.length);
        }
      }
      const stream = tap();
      let warnings: string[] = [];
      try {
        ({ warnings } = await checkFile(format, stream, { fileName: name, station: req.station }));
        for await (const _ of stream) {
          /* the parser may stop early: store the rest */
        }
      } catch (e) {
        if (e instanceof FileProblem) throw badRequest(e.message, e.field);
        throw e;
      } finally {
        file.destroy();
      }
      return { sha256: hash.digest('hex'), sizeBytes: size, warnings };
    },
  );

  // A duplicate still queued may be the same file sent again after its first queueing failed
  // (the database went away in between): queue it again; the worker takes an upload only once.
  if (!result.duplicate || result.upload.state === 'queued') await queueProcessing(result.upload.id);
  return result;
}

/** Queues an upload for the worker; if the queue cannot be reached the upload is marked failed (and can be retried). */
export async function queueProcessing(uploadId: string): Promise<void> {
  try {
    await enqueue(PROCESS_UPLOAD_QUEUE, { uploadId }, { retryLimit: 0 });
  } catch (e) {
    await uploads.failUpload(
      uploadId,
      `Could not queue processing (${e instanceof Error ? e.message : String(e)}); use "Process again".`,
    );
  }
}

/** Puts a failed upload back in the queue. */
export async function retryUpload(networkId: string, uploadId: string) {
  const row = await uploads.requeueFailed(networkId, uploadId);
  if (!row) {
    const existing = await uploads.getUpload(networkId, uploadId);
    if (!existing) throw new AppError(404, 'not_found', 'No such upload in this network.');
    throw new AppError(
      409,
      'conflict',
      `This upload is ${existing.state}; only failed uploads (or ones stuck processing for over an hour) can be processed again.`,
    );
  }
  await queueProcessing(row.id);
  return (await uploads.getUpload(networkId, uploadId))!;
}
