/**
 * Station push: one 10-minute interval of raw samples per request, for one or
 * more components, processed at once and stored with a checksum of its samples.
 * The same interval sent again with the same samples changes nothing (retries by
 * the station computer are harmless); with other samples it is refused (409)
 * naming the interval and the stored checksum.
 */
import { createHash } from 'node:crypto';
import { z } from 'zod';
import { getStation } from '@/db/repo/stations';
import { listIntervals, saveIntervals, storedAt } from '@/db/repo/intervals';
import { badRequest, conflict, notFound } from '@/src/server/errors';
import { processRawInterval, INTERVAL_SECONDS } from './interval-processing';
import { COMPONENTS } from '@/src/engine/components';
import { outsideSampleWindow } from './limits';
import { readLimitedText } from '@/src/server/body-limit';

/** Largest push body accepted (bytes): three components at a few hundred Hz fit easily. */
export const PUSH_MAX_BYTES = 32 * 1024 * 1024;

/** The request body as text, refusing more than PUSH_MAX_BYTES whether announced or streamed. */
export function readPushBody(req: Request): Promise<string> {
  return readLimitedText(
    req,
    PUSH_MAX_BYTES,
    () => `A push may carry at most ${PUSH_MAX_BYTES >> 20} MB; send one interval per request.`,
  );
}

/** SHA-256 of pushed samples as float64 little-endian, a missing sample (null) as NaN. */
export function samplesChecksum(samples: (number | null)[]): string {
  const values = Float64Array.from(samples, (v) => (v === null ? NaN : v));
  const bytes = Buffer.alloc(values.length * 8);
  values.forEach((v, i) => bytes.writeDoubleLE(v, i * 8));
  return createHash('sha256').update(bytes).digest('hex');
}

const sample = z.union([z.number(), z.null()]);
export const pushBodySchema = z.object({
  startsAt: z.iso.datetime({ message: 'give the interval start as an ISO time in UTC, e.g. 2026-03-14T06:20:00Z' }),
  sampleRateHz: z.number().positive().finite(),
  components: z
    .partialRecord(z.enum(COMPONENTS), z.array(sample).min(1))
    .refine((c) => Object.keys(c).length > 0, 'send at least one component (Ez, Bns or Bew)'),
});
export type PushBody = z.infer<typeof pushBodySchema>;

export async function receivePush(token: { networkId: string; stationId: string }, body: PushBody) {
  const station = await getStation(token.networkId, token.stationId);
  if (!station) throw notFound('The station of this token no longer exists.');
  const startsAt = new Date(body.startsAt);
  if (startsAt.getTime() % (INTERVAL_SECONDS * 1000) !== 0) {
    throw badRequest('Intervals start on a 10-minute boundary of UTC (e.g. 06:20:00Z).', 'startsAt');
  }
  if (startsAt.getTime() > Date.now() + 15 * 60_000)
    throw badRequest('This interval starts in the future; check the station clock.', 'startsAt');
  const outside = outsideSampleWindow(startsAt.getTime());
  if (outside) throw badRequest(`startsAt ${outside}.`, 'startsAt');
  if (Math.abs(body.sampleRateHz - station.sampleRateHz) > 1e-9 * station.sampleRateHz) {
    throw badRequest(
      `The station ${station.code} is registered at ${station.sampleRateHz} Hz, not ${body.sampleRateHz} Hz.`,
      'sampleRateHz',
    );
  }
  const expected = Math.round(body.sampleRateHz * INTERVAL_SECONDS);
  const installed = new Set(station.components.map((c) => c.component));
  const entries = Object.entries(body.components) as [(typeof COMPONENTS)[number], (number | null)[]][];
  for (const [component, samples] of entries) {
    if (!installed.has(component))
      throw badRequest(`${station.code} has no ${component} component installed.`, `components.${component}`);
    if (samples.length !== expected) {
      throw badRequest(
        `${component} has ${samples.length} samples; 10 minutes at ${body.sampleRateHz} Hz are ${expected} (send null for a missing sample).`,
        `components.${component}`,
      );
    }
  }
  // The same interval sent again with the same samples changes nothing (200); with other samples,
  // or over an interval stored from a file, it is a conflict that names what is stored (409).
  const stored = new Map((await storedAt(station.id, startsAt)).map((r) => [r.component, r]));
  const sums = new Map(entries.map(([component, samples]) => [component, samplesChecksum(samples)]));
  for (const [component] of entries) {
    const have = stored.get(component);
    if (!have || have.samplesSha256 === sums.get(component)) continue;
    const what = `${station.code} ${component} ${startsAt.toISOString()}`;
    throw conflict(
      have.samplesSha256
        ? `The interval ${what} is already stored with other samples (stored checksum sha256:${have.samplesSha256}, this push sha256:${sums.get(component)}); it was not replaced. Delete the stored interval first to replace it.`
        : `The interval ${what} is already stored from ${have.origin === 'upload' ? 'an uploaded file' : 'synthetic data'} (no sample checksum); it was not replaced.`,
      `components.${component}`,
    );
  }
  const fresh = entries.filter(([component]) => !stored.has(component));
  const results = fresh.map(([component, samples]) => ({
    ...processRawInterval(station, {
      kind: 'samples',
      component,
      startsAt,
      durationS: INTERVAL_SECONDS,
      sampleRateHz: body.sampleRateHz,
      samples: Float64Array.from(samples, (v) => (v === null ? NaN : v)),
    }),
    origin: 'push' as const,
    uploadId: null,
    samplesSha256: sums.get(component)!,
  }));
  const saved = results.length ? await saveIntervals(results) : [];
  const again =
    entries.length === fresh.length
      ? []
      : await listIntervals({
          networkId: station.networkId,
          stationIds: [station.id],
          from: startsAt,
          to: new Date(startsAt.getTime() + 1),
        });
  return {
    station: station.code,
    intervals: entries.map(([component]) => {
      const k = results.findIndex((r) => r.component === component);
      if (k >= 0)
        return {
          id: saved[k].id,
          component,
          startsAt: startsAt.toISOString(),
          created: saved[k].created,
          samplesSha256: sums.get(component)!,
          qualityFlags: results[k].qualityFlags,
          modes: results[k].fit?.modes.length ?? 0,
        };
      const row = again.find((r) => r.component === component)!;
      return {
        id: row.id,
        component,
        startsAt: startsAt.toISOString(),
        created: false,
        samplesSha256: sums.get(component)!,
        qualityFlags: row.qualityFlags,
        modes: row.fit?.modes.length ?? 0,
      };
    }),
  };
}
