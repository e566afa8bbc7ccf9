/** Cavity configuration and the resolved cavity the engine computes with. */

/** A user propagation table: rows of [f Hz, c/V, attenuation dB/Mm] or [f Hz, Re nu, Im nu]. */
export type CavityTable =
  { columns: 'speed-attenuation'; rows: [number, number, number][] } | { columns: 'nu'; rows: [number, number, number][] };

export type CavityModelName = 'linear' | 'ishaq-jones' | 'table';

export type CavityConfig = {
  model: CavityModelName;
  /** Earth radius, km. */
  earthRadiusKm: number;
  /** Effective height of the cavity, km. */
  heightKm: number;
  /** Required when model = 'table'. */
  table?: CavityTable;
};

/** A value of the complex propagation parameter nu; time dependence exp(+i w t), Im nu < 0. */
export type Nu = { re: number; im: number };

export type CavityDescription = { name: string; parameters: Record<string, number | string> };

export interface Cavity {
  readonly config: CavityConfig;
  /** Earth radius in metres. */
  readonly radiusM: number;
  /** Effective height in metres. */
  readonly heightM: number;
  /** Cache key: equal keys mean identical physics. */
  readonly key: string;
  /** Frequencies (Hz) outside which nu(f) is undefined (table model); [0, Infinity] otherwise. */
  readonly validHz: readonly [number, number];
  nu(fHz: number): Nu;
  describe(): CavityDescription;
}
