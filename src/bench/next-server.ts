/**
 * The production web server (`next start`) on a free loopback port for the benchmarks that measure
 * pages: it holds the shared build lock while it serves, so that no build replaces .next under it,
 * and pushes its own stopping onto the caller's `stop` list.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { freePort } from '@/db/pglocal';
import { nextBin, projectRoot } from '@/src/ops/paths';
import { waitForHttp } from '@/src/ops/supervisor';
import { buildStaleness, holdSharedBuildLock } from '@/src/ops/build';
import { childEnv } from '@/src/settings';

/** Whether .next holds a production build to serve. */
export const hasProductionBuild = () => existsSync(path.join(projectRoot, '.next', 'BUILD_ID'));

/** Starts the server on `databaseUrl` and waits until it answers; `stale` says whether the build is older than the sources. */
export async function startNextServer(
  databaseUrl: string,
  stop: Array<() => Promise<void> | void>,
): Promise<{ base: string; stale: ReturnType<typeof buildStaleness> }> {
  const stale = buildStaleness();
  stop.push(await holdSharedBuildLock());
  const port = await freePort();
  const web: ChildProcess = spawn(process.execPath, [nextBin, 'start', '-H', '127.0.0.1', '-p', String(port)], {
    cwd: projectRoot,
    stdio: ['ignore', 'ignore', 'pipe'],
    env: childEnv(
      {
        DATABASE_URL: databaseUrl,
        PORT: String(port),
        APP_URL: `http://127.0.0.1:${port}`,
        COOKIE_SECURE: 'false',
        NEXT_TELEMETRY_DISABLED: '1',
      },
      { dropNodeEnv: true },
    ),
  });
  stop.push(
    () =>
      new Promise<void>((resolve) => {
        if (web.exitCode !== null || web.signalCode !== null) return resolve();
        web.once('exit', () => resolve());
        web.kill('SIGTERM');
      }),
  );
  const base = `http://127.0.0.1:${port}`;
  await waitForHttp(`${base}/`, 60_000, () => web.exitCode === null);
  return { base, stale };
}
