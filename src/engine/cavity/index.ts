export * from './types';
export { resolveCavity } from './resolve';
export { cavityConfigSchema, cavityTableSchema } from './schema';
export { nuFromSpeedAttenuation, speedAttenuationFromNu } from './propagation';
export { linearNu } from './linear';
export { ishaqJonesNu, ishaqJonesSpeed, ishaqJonesAttenuation } from './ishaq-jones';
export { tableNu, tableProblems } from './table';
