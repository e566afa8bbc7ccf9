/**
 * The one place Cavitas reads its environment. Every setting is declared here once, with its
 * default and its meaning; everything else calls `settings()` (or one of the helpers below) and
 * never reads `process.env` itself. A value that is set but malformed is an error that names the
 * variable; an empty value counts as unset.
 *
 * The environment is read at each call, not once at start-up, so a test (or `npm start`, which
 * fills in DATABASE_URL for its children) may change a variable and see the effect at once.
 */
import { z } from 'zod';
import { DEFAULT_GRID_MAX_CELLS } from '@/src/runs/grid-spec';

type Env = Record<string, string | undefined>;

const unset = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);
const num = z.coerce.number<string>().refine(Number.isFinite, 'must be a number');
const positive = num.refine((n) => n > 0, 'must be greater than 0');
const count = z.coerce.number<string>().int('must be a whole number').min(1, 'must be at least 1');
const tcpPort = z.coerce.number<string>().int('must be a whole number').min(1).max(65535, 'must be a TCP port (1–65535)');
const flag = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'], 'must be true or false')
  .transform((v) => v === 'true' || v === '1' || v === 'yes');
const url = z.url('must be a URL such as http://example.org');

/** Each variable: its schema (with default) and what it does. The README's configuration table lists those an operator sets. */
const schema = z.object({
  // ── Database ──────────────────────────────────────────────────────────────────────────────
  /** PostgreSQL connection string. `npm start` and `npm test` set it; the operator may point it at a server. */
  DATABASE_URL: z.string().optional(),
  /** Connections in one process's pool. */
  DATABASE_POOL: count.default(10),
  /** Port of the private cluster `npm start` runs in .data/pg when DATABASE_URL is not set. */
  PGPORT_CAVITAS: tcpPort.default(54329),

  // ── Web server ────────────────────────────────────────────────────────────────────────────
  /** Port `npm start` serves on (127.0.0.1). */
  PORT: tcpPort.default(3000),
  /** Public origin for links in e-mails and station push instructions; default: the request's own origin. */
  APP_URL: url.transform((u) => u.replace(/\/+$/, '')).optional(),
  /** Secure session cookies; default on when NODE_ENV=production. `npm start` sets false (plain-http loopback). */
  COOKIE_SECURE: flag.optional(),
  /** Set by Next.js per command (development, production, test). */
  NODE_ENV: z.string().optional(),
  /** Behind a reverse proxy: take the client address from X-Forwarded-For / X-Real-IP for throttling. */
  TRUST_PROXY: flag.default(false),

  // ── Mail ──────────────────────────────────────────────────────────────────────────────────
  /** SMTP server; default the local catcher `npm start` runs. Any other host is a real relay. */
  SMTP_HOST: z.string().default('127.0.0.1'),
  /** SMTP port (of the relay, or of the local catcher). */
  SMTP_PORT: tcpPort.default(2525),
  /** SMTP user name for a relay that asks for one. */
  SMTP_USER: z.string().optional(),
  /** SMTP password for SMTP_USER. */
  SMTP_PASSWORD: z.string().optional(),
  /** Connect with TLS from the start (port 465 relays); otherwise STARTTLS is negotiated. */
  SMTP_SECURE: flag.default(false),
  /** Sender address of this installation. */
  MAIL_FROM: z.string().default('Cavitas <cavitas@localhost>'),

  // ── Limits ────────────────────────────────────────────────────────────────────────────────
  /** Largest accepted upload, in megabytes. */
  UPLOAD_MAX_MB: positive.default(200),
  /** Failed sign-ins for one e-mail address within 15 minutes before it must wait (5 s, doubling, at most 1 min). */
  SIGN_IN_ACCOUNT_ALLOWANCE: count.default(5),
  /** Failed sign-ins from one client address within 15 minutes before it must wait (30 s, doubling, at most 15 min). */
  SIGN_IN_ADDRESS_ALLOWANCE: count.default(20),
  /** Requests one station push token may make per minute. */
  PUSH_RATE_PER_MINUTE: count.default(120),
  /** Largest JSON body of sign-in, sign-up and password resets, in kilobytes (refused with 413 before parsing). */
  AUTH_BODY_MAX_KB: positive.default(16),
  /** Largest JSON body of every other API call, in kilobytes (station pushes have their own cap). */
  JSON_BODY_MAX_KB: positive.default(1024),
  /** Earliest sample date accepted from an upload or a push (a UTC day). */
  SAMPLE_EARLIEST: z.iso.date('must be a day like 1990-01-01').default('1990-01-01'),
  /** Hours ahead of the server's clock a sample date may lie (clock drift of station computers). */
  SAMPLE_AHEAD_HOURS: num.refine((n) => n >= 0, 'must be 0 or more').default(24),
  /** Cells a source grid's cell regions may name in all. */
  GRID_MAX_CELLS: count.default(DEFAULT_GRID_MAX_CELLS),

  // ── Worker and runs ───────────────────────────────────────────────────────────────────────
  /** Jobs of each kind one worker process works at once. */
  WORKER_CONCURRENCY: count.default(1),
  /** Threads per run; default the engine's own (all cores). 1 solves in the calling thread. */
  CAVITAS_RUN_THREADS: count.optional(),
  /** Intervals per chunk of a run: each chunk is one job, so that several workers share a run. */
  CAVITAS_RUN_CHUNK: count.default(6),
  /** Seconds a run job works before handing the run back to the queue. */
  CAVITAS_RUN_SLICE_S: positive.default(300),
  /** Seconds without a heartbeat after which a run's worker counts as gone. */
  CAVITAS_RUN_LEASE_S: positive.default(30),
  /** Seconds between the worker's sweeps for runs whose worker is gone. */
  CAVITAS_RUN_SWEEP_S: positive.default(30),
  /** Milliseconds between batched result writes (0: each interval at once); default the driver's own. */
  CAVITAS_RUN_WRITE_MS: num.refine((n) => n >= 0, 'must be 0 or more').optional(),

  // ── Tests and benchmarks ──────────────────────────────────────────────────────────────────
  /** Under CI, missing browser tests fail instead of being skipped. */
  CI: flag.default(false),
  /** `npm run bench` (runs): intervals in the stored-run benchmark. */
  BENCH_RUN_INTERVALS: count.default(144),
  /** Starts per interval in the stored-run benchmark (the launch form's default). */
  BENCH_RUN_STARTS: count.default(16),
  /** Intervals of the inverter's day measured through the driver. */
  BENCH_RUN_DAY_INTERVALS: count.default(144),
  /** Starts per interval of that day. */
  BENCH_RUN_DAY_STARTS: count.default(16),
  /** Rounds of that day (the median is reported). */
  BENCH_RUN_DAY_ROUNDS: count.default(3),
  /** Print per-phase probes of the stored-run benchmark. */
  BENCH_RUN_PROBE: flag.default(false),
  /** Measure the inverter's day through the driver (false skips it). */
  BENCH_RUN_DAY: flag.default(true),
  /** Measure the run page's load (false skips it). */
  BENCH_RUN_PAGE: flag.default(true),
  /** `npm run bench -- fanout`: rounds of the day run with one worker and with several. */
  BENCH_FANOUT_ROUNDS: count.default(1),
  /** Worker processes of the larger side of the fan-out measurement. */
  BENCH_FANOUT_WORKERS: count.default(2),
  /** `npm run bench -- load`: simulated users, each with a session of its own. */
  LOAD_USERS: count.default(50),
  /** Rounds each simulated user makes over the three addresses. */
  LOAD_ROUNDS: count.default(10),
  /** Milliseconds a simulated user reads an answer before the next request, on average (0: back to back). */
  LOAD_THINK_MS: num.refine((n) => n >= 0, 'must be 0 or more').default(1000),
  /** The load phase stops after this many seconds even if rounds remain. */
  LOAD_SECONDS: positive.default(120),
});

export type Settings = z.output<typeof schema>;
export type SettingName = keyof Settings;

/** Validated settings from `env` (default: this process's environment). Throws naming each bad variable. */
export function settings(env: Env = process.env): Settings {
  const picked: Record<string, unknown> = {};
  for (const key of Object.keys(schema.shape)) picked[key] = unset(env[key]);
  const r = schema.safeParse(picked);
  if (r.success) return r.data;
  const problems = r.error.issues.map((i) => `${String(i.path[0])}="${env[String(i.path[0])] ?? ''}" ${i.message}`);
  throw new Error(`Invalid environment: ${problems.join('; ')}`);
}

/** The database connection string; an error saying how to get one when it is not set. */
export function databaseUrl(env: Env = process.env): string {
  const url = settings(env).DATABASE_URL;
  if (!url)
    throw new Error('DATABASE_URL is not set: start Cavitas with `npm start`, or point DATABASE_URL at a PostgreSQL server');
  return url;
}

/** The public address (APP_URL) is https: HSTS is sent and session cookies are Secure. */
export function publicHttps(env: Env = process.env): boolean {
  return settings(env).APP_URL?.startsWith('https:') ?? false;
}

/** Session cookies carry Secure: COOKIE_SECURE when given, else when APP_URL is https, else in production without APP_URL. */
export function cookieSecure(env: Env = process.env): boolean {
  const s = settings(env);
  if (s.COOKIE_SECURE !== undefined) return s.COOKIE_SECURE;
  if (s.APP_URL) return publicHttps(env);
  return s.NODE_ENV === 'production';
}

/** SMTP_HOST names a real relay rather than the local catcher. */
export function mailRelay(env: Env = process.env): boolean {
  return !['127.0.0.1', 'localhost', '::1'].includes(settings(env).SMTP_HOST);
}

/**
 * The environment for a child process: this process's environment with `overrides` on top
 * (an undefined override removes the variable). `dropNodeEnv` for children that are Next.js
 * commands, which set NODE_ENV themselves.
 */
export function childEnv(overrides: Env = {}, opts: { dropNodeEnv?: boolean } = {}): NodeJS.ProcessEnv {
  const env: Env = { ...process.env };
  if (opts.dropNodeEnv) delete env.NODE_ENV;
  for (const [k, v] of Object.entries(overrides)) {
    if (v === undefined) delete env[k];
    else env[k] = v;
  }
  return env as NodeJS.ProcessEnv;
}

/** Sets (or, with undefined, removes) a variable in this process's environment, for code started later in it. */
export function setEnv(name: SettingName, value: string | undefined): void {
  if (value === undefined) delete process.env[name];
  else (process.env as Env)[name] = value;
}

/** Loads a `.env` file into this process's environment (variables already set win); a missing file is fine. */
export function loadEnvFile(file: string): void {
  try {
    process.loadEnvFile(file);
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'ENOENT') throw err;
  }
}
