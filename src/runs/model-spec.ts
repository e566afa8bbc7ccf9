/**
 * Cavity model versions as the API and editor see them: a name, notes and the
 * engine's cavity configuration (validated by the engine's own schema, which
 * names the offending table row), plus a parser for pasted/uploaded tables.
 */
import { z } from 'zod';
import { cavityConfigSchema } from '@/src/engine/cavity/schema';
import type { CavityConfig } from '@/src/engine/cavity/types';

export const modelInputSchema = z.object({
  name: z.string().trim().min(1, 'give the model a name').max(80),
  notes: z.string().max(2000).default(''),
  config: cavityConfigSchema,
});
export type ModelInput = { name: string; notes: string; config: CavityConfig };

/** Parse "f, a, b" lines (comma, semicolon, tab or spaces; # comments; one header line) into rows, naming the bad line. */
export function parseTableText(text: string): { rows: [number, number, number][]; error?: string } {
  const rows: [number, number, number][] = [];
  const lines = text.split(/\r?\n/);
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i].replace(/#.*/, '').trim();
    if (!line) continue;
    const parts = line
      .split(/[\s,;]+/)
      .filter(Boolean)
      .map(Number);
    if (parts.length !== 3 || parts.some((v) => !Number.isFinite(v))) {
      if (rows.length === 0 && /[a-z]/i.test(line)) continue;
      return { rows, error: `line ${i + 1}: expected three numbers (frequency and two values), got "${lines[i].trim()}"` };
    }
    rows.push([parts[0], parts[1], parts[2]]);
  }
  return { rows };
}
