/** Process lifecycle for code outside db/: close this process's database pool before exiting. */
export { closeDb as closeDatabase } from './client';
