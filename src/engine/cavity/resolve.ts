/** Turns a cavity configuration into a cavity: nu(f), cache key, description. */
import { KM } from '../constants';
import { ishaqJonesNu } from './ishaq-jones';
import { linearNu } from './linear';
import { tableNu, tableProblems } from './table';
import type { Cavity, CavityConfig, CavityDescription, Nu } from './types';

export function resolveCavity(config: CavityConfig): Cavity {
  const { earthRadiusKm, heightKm } = config;
  if (!(earthRadiusKm > 0) || !Number.isFinite(earthRadiusKm))
    throw new RangeError(`cavity.earthRadiusKm must be above 0, got ${earthRadiusKm}`);
  if (!(heightKm > 0) || !Number.isFinite(heightKm)) throw new RangeError(`cavity.heightKm must be above 0, got ${heightKm}`);
  const radiusM = earthRadiusKm * KM;
  const heightM = heightKm * KM;
  const common = { earthRadiusKm, heightKm };
  let nu: (f: number) => Nu;
  let description: CavityDescription;
  let validHz: [number, number] = [0, Infinity];
  switch (config.model) {
    case 'linear':
      nu = linearNu;
      description = { name: 'linear', parameters: { formula: 'nu = (f - 2)/6 - i f/70', ...common } };
      break;
    case 'ishaq-jones':
      nu = (f) => ishaqJonesNu(f, radiusM);
      description = {
        name: 'ishaq-jones',
        parameters: {
          speed: 'c/V = 1.64 - 0.1759 ln f + 0.01791 (ln f)^2',
          attenuation: 'alpha = 0.063 f^0.64 dB/Mm',
          ...common,
        },
      };
      break;
    case 'table': {
      const table = config.table;
      if (!table) throw new RangeError('cavity.table is required when cavity.model is "table"');
      const problems = tableProblems(table);
      if (problems.length) throw new RangeError(`cavity.table.${problems[0].path.join('.')}: ${problems[0].message}`);
      nu = tableNu(table, radiusM);
      validHz = [table.rows[0][0], table.rows[table.rows.length - 1][0]];
      description = {
        name: 'table',
        parameters: {
          columns: table.columns,
          rows: table.rows.length,
          fromHz: validHz[0],
          toHz: validHz[1],
          interpolation: 'linear in f',
          ...common,
        },
      };
      break;
    }
    default:
      throw new RangeError(`unknown cavity.model "${(config as { model: string }).model}"`);
  }
  const key = JSON.stringify({
    m: config.model,
    a: earthRadiusKm,
    h: heightKm,
    t: config.model === 'table' ? config.table : undefined,
  });
  return { config, radiusM, heightM, key, validHz, nu, describe: () => description };
}
