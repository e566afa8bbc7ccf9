/** The one moving region of the run figure tests: "Belt", free over 20° S–20° N, 0–40° E. */
import type { Region } from '@/src/runs/grid-spec';

export const beltRegion = (colour: string, spreadDeg: number): Region => ({
  key: 'belt',
  name: 'Belt',
  colour,
  kind: 'moving',
  centre: { lat: 0, lon: 20 },
  bounds: { lat: { min: -20, max: 20 }, lon: { min: 0, max: 40 } },
  spreadDeg,
});
