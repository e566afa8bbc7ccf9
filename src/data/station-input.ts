/**
 * The station form as the API accepts it: zod schema with ranges checked, so
 * every bad field comes back named (e.g. `latitude`, `components.1.calibration.gain`).
 */
import { z } from 'zod';

import { COMPONENTS } from '@/src/engine/components';

const responsePoint = z.object({
  frequencyHz: z.number().finite().positive('must be a positive frequency in Hz'),
  amplitude: z.number().finite().positive('must be a positive amplitude'),
  phaseDeg: z.number().finite().min(-360).max(360),
});

export const calibrationSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('gain'), gain: z.number().finite().positive('must be a positive gain') }),
  z.object({
    kind: z.literal('response'),
    points: z
      .array(responsePoint)
      .min(2, 'a response table needs at least two frequencies')
      .max(2000)
      .refine(
        (p) => p.every((x, i) => i === 0 || x.frequencyHz > p[i - 1].frequencyHz),
        'frequencies must increase from row to row',
      ),
  }),
]);

export const stationInputSchema = z.object({
  code: z
    .string()
    .trim()
    .regex(/^[A-Z0-9][A-Z0-9_-]{1,11}$/, 'use 2–12 capital letters, digits, "-" or "_" (e.g. KV2)'),
  name: z.string().trim().min(1, 'give the station a name').max(120),
  latitude: z
    .number({ message: 'give the latitude in degrees (north positive)' })
    .finite()
    .min(-90, 'latitude is between -90 and 90')
    .max(90, 'latitude is between -90 and 90'),
  longitude: z
    .number({ message: 'give the longitude in degrees (east positive)' })
    .finite()
    .min(-180, 'longitude is between -180 and 180')
    .max(180, 'longitude is between -180 and 180'),
  elevationM: z
    .number({ message: 'give the elevation in metres, or leave it empty' })
    .finite()
    .min(-500)
    .max(9000)
    .nullable()
    .default(null),
  mainsHz: z.union([z.literal(50), z.literal(60)], { message: 'mains frequency is 50 or 60 Hz' }),
  interferenceLines: z
    .array(
      z.object({
        frequencyHz: z.number().finite().positive().max(1000),
        label: z.string().trim().min(1).max(80),
      }),
    )
    .max(20)
    .default([]),
  sampleRateHz: z
    .number({ message: 'give the sampling rate in Hz' })
    .finite()
    .positive('sample rate must be positive')
    .max(100000),
  notes: z.string().max(4000).default(''),
  status: z.enum(['operating', 'paused', 'retired']).default('operating'),
  components: z
    .array(z.object({ component: z.enum(COMPONENTS), calibration: calibrationSchema }))
    .min(1, 'install at least one component')
    .refine((c) => new Set(c.map((x) => x.component)).size === c.length, 'each component may be listed once'),
});

export type StationInputBody = z.infer<typeof stationInputSchema>;
