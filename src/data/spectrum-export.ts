/**
 * One stored interval's spectrum as a file in the Cavitas spectra layout
 * (power in SI units: (V/m)^2/Hz for Ez, T^2/Hz for Bns and Bew), which the
 * station upload reads back.
 */
import { writeSpectraCsv } from '@/src/engine/formats/spectra-csv-write';
import { notFound } from '@/src/server/errors';
import { getIntervalSpectra } from './intervals';
import { INTERVAL_SECONDS } from './interval-processing';

const SI_UNITS = { Ez: '(V/m)^2/Hz', Bns: 'T^2/Hz', Bew: 'T^2/Hz' } as const;

export async function intervalSpectrumCsv(networkId: string, intervalId: string): Promise<{ file: string; text: string }> {
  const [s] = await getIntervalSpectra({ networkId, intervalIds: [intervalId], includeFlagged: true });
  if (!s) throw notFound('No such interval in this network, or it has no stored spectrum.');
  const start = s.startsAt.toISOString().replace('.000Z', 'Z');
  const text = writeSpectraCsv({
    station: s.stationCode,
    component: s.component,
    units: SI_UNITS[s.component],
    intervalSeconds: INTERVAL_SECONDS,
    frequencies: s.frequencies,
    intervals: [{ startUtc: start, power: s.power }],
  });
  const stamp = start.slice(0, 16).replace(/[-:]/g, '');
  return { file: `cavitas-spectrum-${s.stationCode}-${s.component}-${stamp}.csv`, text };
}
