/**
 * The processing driver the worker calls for one stored upload: reads the
 * bytes back chunk by chunk, lets the format's reader cut them into
 * intervals, processes each (calibration, Welch, transient rejection, line
 * suppression, mode fit, quality flags) and saves them in batches with the
 * progress. A failure marks the upload failed with the reason and removes
 * the intervals it had saved, so an upload counts whole or not at all.
 */
import * as uploads from '@/db/repo/uploads';
import { getStation } from '@/db/repo/stations';
import { deleteIntervalsOfUpload, saveIntervals, type IntervalResultInput } from '@/db/repo/intervals';
import { readUploadIntervals } from './file-reading';
import { processRawInterval } from './interval-processing';

/** Intervals saved per database round trip (and per progress update). */
const SAVE_BATCH = 24;

export type ProcessOutcome = 'done' | 'failed' | 'skipped';

export async function processUpload(uploadId: string, hooks: { shouldStop?: () => boolean } = {}): Promise<ProcessOutcome> {
  const upload = await uploads.beginProcessing(uploadId);
  if (!upload) return 'skipped'; // not queued: already taken, finished or deleted
  try {
    const station = await getStation(upload.networkId, upload.stationId);
    if (!station) throw new Error('the station of this upload no longer exists');
    const total = Math.max(1, upload.sizeBytes);
    let consumed = 0;
    async function* counted(): AsyncGenerator<Buffer> {
      for await (const chunk of uploads.readUploadBytes(uploadId)) {
        consumed += chunk.length;
        yield chunk;
      }
    }
    let batch: IntervalResultInput[] = [];
    let count = 0;
    const flush = async () => {
      if (!batch.length) return;
      await saveIntervals(batch);
      count += batch.length;
      batch = [];
      await uploads.setProgress(uploadId, Math.min(0.99, consumed / total), `${count} intervals processed`);
    };
    await uploads.setProgress(uploadId, 0, 'reading the file');
    for await (const raw of readUploadIntervals(upload.format, counted(), { fileName: upload.fileName, station })) {
      if (hooks.shouldStop?.()) throw new Error('processing was stopped; use "Process again" to restart it');
      batch.push({ ...processRawInterval(station, raw), uploadId, origin: 'upload' });
      if (batch.length >= SAVE_BATCH) await flush();
    }
    await flush();
    if (count === 0) throw new Error(`${upload.fileName} holds no complete 10-minute interval`);
    await uploads.finishUpload(uploadId, count);
    return 'done';
  } catch (e) {
    const reason = e instanceof Error ? e.message : String(e);
    await deleteIntervalsOfUpload(uploadId).catch(() => 0);
    await uploads.failUpload(uploadId, reason);
    return 'failed';
  }
}
