// Loads the TypeScript pool worker inside a worker thread: registers tsx's
// ESM loader (tsx/esm/api) for this thread, then imports the worker module.
import { register } from 'tsx/esm/api';

register();
const mod = await import('./pool-worker.ts');
export default mod.default;
