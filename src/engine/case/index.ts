export {
  caseSchema,
  forwardCaseSchema,
  invertCaseSchema,
  bandSchema,
  stationSchema,
  sourceSchema,
  observedSchema,
  unknownSchema,
} from './schema';
export type { CaseFile } from './schema';
export { forwardSources } from './sources';
