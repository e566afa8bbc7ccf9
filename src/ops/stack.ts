/**
 * The running application: mail catcher, worker and web server as supervised children, all
 * pointed at one DATABASE_URL. A child that dies is restarted (src/ops/supervisor.ts); the
 * others, and PostgreSQL, stay up. Used by `npm start`, `npm run dev` and the browser tests.
 */
import net from 'node:net';
import { Supervisor, waitForHttp, type RestartPolicy } from './supervisor';
import { nextBin, programArgs, projectRoot } from './paths';
import { portInUse } from '@/db/pglocal';
import { childEnv, mailRelay, settings } from '@/src/settings';

export interface StackOptions {
  mode: 'production' | 'dev';
  databaseUrl: string;
  port: number;
  smtpPort: number;
  /** Public address of the app (default http://127.0.0.1:<port>). */
  appUrl?: string;
  log?: (line: string) => void;
  /** A child kept crashing and is no longer restarted (see Supervisor). */
  onGiveUp?: (name: string, reason: string) => void;
  restartPolicy?: RestartPolicy;
  /** Extra variables for every child. */
  env?: Record<string, string | undefined>;
}

export interface Stack {
  appUrl: string;
  port: number;
  smtpPort: number;
  /** Current process id of a child ('web', 'worker', 'mail'), undefined while it is down. */
  pid(name: string): number | undefined;
  stop(): Promise<void>;
}

function waitForTcp(port: number, timeoutMs: number): Promise<void> {
  const until = Date.now() + timeoutMs;
  return new Promise((resolve, reject) => {
    const attempt = () => {
      const s = net.connect(port, '127.0.0.1');
      s.once('connect', () => {
        s.destroy();
        resolve();
      });
      s.once('error', () => {
        s.destroy();
        if (Date.now() > until) reject(new Error(`nothing listens on 127.0.0.1:${port} after ${timeoutMs / 1000} s`));
        else setTimeout(attempt, 200);
      });
    };
    attempt();
  });
}

export async function startStack(o: StackOptions): Promise<Stack> {
  const log = o.log ?? ((l: string) => console.log(l));
  // A real relay in SMTP_HOST replaces the local catcher.
  const s = settings();
  const relay = mailRelay();
  const ports: Array<[string, number, string]> = [['web server', o.port, 'PORT']];
  if (!relay) ports.push(['mail catcher', o.smtpPort, 'SMTP_PORT']);
  for (const [what, port, variable] of ports) {
    if (await portInUse(port))
      throw new Error(`port ${port} on 127.0.0.1 (${what}) is already in use; choose another with ${variable}=<port>`);
  }
  const appUrl = o.appUrl ?? `http://127.0.0.1:${o.port}`;
  const env = childEnv(
    {
      ...o.env,
      DATABASE_URL: o.databaseUrl,
      SMTP_HOST: relay ? s.SMTP_HOST : '127.0.0.1',
      SMTP_PORT: relay ? String(s.SMTP_PORT) : String(o.smtpPort),
      APP_URL: appUrl,
      // Unset: Secure exactly when APP_URL is https (src/settings.ts cookieSecure).
      COOKIE_SECURE: s.COOKIE_SECURE === undefined ? undefined : String(s.COOKIE_SECURE),
      PORT: String(o.port),
      NEXT_TELEMETRY_DISABLED: '1',
    },
    { dropNodeEnv: true }, // next sets NODE_ENV per command
  );
  const sup = new Supervisor(log, o.onGiveUp, o.restartPolicy);
  try {
    if (!relay) {
      sup.start({ name: 'mail', command: process.execPath, args: programArgs('mail-catcher'), env, cwd: projectRoot });
      await waitForTcp(o.smtpPort, 30_000);
    }
    sup.start({ name: 'worker', command: process.execPath, args: programArgs('worker'), env, cwd: projectRoot });
    sup.start({
      name: 'web',
      command: process.execPath,
      args: [nextBin, o.mode === 'dev' ? 'dev' : 'start', '-H', '127.0.0.1', '-p', String(o.port)],
      env,
      cwd: projectRoot,
    });
    await waitForHttp(`http://127.0.0.1:${o.port}/`, o.mode === 'dev' ? 180_000 : 60_000, () => sup.isSupervised('web'));
    log(`[start] web server answers on http://127.0.0.1:${o.port}/`);
  } catch (err) {
    await sup.stopAll(5_000);
    throw err;
  }
  return { appUrl, port: o.port, smtpPort: o.smtpPort, pid: (name) => sup.pid(name), stop: () => sup.stopAll() };
}
