/**
 * The job kinds the worker process serves. Owners add one import and one list entry for
 * each file in src/worker/jobs/.
 */
import type { JobDefinition } from './types';
import { job as runInversion } from './jobs/run-inversion';
import { job as misfitSurface } from './jobs/misfit-surface';
import { job as processUpload } from './jobs/process-upload';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export const jobs: JobDefinition<any>[] = [runInversion, misfitSurface, processUpload];
