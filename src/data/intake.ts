/**
 * Upload intake: the request body is streamed once — counted against the
 * size limit, hashed (SHA-256), stored in chunks and read by the format's
 * parser — inside one transaction. A file that fails its check stores
 * nothing; a file already held by the network is recognised by checksum and
 * not stored twice; an accepted file is queued for processing.
 */
import { createHash } from 'node:crypto';
import * as uploads from '@/db/repo/uploads';
import { enqueue } from '@/db/jobs';
import { AppError, badRequest } from '@/src/server/errors';
import { formatBytes, maxUploadBytes } from './limits';
import { checkFile, sniffFormat, FileProblem } from './file-reading';
import type { Station } from '@/db/repo/stations';

export const PROCESS_UPLOAD_QUEUE = 'process-upload';

const tooLarge = (name: string, limit: number) =>
  new AppError(
    413,
    'too_large',
    `${name} is larger than the ${formatBytes(limit)} limit for one file; split it into smaller files.`,
    'file',
  );

export interface IntakeRequest {
  station: Station;
  userId: string;
  fileName: string;
  body: ReadableStream<Uint8Array> | null;
  contentLength: number | null;
}

export async function receiveUpload(req: IntakeRequest): Promise<{ upload: uploads.UploadRow; duplicate: boolean }> {
  const limit = maxUploadBytes();
  const name = req.fileName;
  if (!/^[^/\\\0]{1,200}$/.test(name)) throw badRequest('Give the file name (1–200 characters, no slashes).', 'name');
  if (req.contentLength != null && req.contentLength > limit) throw tooLarge(name, limit);
  if (!req.body) throw badRequest(`${name} is empty.`, 'file');
  const reader = req.body.getReader();
  // Peek at the first bytes to tell the layouts apart.
  let first = await reader.read();
  while (!first.done && first.value.length === 0) first = await reader.read();
  if (first.done) throw badRequest(`${name} is empty.`, 'file');
  let format: uploads.UploadFormat;
  try {
    format = sniffFormat(name, new TextDecoder().decode(first.value.subarray(0, 4096)));
  } catch (e) {
    await reader.cancel().catch(() => {});
    if (e instanceof FileProblem) throw badRequest(e.message, e.field);
    throw e;
  }

  const result = await uploads
    .storeUpload(
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
        async function* tap(): AsyncGenerator<Uint8Array> {
          let chunk: ReadableStreamReadResult<Uint8Array> = first;
          while (!chunk.done) {
            size += chunk.value.length;
            if (size > limit) throw tooLarge(name, limit);
            hash.update(chunk.value);
            await writer.append(Buffer.from(chunk.value));
            yield chunk.value;
            chunk = await reader.read();
          }
        }
        const stream = tap();
        try {
          await checkFile(format, stream, { fileName: name, station: req.station });
        } catch (e) {
          if (e instanceof FileProblem) throw badRequest(e.message, e.field);
          throw e;
        }
        for await (const _ of stream) {
          /* the parser may stop early: take in the rest */
        }
        return { sha256: hash.digest('hex'), sizeBytes: size };
      },
    )
    .finally(() => reader.cancel().catch(() => {}));

  if (!result.duplicate) await queueProcessing(result.upload.id);
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
