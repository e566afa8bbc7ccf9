/**
 * What the demo network's overview tells a newcomer: that the network is the invented demo,
 * which of its seeded runs are finished, and where to look first. Null for any other network.
 */
import { listRuns } from '@/db/repo/runs';
import { getStationByCode } from '@/db/repo/stations';
import { DEMO_NETWORK_NAME } from './accounts';
import { DEMO_MODE_RUN, DEMO_RUN } from './runs';
import { DEMO_DAY, DEMO_STATIONS } from './stations';

/** The station the overview points to first: three components, a mains line, a mountain site. */
const FIRST_STATION = 'BRQ';

export interface DemoGuide {
  day: string;
  stationCount: number;
  /** The seeded runs that are finished, the spectrum run first. */
  finishedRuns: { id: string; name: string }[];
  station: { id: string; code: string; name: string } | null;
}

export async function demoGuide(networkId: string, networkName: string): Promise<DemoGuide | null> {
  if (networkName !== DEMO_NETWORK_NAME) return null;
  const [runs, station] = await Promise.all([listRuns(networkId), getStationByCode(networkId, FIRST_STATION)]);
  const finishedRuns = [DEMO_RUN, DEMO_MODE_RUN]
    .map((name) => runs.find((r) => r.name === name && r.state === 'finished'))
    .filter((r) => r !== undefined)
    .map((r) => ({ id: r.id, name: r.name }));
  return {
    day: DEMO_DAY,
    stationCount: DEMO_STATIONS.length,
    finishedRuns,
    station: station ? { id: station.id, code: station.code, name: station.name } : null,
  };
}
