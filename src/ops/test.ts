/**
 * `npm test [-- vitest args]`: a throwaway PostgreSQL (fresh temp folder, free loopback port),
 * migrations, the unit and integration tests, then the browser tests when /usr/bin/chromium
 * exists (required when CI=true), then the cluster is removed. Exit code 0 only if all passed.
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import { startThrowawayPostgres } from '@/db/pglocal';
import { migrate } from '@/db/migrate';
import { projectRoot, vitestBin } from './paths';
import { CHROMIUM, browserPlan } from './test-plan';

function vitest(config: string, args: string[], env: NodeJS.ProcessEnv): number {
  const r = spawnSync(process.execPath, [vitestBin, 'run', '--config', config, ...args], { cwd: projectRoot, stdio: 'inherit', env });
  return r.status ?? 1;
}

async function main(): Promise<number> {
  const args = process.argv.slice(2);
  // With a filter, either suite may legitimately match nothing.
  const extra = args.length ? [...args, '--passWithNoTests'] : [];
  console.log('[test] starting a throwaway PostgreSQL…');
  const pg = await startThrowawayPostgres();
  // Ctrl-C reaches vitest too; we stay alive long enough to remove the cluster.
  process.on('SIGINT', () => console.log('[test] interrupted; cleaning up…'));
  process.on('SIGTERM', () => console.log('[test] terminated; cleaning up…'));
  let failed = false;
  try {
    await migrate(pg.url);
    const env = { ...process.env, DATABASE_URL: pg.url, NEXT_TELEMETRY_DISABLED: '1' };
    if (vitest('test/vitest.config.ts', extra, env) !== 0) failed = true;

    const plan = browserPlan({ CI: process.env.CI }, fs.existsSync(CHROMIUM));
    if (plan === 'run') {
      if (vitest('test/e2e/vitest.config.ts', extra, env) !== 0) failed = true;
    } else if (plan === 'fail') {
      console.error(`[test] ${CHROMIUM} is missing: browser tests cannot run (CI=true). Install it: apt-get install -y chromium`);
      failed = true;
    } else {
      console.warn(`[test] SKIPPED browser tests: ${CHROMIUM} not found (install with \`sudo apt-get install -y chromium\`).`);
    }
  } finally {
    await pg.stop();
  }
  console.log(failed ? '[test] FAILED' : '[test] all passed');
  return failed ? 1 : 0;
}

main().then(
  (code) => process.exit(code),
  (err) => {
    console.error(`[test] ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  },
);
