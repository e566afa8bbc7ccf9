/**
 * Production build on demand: `next build` runs only when `.next/BUILD_ID` is missing or older
 * than the newest source or configuration file, and only one build runs at a time on this
 * machine (flock on /tmp/cavitas-next.lock; whoever waited re-checks and usually skips).
 *
 * `npx tsx src/ops/build.ts` builds if stale.
 */
import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { NEXT_LOCK, nextBin, projectRoot, runAsScript } from './paths';
import { childEnv } from '@/src/settings';

/** Everything a production build depends on. */
export const BUILD_INPUTS = [
  'app',
  'src',
  'db',
  'public',
  'next.config.mjs',
  'postcss.config.mjs',
  'tsconfig.json',
  'package.json',
  'package-lock.json',
];
const SKIP = new Set(['node_modules', '.next', '.data', '.git']);

/** Newest modification time (ms) of any file under `p`, or 0 when it does not exist. */
export function newestMtime(p: string): number {
  let st: fs.Stats;
  try {
    st = fs.lstatSync(p);
  } catch {
    return 0;
  }
  if (!st.isDirectory()) return st.isFile() ? st.mtimeMs : 0;
  let newest = st.mtimeMs; // a deleted file shows up as a newer folder mtime
  for (const name of fs.readdirSync(p)) {
    if (SKIP.has(name)) continue;
    newest = Math.max(newest, newestMtime(path.join(p, name)));
  }
  return newest;
}

export interface Staleness {
  stale: boolean;
  reason: string;
}

export function buildStaleness(root = projectRoot): Staleness {
  const buildId = path.join(root, '.next', 'BUILD_ID');
  if (!fs.existsSync(buildId)) return { stale: true, reason: 'no production build yet' };
  const built = fs.statSync(buildId).mtimeMs;
  for (const input of BUILD_INPUTS) {
    if (newestMtime(path.join(root, input)) > built) return { stale: true, reason: `${input} changed since the last build` };
  }
  return { stale: false, reason: 'build is up to date' };
}

/** Runs `next build` in this process's folder if stale (call while holding the lock). */
function buildNowIfStale(env: NodeJS.ProcessEnv, log: (l: string) => void): void {
  const s = buildStaleness();
  if (!s.stale) return;
  log(`[build] ${s.reason}: running next build…`);
  const r = spawnSync(process.execPath, [nextBin, 'build'], {
    cwd: projectRoot,
    stdio: 'inherit',
    env: { ...env, NEXT_TELEMETRY_DISABLED: '1' },
  });
  if (r.status !== 0) throw new Error(`next build failed (exit ${r.status}); fix the errors above and start again`);
}

/** Builds if stale, holding the machine-wide build lock. */
export function buildIfStale(env: NodeJS.ProcessEnv = childEnv(), log: (l: string) => void = console.log): void {
  if (!buildStaleness().stale) return;
  log(`[build] waiting for the build lock ${NEXT_LOCK}…`);
  const r = spawnSync(
    'flock',
    [NEXT_LOCK, process.execPath, '--import', 'tsx', path.join(projectRoot, 'src', 'ops', 'build.ts'), '--locked'],
    {
      cwd: projectRoot,
      stdio: 'inherit',
      env,
    },
  );
  if (r.error) throw new Error(`cannot run flock (util-linux): ${r.error.message}`);
  if (r.status !== 0) throw new Error(`production build failed (exit ${r.status})`);
}

/**
 * Holds a SHARED lock on the build lock file until the returned release() is called (or this
 * process ends), so no `next build` replaces `.next` under a server that is serving it. Used by
 * the browser-test harness; builds (exclusive) wait until it is released.
 */
export function holdSharedBuildLock(lockFile = NEXT_LOCK): Promise<() => void> {
  return new Promise((resolve, reject) => {
    // `cat` keeps the lock until its stdin closes, which also happens if we die.
    const child = spawn('flock', ['-s', lockFile, 'sh', '-c', 'echo locked; exec cat'], { stdio: ['pipe', 'pipe', 'inherit'] });
    child.once('error', (err) => reject(new Error(`cannot run flock (util-linux): ${err.message}`)));
    child.stdout.once('data', () =>
      resolve(() => {
        child.stdin.end();
        child.kill('SIGTERM');
      }),
    );
    child.once('exit', (code) => reject(new Error(`flock -s ${lockFile} ended early (exit ${code})`)));
  });
}

if (runAsScript(import.meta.url)) {
  try {
    if (process.argv.includes('--locked')) buildNowIfStale(childEnv(), console.log);
    else buildIfStale(childEnv(), console.log);
  } catch (err) {
    console.error((err as Error).message);
    process.exit(1);
  }
}
