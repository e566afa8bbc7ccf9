/**
 * `npm test [-- vitest args]`: first the static checks (`eslint .` and `prettier --check .`;
 * left out when vitest arguments narrow the run), then a throwaway PostgreSQL (fresh temp
 * folder, free loopback port), migrations, the unit and integration tests, then the browser
 * tests when /usr/bin/chromium exists (required when CI=true), then the cluster is removed.
 * Exit code 0 only if all passed: a lint finding or an unformatted file fails the run.
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { startThrowawayPostgres } from '@/db/pglocal';
import { migrate } from '@/db/migrate';
import { eslintBin, prettierBin, projectRoot, vitestBin } from './paths';
import { CHROMIUM, browserPlan } from './test-plan';
import { childEnv } from '@/src/settings';

type Counts = { passed: number; failed: number; skipped: number };
const totals: Counts = { passed: 0, failed: 0, skipped: 0 };

/** Run one vitest suite; its JSON report adds to `totals` for the closing summary line. */
function vitest(config: string, args: string[], env: NodeJS.ProcessEnv): number {
  const report = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'cavitas-report-')), 'report.json');
  const reporters = ['--reporter=default', '--reporter=json', `--outputFile.json=${report}`];
  const r = spawnSync(process.execPath, [vitestBin, 'run', '--config', config, ...reporters, ...args], {
    cwd: projectRoot,
    stdio: 'inherit',
    env,
  });
  try {
    const json = JSON.parse(fs.readFileSync(report, 'utf8')) as {
      numPassedTests: number;
      numFailedTests: number;
      numPendingTests: number;
      numTodoTests: number;
    };
    totals.passed += json.numPassedTests;
    totals.failed += json.numFailedTests;
    totals.skipped += json.numPendingTests + json.numTodoTests;
  } catch {
    // No report (vitest crashed before writing one): the exit status below still fails the run.
  } finally {
    fs.rmSync(path.dirname(report), { recursive: true, force: true });
  }
  return r.status ?? 1;
}

/** One static check over the whole tree; true when it found nothing. */
function staticCheck(name: string, bin: string, args: string[]): boolean {
  console.log(`[test] ${name}…`);
  const r = spawnSync(process.execPath, [bin, ...args], { cwd: projectRoot, stdio: 'inherit' });
  if (r.status === 0) return true;
  console.error(`[test] ${name} found problems (exit ${r.status ?? r.signal}); see above`);
  return false;
}

async function main(): Promise<number> {
  const args = process.argv.slice(2);
  // With a filter, either suite may legitimately match nothing.
  const extra = args.length ? [...args, '--passWithNoTests'] : [];
  let failed = false;
  if (!args.length) {
    const cache = ['--cache', '--cache-location', path.join(projectRoot, 'node_modules', '.cache', 'eslint')];
    if (!staticCheck('eslint .', eslintBin, ['.', ...cache])) failed = true;
    if (!staticCheck('prettier --check .', prettierBin, ['--check', '.', '--log-level', 'warn'])) failed = true;
  }
  console.log('[test] starting a throwaway PostgreSQL…');
  const pg = await startThrowawayPostgres();
  // Ctrl-C reaches vitest too; we stay alive long enough to remove the cluster.
  process.on('SIGINT', () => console.log('[test] interrupted; cleaning up…'));
  process.on('SIGTERM', () => console.log('[test] terminated; cleaning up…'));
  try {
    await migrate(pg.url);
    const env = childEnv({ DATABASE_URL: pg.url, NEXT_TELEMETRY_DISABLED: '1' });
    if (vitest('test/vitest.config.ts', extra, env) !== 0) failed = true;

    const plan = browserPlan(env, fs.existsSync(CHROMIUM));
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
  // The closing line CI reads: counts over both suites.
  console.log(`Tests: ${totals.passed} passed, ${totals.failed} failed, ${totals.skipped} skipped`);
  return failed ? 1 : 0;
}

main().then(
  (code) => process.exit(code),
  (err) => {
    console.error(`[test] ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  },
);
