/** Shared by the command-line tests: run a verb as a user would, and check refusals of broken case files. */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';

export const root = fileURLToPath(new URL('../../', import.meta.url));

/** `npm run cli -- <verb> ...args` without npm: the compiled command line (src/ops/launch.mjs) from the project root. */
export function runVerb(verb: string, args: string[], timeoutMs = 120_000) {
  return spawnSync(process.execPath, ['src/ops/launch.mjs', 'cli', verb, ...args], {
    cwd: root,
    encoding: 'utf8',
    timeout: timeoutMs,
  });
}

/**
 * Returns `bad(mutate, pattern, extraArgs)`: writes a copy of the case file changed by `mutate`,
 * runs the verb on it and expects a non-zero exit, nothing on stdout, and stderr matching `pattern`.
 */
export function refusals(verb: string, caseFile: string, extraArgs: string[]) {
  const dir = mkdtempSync(join(tmpdir(), `cavitas-${verb}-`));
  const original = JSON.parse(readFileSync(caseFile, 'utf8'));
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  return (mutate: (x: any) => void, pattern: RegExp) => {
    const copy = JSON.parse(JSON.stringify(original));
    mutate(copy);
    const f = join(dir, 'bad.json');
    writeFileSync(f, JSON.stringify(copy));
    const res = runVerb(verb, [f, ...extraArgs]);
    expect(res.status).not.toBe(0);
    expect(res.stdout).toBe('');
    expect(res.stderr).toMatch(pattern);
  };
}
