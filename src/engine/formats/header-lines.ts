/**
 * The "# key: value" header block shared by both Cavitas CSV layouts. The
 * first line names the layout and its version ("# cavitas-series 1").
 */
import { FormatError } from './format-error';
import type { TextLine } from './lines';

export interface HeaderBlock {
  values: Map<string, { value: string; line: number }>;
}

function parseSignature(text: string, file: string, line: number, expected: string): void {
  const m = /^#\s*(\S+)\s+(\d+)\s*$/.exec(text);
  if (!m || m[1] !== expected)
    throw new FormatError(file, line, null, `the first line must read "# ${expected} 1" (got "${text.slice(0, 40)}")`);
  if (m[2] !== '1')
    throw new FormatError(file, line, null, `layout version ${m[2]} is not supported (this reader knows version 1)`);
}

function parseHeaderLine(text: string, file: string, line: number, block: HeaderBlock): void {
  const m = /^#\s*([A-Za-z][\w-]*)\s*:\s*(.*?)\s*$/.exec(text);
  if (!m) throw new FormatError(file, line, null, `header lines look like "# key: value" (got "${text.slice(0, 40)}")`);
  const key = m[1].toLowerCase();
  if (block.values.has(key))
    throw new FormatError(file, line, key, `appears twice in the header (first on line ${block.values.get(key)!.line})`);
  block.values.set(key, { value: m[2], line });
}

/**
 * Reads the layout's first line and the header block, up to the column line; `lines` is left at
 * the first data row. Blank lines in the header are passed over.
 */
export async function readHeaderBlock(
  lines: AsyncGenerator<TextLine>,
  file: string,
  signature: string,
): Promise<{ block: HeaderBlock; columnsLine: TextLine }> {
  const first = await lines.next();
  if (first.done) throw new FormatError(file, 1, null, 'the file is empty');
  parseSignature(first.value.text, file, 1, signature);
  const block: HeaderBlock = { values: new Map() };
  for (;;) {
    const next = await lines.next();
    if (next.done)
      throw new FormatError(file, first.value.number, null, 'the file ends inside the header (no column line and no data)');
    const { text } = next.value;
    if (text.trim() === '') continue;
    if (!text.startsWith('#')) return { block, columnsLine: next.value };
    parseHeaderLine(text, file, next.value.number, block);
  }
}

export function requireValue(block: HeaderBlock, key: string, file: string, headerEnd: number): { value: string; line: number } {
  const v = block.values.get(key);
  if (!v || v.value === '') throw new FormatError(file, v?.line ?? headerEnd, key, `the header needs a "# ${key}: ..." line`);
  return v;
}

/** Header keys outside `known`, in file order: readers keep them for the caller to report. */
export function unknownKeys(block: HeaderBlock, known: readonly string[]): { key: string; line: number }[] {
  return [...block.values.entries()].filter(([k]) => !known.includes(k)).map(([key, v]) => ({ key, line: v.line }));
}

/** Strict ISO 8601 UTC instant, e.g. 2026-03-14T00:00:00Z or with fractional seconds. */
export function parseUtc(text: string): number | null {
  if (!/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d{1,9})?Z$/.test(text)) return null;
  const ms = Date.parse(text);
  if (!Number.isFinite(ms)) return null;
  // reject calendar overflow such as 2026-02-30 (Date.parse rolls it over)
  if (new Date(ms).toISOString().slice(0, 19) !== text.slice(0, 19)) return null;
  return ms;
}

/** A decimal number cell; null when the cell is not a plain finite number. */
export function parseNumberCell(cell: string): number | null {
  const t = cell.trim();
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(t)) return null;
  const v = Number(t);
  return Number.isFinite(v) ? v : null;
}
