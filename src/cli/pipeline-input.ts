/** Reading the pipeline commands' JSON files, turning format errors into command-line errors. */
import { readFile } from 'node:fs/promises';
import { FormatError } from '@/src/engine/formats/format-error';
import { parseJsonText } from '@/src/engine/formats/json-text';
import { CliError } from './verb';

export async function readPipelineJson<T>(
  path: string | undefined,
  what: string,
  parse: (data: unknown, file: string) => T,
): Promise<T> {
  if (!path) throw new CliError(`missing the ${what} file argument`);
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch {
    throw new CliError(`cannot read ${what} file "${path}"`);
  }
  try {
    return parse(parseJsonText(text, path), path);
  } catch (e) {
    if (e instanceof FormatError) throw new CliError(e.message);
    throw e;
  }
}
