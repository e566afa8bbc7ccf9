/**
 * Raw station files: stored as bytea chunks beside an uploads row with the
 * file's SHA-256, so a re-sent file is recognised; processing state lives on
 * the same row.
 */
import { and, asc, desc, eq, or, sql } from 'drizzle-orm';
import { getDb } from '../client';
import { uploads, uploadChunks, stations } from '../schema/stations';

export type UploadRow = typeof uploads.$inferSelect;
export type UploadFormat = UploadRow['format'];

export interface UploadMeta {
  networkId: string;
  stationId: string;
  uploadedBy: string | null;
  fileName: string;
  format: UploadFormat;
}

/** Appends bytes to the upload being stored (inside its transaction). */
export interface UploadWriter {
  append(bytes: Buffer): Promise<void>;
}

/** Size of one stored chunk (bytes). */
export const UPLOAD_CHUNK_BYTES = 1 << 20;

class Duplicate extends Error {
  constructor(readonly existing: UploadRow) {
    super('duplicate upload');
  }
}

/**
 * Stores an upload in one transaction. `fill` streams the bytes through the
 * writer and returns the checksum and size once the whole file passed its
 * checks; if it throws, nothing is stored. If the network already holds a file
 * with the same checksum, nothing new is stored and that upload is returned.
 */
export async function storeUpload(
  meta: UploadMeta,
  fill: (writer: UploadWriter) => Promise<{ sha256: string; sizeBytes: number; warnings?: string[] }>,
): Promise<{ upload: UploadRow; duplicate: boolean }> {
  let checksum: string | null = null;
  try {
    const upload = await getDb().transaction(async (tx) => {
      const [row] = await tx
        .insert(uploads)
        .values({ ...meta, sha256: `pending:${crypto.randomUUID()}`, sizeBytes: 0 })
        .returning();
      let seq = 0;
      let pending: Buffer[] = [];
      let pendingBytes = 0;
      const flush = async () => {
        if (pendingBytes === 0) return;
        await tx.insert(uploadChunks).values({ uploadId: row.id, seq: seq++, data: Buffer.concat(pending) });
        pending = [];
        pendingBytes = 0;
      };
      const {
        sha256,
        sizeBytes,
        warnings = [],
      } = await fill({
        async append(bytes) {
          pending.push(bytes);
          pendingBytes += bytes.length;
          if (pendingBytes >= UPLOAD_CHUNK_BYTES) await flush();
        },
      });
      await flush();
      checksum = sha256;
      const [existing] = await tx
        .select()
        .from(uploads)
        .where(and(eq(uploads.networkId, meta.networkId), eq(uploads.sha256, sha256)));
      if (existing) throw new Duplicate(existing);
      const [done] = await tx.update(uploads).set({ sha256, sizeBytes, warnings }).where(eq(uploads.id, row.id)).returning();
      return done;
    });
    return { upload, duplicate: false };
  } catch (e) {
    if (e instanceof Duplicate) return { upload: e.existing, duplicate: true };
    // The same file committed by a parallel request between our check and our commit (23505 unique_violation).
    const code = (e as { code?: string; cause?: { code?: string } }).code ?? (e as { cause?: { code?: string } }).cause?.code;
    if (code === '23505' && checksum) {
      const [existing] = await getDb()
        .select()
        .from(uploads)
        .where(and(eq(uploads.networkId, meta.networkId), eq(uploads.sha256, checksum)));
      if (existing) return { upload: existing, duplicate: true };
    }
    throw e;
  }
}

/** The stored bytes of an upload, one chunk at a time (memory stays at one chunk). */
export async function* readUploadBytes(uploadId: string): AsyncGenerator<Buffer> {
  const db = getDb();
  const seqs = await db
    .select({ seq: uploadChunks.seq })
    .from(uploadChunks)
    .where(eq(uploadChunks.uploadId, uploadId))
    .orderBy(asc(uploadChunks.seq));
  for (const { seq } of seqs) {
    const [c] = await db
      .select({ data: uploadChunks.data })
      .from(uploadChunks)
      .where(and(eq(uploadChunks.uploadId, uploadId), eq(uploadChunks.seq, seq)));
    yield c.data;
  }
}

export async function getUpload(networkId: string, uploadId: string): Promise<UploadRow | null> {
  const [row] = await getDb()
    .select()
    .from(uploads)
    .where(and(eq(uploads.id, uploadId), eq(uploads.networkId, networkId)));
  return row ?? null;
}

/** Upload by id alone, for the worker (which gets ids from its own queue). */
export async function getUploadById(uploadId: string): Promise<UploadRow | null> {
  const [row] = await getDb().select().from(uploads).where(eq(uploads.id, uploadId));
  return row ?? null;
}

export type UploadListItem = UploadRow & { stationCode: string };

export async function listUploads(networkId: string, stationId?: string): Promise<UploadListItem[]> {
  const where = stationId
    ? and(eq(uploads.networkId, networkId), eq(uploads.stationId, stationId))
    : eq(uploads.networkId, networkId);
  const rows = await getDb()
    .select({ u: uploads, stationCode: stations.code })
    .from(uploads)
    .innerJoin(stations, eq(stations.id, uploads.stationId))
    .where(where)
    .orderBy(desc(uploads.createdAt))
    .limit(500);
  return rows.map((r) => ({ ...r.u, stationCode: r.stationCode }));
}

/** Claims an upload for processing; null if it is not queued (already taken or finished). */
export async function beginProcessing(uploadId: string): Promise<UploadRow | null> {
  const [row] = await getDb()
    .update(uploads)
    .set({
      state: 'processing',
      startedAt: new Date(),
      finishedAt: null,
      error: null,
      progress: 0,
      progressNote: 'starting',
      attempts: sql`${uploads.attempts} + 1`,
    })
    .where(and(eq(uploads.id, uploadId), eq(uploads.state, 'queued')))
    .returning();
  return row ?? null;
}

export async function setProgress(uploadId: string, progress: number, note: string): Promise<void> {
  await getDb().update(uploads).set({ progress, progressNote: note }).where(eq(uploads.id, uploadId));
}

export async function finishUpload(uploadId: string, intervalCount: number): Promise<void> {
  await getDb()
    .update(uploads)
    .set({
      state: 'done',
      progress: 1,
      progressNote: 'done',
      intervalCount,
      finishedAt: new Date(),
    })
    .where(eq(uploads.id, uploadId));
}

export async function failUpload(uploadId: string, reason: string): Promise<void> {
  await getDb()
    .update(uploads)
    .set({
      state: 'failed',
      error: reason,
      progressNote: 'failed',
      finishedAt: new Date(),
    })
    .where(eq(uploads.id, uploadId));
}

/** Seconds after which an upload still "processing" counts as abandoned (its worker stopped). */
export const ABANDONED_AFTER_S = 3600;

/** Puts a failed (or abandoned) upload back in the queue; null when it is neither. */
export async function requeueFailed(networkId: string, uploadId: string): Promise<UploadRow | null> {
  const [row] = await getDb()
    .update(uploads)
    .set({
      state: 'queued',
      error: null,
      progress: 0,
      progressNote: 'queued again',
      finishedAt: null,
    })
    .where(
      and(
        eq(uploads.id, uploadId),
        eq(uploads.networkId, networkId),
        or(
          eq(uploads.state, 'failed'),
          and(
            eq(uploads.state, 'processing'),
            sql`${uploads.startedAt} < now() - make_interval(secs => ${ABANDONED_AFTER_S}::float8)`,
          ),
        ),
      ),
    )
    .returning();
  return row ?? null;
}

/** Deletes an upload and its bytes (intervals made from it stay, losing the link). */
export async function deleteUpload(networkId: string, uploadId: string): Promise<boolean> {
  const rows = await getDb()
    .delete(uploads)
    .where(and(eq(uploads.id, uploadId), eq(uploads.networkId, networkId)))
    .returning({ id: uploads.id });
  return rows.length > 0;
}
