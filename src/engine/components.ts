/** Field components a station records: the one list every schema, table and form uses. */
export const COMPONENTS = ['Ez', 'Bns', 'Bew'] as const;
export type Component = (typeof COMPONENTS)[number];

/** Human description and units of each component (SI and display). */
export const COMPONENT_INFO: Record<Component, { label: string; siUnit: string; displayUnit: string }> = {
  Ez: { label: 'vertical electric field', siUnit: '(V/m)^2/Hz', displayUnit: '(mV/m)^2/Hz' },
  Bns: { label: 'horizontal magnetic field, north–south coil', siUnit: 'T^2/Hz', displayUnit: 'pT^2/Hz' },
  Bew: { label: 'horizontal magnetic field, east–west coil', siUnit: 'T^2/Hz', displayUnit: 'pT^2/Hz' },
};

export function isMagnetic(c: Component): boolean {
  return c !== 'Ez';
}
