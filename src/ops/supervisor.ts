/**
 * Runs the long-lived children of `npm start` / `npm run dev` / the browser-test harness
 * (web server, worker, mail catcher): prefixes their output, restarts a child that dies on its
 * own after a back-off (1 s, 2 s, 4 s … up to 30 s; exponential back-off is common practice for
 * process supervisors), and gives up on a child only when it keeps crashing — `maxCrashes` exits
 * within `crashWindowMs` — reporting which child and why through `onGiveUp`. The other children
 * keep running meanwhile. `stopAll` stops them all (SIGTERM to each process group, SIGKILL after
 * a grace period) and cancels pending restarts.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import readline from 'node:readline';

export interface ChildSpec {
  name: string;
  command: string;
  args: string[];
  env: NodeJS.ProcessEnv;
  cwd: string;
}

export interface RestartPolicy {
  /** Wait before the first restart; doubled for each further crash inside the window. */
  baseDelayMs: number;
  maxDelayMs: number;
  /** This many exits within `crashWindowMs` and the child is given up. */
  maxCrashes: number;
  crashWindowMs: number;
}

export const DEFAULT_RESTART: RestartPolicy = { baseDelayMs: 1_000, maxDelayMs: 30_000, maxCrashes: 5, crashWindowMs: 60_000 };

/** Pure: what to do after a crash at `now`, given the earlier crash times of the same child. */
export function afterCrash(
  earlier: readonly number[],
  now: number,
  policy: RestartPolicy,
): { crashes: number[]; giveUp: boolean; delayMs: number } {
  const crashes = [...earlier.filter((t) => now - t < policy.crashWindowMs), now];
  const giveUp = crashes.length >= policy.maxCrashes;
  const delayMs = Math.min(policy.maxDelayMs, policy.baseDelayMs * 2 ** (crashes.length - 1));
  return { crashes, giveUp, delayMs };
}

interface Managed {
  spec: ChildSpec;
  proc: ChildProcess | null;
  exited: Promise<void>;
  crashes: number[];
  restartTimer: NodeJS.Timeout | null;
  gaveUp: boolean;
}

function describeExit(code: number | null, signal: NodeJS.Signals | null): string {
  return signal ? `killed by ${signal}` : `exit code ${code}`;
}

export class Supervisor {
  private children = new Map<string, Managed>();
  private stopping = false;

  constructor(
    private readonly log: (line: string) => void = (l) => console.log(l),
    /** Called once per child that crashed too often; it is not restarted again. */
    private readonly onGiveUp: (name: string, reason: string) => void = () => {},
    private readonly policy: RestartPolicy = DEFAULT_RESTART,
  ) {}

  /** Start a supervised child (names are unique). */
  start(spec: ChildSpec): ChildProcess {
    if (this.children.has(spec.name)) throw new Error(`a child named ${spec.name} is already supervised`);
    const m: Managed = { spec, proc: null, exited: Promise.resolve(), crashes: [], restartTimer: null, gaveUp: false };
    this.children.set(spec.name, m);
    return this.spawnChild(m);
  }

  /** Process id of the child's current process, or undefined while it is down. */
  pid(name: string): number | undefined {
    const p = this.children.get(name)?.proc;
    return p && p.exitCode === null && p.signalCode === null ? p.pid : undefined;
  }

  /** False once the child was given up (or is unknown). */
  isSupervised(name: string): boolean {
    const m = this.children.get(name);
    return !!m && !m.gaveUp;
  }

  private say(name: string, text: string): void {
    this.log(`${name.padEnd(7)}| ${text}`);
  }

  private spawnChild(m: Managed): ChildProcess {
    const { spec } = m;
    // Own process group, so stopAll() reaches grandchildren (next dev) and a terminal Ctrl-C
    // reaches only us: we decide the order of shutdown.
    const proc = spawn(spec.command, spec.args, {
      cwd: spec.cwd,
      env: spec.env,
      stdio: ['ignore', 'pipe', 'pipe'],
      detached: true,
    });
    for (const stream of [proc.stdout!, proc.stderr!]) {
      readline.createInterface({ input: stream }).on('line', (line) => this.say(spec.name, line));
    }
    m.proc = proc;
    m.exited = new Promise<void>((resolve) => {
      let done = false;
      const finish = (what: string) => {
        if (done) return;
        done = true;
        resolve();
        if (!this.stopping) this.crashed(m, what);
      };
      proc.on('exit', (code, signal) => finish(describeExit(code, signal)));
      proc.on('error', (err) => finish(`could not start: ${err.message}`));
    });
    return proc;
  }

  private crashed(m: Managed, what: string): void {
    const name = m.spec.name;
    const next = afterCrash(m.crashes, Date.now(), this.policy);
    m.crashes = next.crashes;
    if (next.giveUp) {
      m.gaveUp = true;
      const reason = `${what}; it crashed ${next.crashes.length} times within ${Math.round(this.policy.crashWindowMs / 1000)} s`;
      this.say(name, `exited unexpectedly (${reason}); not restarting it`);
      this.onGiveUp(name, reason);
      return;
    }
    this.say(name, `exited unexpectedly (${what}); restarting in ${(next.delayMs / 1000).toFixed(1)} s`);
    m.restartTimer = setTimeout(() => {
      m.restartTimer = null;
      if (this.stopping) return;
      const proc = this.spawnChild(m);
      this.say(name, `restarted (pid ${proc.pid ?? '?'})`);
    }, next.delayMs);
  }

  /** SIGTERM every child group (newest first), SIGKILL whatever is left after `graceMs`. */
  async stopAll(graceMs = 15_000): Promise<void> {
    this.stopping = true;
    const list = [...this.children.values()].reverse();
    for (const m of list) if (m.restartTimer) clearTimeout(m.restartTimer);
    const kill = (m: Managed, sig: NodeJS.Signals) => {
      const p = m.proc;
      if (!p || p.pid === undefined || p.exitCode !== null || p.signalCode !== null) return;
      try {
        process.kill(-p.pid, sig);
      } catch {
        /* already gone */
      }
    };
    for (const m of list) kill(m, 'SIGTERM');
    const timer = setTimeout(() => list.forEach((m) => kill(m, 'SIGKILL')), graceMs);
    await Promise.all(list.map((m) => m.exited));
    clearTimeout(timer);
    this.children.clear();
  }
}

/** Resolves once `url` answers HTTP at all (any status), or rejects after `timeoutMs`. */
export async function waitForHttp(url: string, timeoutMs: number, isAlive: () => boolean = () => true): Promise<number> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (!isAlive()) throw new Error(`${url}: the server process exited before answering`);
    try {
      const res = await fetch(url, { redirect: 'manual', signal: AbortSignal.timeout(5_000) });
      await res.body?.cancel();
      return res.status;
    } catch {
      await new Promise((r) => setTimeout(r, 300));
    }
  }
  throw new Error(`${url} did not answer within ${Math.round(timeoutMs / 1000)} s`);
}
