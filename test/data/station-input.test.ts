/**
 * The station form schema names the bad field. Coordinate ranges are the
 * geographic convention (latitude -90..90, longitude -180..180; common practice);
 * mains is 50 or 60 Hz (the two public supply frequencies in use; common practice).
 */
import { describe, expect, it } from 'vitest';
import { stationInputSchema } from '@/src/data/station-input';

const ok = {
  code: 'AB1',
  name: 'Invented hut',
  latitude: 10,
  longitude: 20,
  mainsHz: 50,
  sampleRateHz: 200,
  components: [{ component: 'Ez', calibration: { kind: 'gain', gain: 2 } }],
};
const firstIssue = (v: unknown) => {
  const r = stationInputSchema.safeParse(v);
  return r.success ? null : { path: r.error.issues[0].path.join('.'), message: r.error.issues[0].message };
};

describe('station input', () => {
  it('accepts a minimal station and fills the defaults', () => {
    const r = stationInputSchema.parse(ok);
    expect(r).toMatchObject({ elevationM: null, interferenceLines: [], notes: '', status: 'operating' });
  });

  it.each([
    [{ latitude: 90.01 }, 'latitude', /between -90 and 90/],
    [{ latitude: null }, 'latitude', /give the latitude/],
    [{ longitude: -180.5 }, 'longitude', /between -180 and 180/],
    [{ mainsHz: 55 }, 'mainsHz', /50 or 60/],
    [{ sampleRateHz: 0 }, 'sampleRateHz', /positive/],
    [{ code: 'ab' }, 'code', /capital letters/],
    [{ components: [] }, 'components', /at least one/],
    [{ components: [ok.components[0], ok.components[0]] }, 'components', /once/],
    [{ components: [{ component: 'Ez', calibration: { kind: 'gain', gain: -1 } }] }, 'components.0.calibration.gain', /positive/],
    [
      {
        components: [
          {
            component: 'Bns',
            calibration: {
              kind: 'response',
              points: [
                { frequencyHz: 10, amplitude: 1, phaseDeg: 0 },
                { frequencyHz: 5, amplitude: 1, phaseDeg: 0 },
              ],
            },
          },
        ],
      },
      'components.0.calibration.points',
      /increase/,
    ],
  ])('refuses %j naming %s', (patch, path, message) => {
    const issue = firstIssue({ ...ok, ...patch });
    expect(issue?.path).toBe(path);
    expect(issue?.message).toMatch(message);
  });
});
