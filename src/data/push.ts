/**
 * Station push: one 10-minute interval of raw samples per request, for one or
 * more components, processed at once and stored. The same interval sent again
 * replaces itself (one row per station, component and start), so retries by
 * the station computer are harmless.
 */
import { z } from 'zod';
import { getStation } from '@/db/repo/stations';
import { saveIntervals } from '@/db/repo/intervals';
import { AppError, badRequest, notFound } from '@/src/server/errors';
import { processRawInterval, INTERVAL_SECONDS } from './interval-processing';
import { COMPONENTS } from './station-input';
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
  const results = entries.map(([component, samples]) => ({
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
  }));
  const saved = await saveIntervals(results);
  return {
    station: station.code,
    intervals: saved.map((s, i) => ({
      id: s.id,
      component: results[i].component,
      startsAt: startsAt.toISOString(),
      created: s.created,
      qualityFlags: results[i].qualityFlags,
      modes: results[i].fit?.modes.length ?? 0,
    })),
  };
}
