/** Shared plumbing for CLI verbs: argument parsing, file reading, input errors. */
import { readFile } from 'node:fs/promises';
import type { ZodType } from 'zod';

/** A command's answer: any JSON-serialisable document. */
export type Verb = (args: string[]) => Promise<unknown>;

/** An error in the user's input; printed without a stack trace. */
export class CliError extends Error {
  constructor(
    message: string,
    readonly exitCode = 2,
  ) {
    super(message);
  }
}

/** Split `args` into positional arguments and `--flag value` pairs. */
export function parseArgs(args: string[], flags: readonly string[]): { positional: string[]; flags: Record<string, string> } {
  const positional: string[] = [];
  const out: Record<string, string> = {};
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a.startsWith('--')) {
      const [key, inline] = a.slice(2).split('=', 2);
      if (!flags.includes(key))
        throw new CliError(`unknown option --${key} (allowed: ${flags.map((f) => '--' + f).join(', ') || 'none'})`);
      const value = inline ?? args[++i];
      if (value === undefined) throw new CliError(`option --${key} needs a value`);
      out[key] = value;
    } else positional.push(a);
  }
  return { positional, flags: out };
}

/** Read a flag as an integer within [min, max]. */
export function intFlag(flags: Record<string, string>, name: string, fallback: number, min: number, max: number): number {
  const raw = flags[name];
  if (raw === undefined) return fallback;
  const v = Number(raw);
  if (!Number.isInteger(v) || v < min || v > max)
    throw new CliError(`--${name} must be a whole number from ${min} to ${max}, got "${raw}"`);
  return v;
}

/** Read one JSON file and validate it, naming the first wrong field. */
export async function readJsonFile<T>(path: string | undefined, schema: ZodType<T>, what: string): Promise<T> {
  if (!path) throw new CliError(`missing the ${what} file argument`);
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch {
    throw new CliError(`cannot read ${what} file "${path}"`);
  }
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    throw new CliError(`${path} is not valid JSON: ${(e as Error).message}`);
  }
  const parsed = schema.safeParse(data);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const field = issue.path.length ? issue.path.join('.') : '(top level)';
    throw new CliError(`${path}: field "${field}": ${issue.message}`);
  }
  return parsed.data;
}
