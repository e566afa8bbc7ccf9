/**
 * Test scaffolding for the data area: a user, a network owned by them, and a
 * station with invented values (no real site).
 */
import { randomUUID } from 'node:crypto';
import { insertUser } from '@/db/repo/users';
import { createNetwork } from '@/db/repo/networks';
import { createStation, type StationInput } from '@/db/repo/stations';

export function stationInput(over: Partial<StationInput> = {}): StationInput {
  return {
    code: 'TST1',
    name: 'Test hut one',
    latitude: 12.5,
    longitude: -40.25,
    elevationM: 120,
    mainsHz: 50,
    interferenceLines: [{ frequencyHz: 16.7, label: 'railway supply' }],
    sampleRateHz: 200,
    notes: '',
    status: 'operating',
    components: [
      { component: 'Ez', calibration: { kind: 'gain', gain: 2 } },
      { component: 'Bns', calibration: { kind: 'gain', gain: 1e9 } },
    ],
    ...over,
  };
}

export async function makeWorld(stationOver: Partial<StationInput> = {}) {
  const userId = `u-${randomUUID()}`;
  await insertUser({ id: userId, email: `${userId}@example.test`, name: 'Tester', passwordHash: 'x' });
  const network = await createNetwork(`net ${userId}`, userId);
  const station = await createStation(network.id, stationInput(stationOver));
  return { userId, networkId: network.id, station };
}
