/**
 * Runs the long-lived children of `npm start` / `npm run dev` / the browser-test harness
 * (web server, worker, mail catcher): prefixes their output, stops them all (SIGTERM to each
 * process group, SIGKILL after a grace period), and reports when one dies on its own.
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

interface Running {
  spec: ChildSpec;
  proc: ChildProcess;
  exited: Promise<number | null>;
}

export class Supervisor {
  private children: Running[] = [];
  private stopping = false;

  constructor(
    private readonly log: (line: string) => void = (l) => console.log(l),
    /** Called once when a child exits while we were not stopping. */
    private readonly onUnexpectedExit: (name: string, code: number | null) => void = () => {},
  ) {}

  start(spec: ChildSpec): ChildProcess {
    // Own process group, so stop() reaches grandchildren (next dev) and a terminal Ctrl-C
    // reaches only us: we decide the order of shutdown.
    const proc = spawn(spec.command, spec.args, {
      cwd: spec.cwd,
      env: spec.env,
      stdio: ['ignore', 'pipe', 'pipe'],
      detached: true,
    });
    for (const stream of [proc.stdout!, proc.stderr!]) {
      readline.createInterface({ input: stream }).on('line', (line) => this.log(`${spec.name.padEnd(7)}| ${line}`));
    }
    const exited = new Promise<number | null>((resolve) => {
      proc.on('exit', (code, signal) => {
        if (!this.stopping) {
          this.log(`${spec.name.padEnd(7)}| exited unexpectedly (${signal ?? `code ${code}`})`);
          this.onUnexpectedExit(spec.name, code);
        }
        resolve(code);
      });
      proc.on('error', (err) => {
        this.log(`${spec.name.padEnd(7)}| could not start: ${err.message}`);
        if (!this.stopping) this.onUnexpectedExit(spec.name, null);
        resolve(null);
      });
    });
    this.children.push({ spec, proc, exited });
    return proc;
  }

  /** SIGTERM every child group (newest first), SIGKILL whatever is left after `graceMs`. */
  async stopAll(graceMs = 15_000): Promise<void> {
    this.stopping = true;
    const kill = (r: Running, sig: NodeJS.Signals) => {
      if (r.proc.pid === undefined || r.proc.exitCode !== null || r.proc.signalCode !== null) return;
      try {
        process.kill(-r.proc.pid, sig);
      } catch {
        /* already gone */
      }
    };
    const list = [...this.children].reverse();
    for (const r of list) kill(r, 'SIGTERM');
    const timer = setTimeout(() => list.forEach((r) => kill(r, 'SIGKILL')), graceMs);
    await Promise.all(list.map((r) => r.exited));
    clearTimeout(timer);
    this.children = [];
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
