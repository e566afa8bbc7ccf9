/** An error in an input file, naming the file, the line (1-based) and the field where known. */
export class FormatError extends Error {
  constructor(
    readonly file: string,
    readonly line: number | null,
    readonly field: string | null,
    readonly problem: string,
  ) {
    super(`${file}${line !== null ? `, line ${line}` : ''}${field !== null ? `, field "${field}"` : ''}: ${problem}`);
  }
}
