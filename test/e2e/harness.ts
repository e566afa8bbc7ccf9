/**
 * Browser-test harness.
 *
 * `startTestApp()` seeds the demo data into the test DATABASE_URL, builds the app if stale
 * (under the machine-wide next build lock), and runs `next start`, the worker and the mail
 * catcher on free loopback ports. `launchBrowser()` starts Debian's chromium through
 * playwright-core, headless; every launch gets a fresh temporary profile.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';
import { freePort } from '@/db/pglocal';
import { migrate } from '@/db/migrate';
import { closeDatabase } from '@/db/lifecycle';
import { runSeeds, demoSignIns, type DemoSignIn } from '@/src/ops/seed';
import { buildIfStale, holdSharedBuildLock } from '@/src/ops/build';
import { startStack } from '@/src/ops/stack';

export interface TestApp {
  baseUrl: string;
  smtpPort: number;
  /** Output of the children, for failure messages. */
  logs: string[];
  signIns: DemoSignIn[];
  /** Current process id of a child ('web', 'worker', 'mail'). */
  pid(name: string): number | undefined;
  stop(): Promise<void>;
}

export interface TestAppOptions {
  /** Extra environment for every child (e.g. a short run lease for the worker). */
  env?: Record<string, string>;
}

export async function startTestApp(options: TestAppOptions = {}): Promise<TestApp> {
  const databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) throw new Error('DATABASE_URL is not set (run through npm test or the e2e vitest config)');
  await migrate(databaseUrl);
  await runSeeds();
  await closeDatabase();
  const logs: string[] = [];
  const log = (l: string) => {
    logs.push(l);
    if (process.env.E2E_VERBOSE) console.log(l);
  };
  const [port, smtpPort] = [await freePort(), await freePort()];
  let stack;
  let release: (() => void) | null = null;
  try {
    buildIfStale({ ...process.env, DATABASE_URL: databaseUrl }, log);
    // Keep other checkouts' builds from replacing .next while this app serves it.
    release = await holdSharedBuildLock();
    stack = await startStack({ mode: 'production', databaseUrl, port, smtpPort, log, env: options.env });
  } catch (err) {
    release?.();
    const tail = logs.slice(-40).join('\n');
    throw new Error(`${(err as Error).message}\n--- last output of the app ---\n${tail}`);
  }
  const running = stack;
  const unlock = release;
  return {
    baseUrl: running.appUrl,
    smtpPort,
    logs,
    signIns: demoSignIns(),
    pid: (name) => running.pid(name),
    stop: async () => {
      try {
        await running.stop();
      } finally {
        unlock();
      }
    },
  };
}

export { CHROMIUM_FLAGS, launchBrowser } from '@/src/ops/browser';
import { launchBrowser } from '@/src/ops/browser';

/** Sign in through the sign-in form and wait until the app has left it. */
export async function signInAs(page: Page, baseUrl: string, who: { email: string; password: string }): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel(/e-?mail/i).fill(who.email);
  await page.getByLabel(/password/i).fill(who.password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'), { timeout: 30_000 });
}

/**
 * The app and a browser for one test file: started before its tests, stopped after them (with
 * this process's database pool). Read `env.app` and `env.browser` inside the tests.
 */
export function useBrowserApp(): { app: TestApp; browser: Browser } {
  const env = {} as { app: TestApp; browser: Browser };
  beforeAll(async () => {
    env.app = await startTestApp();
    env.browser = await launchBrowser();
  });
  afterAll(async () => {
    await env.browser?.close();
    await env.app?.stop();
    await closeDatabase();
  });
  return env;
}
