/**
 * Split a stream of text (or UTF-8 bytes) into lines without holding the
 * whole file: yields each line with its 1-based number, tolerating CRLF.
 * A final line without a newline is yielded with `complete: false` so that
 * parsers can report a file that was cut off mid-line.
 */
export interface TextLine {
  text: string;
  number: number;
  /** false only for a last line that had no line break after it. */
  complete: boolean;
}

export async function* linesOf(
  chunks: AsyncIterable<string | Uint8Array> | Iterable<string | Uint8Array>,
): AsyncGenerator<TextLine> {
  const decoder = new TextDecoder('utf-8', { fatal: false });
  let rest = '';
  let number = 0;
  for await (const chunk of chunks as AsyncIterable<string | Uint8Array>) {
    rest += typeof chunk === 'string' ? chunk : decoder.decode(chunk, { stream: true });
    let at = rest.indexOf('\n');
    let from = 0;
    while (at >= 0) {
      const end = at > from && rest.charCodeAt(at - 1) === 13 ? at - 1 : at;
      yield { text: rest.slice(from, end), number: ++number, complete: true };
      from = at + 1;
      at = rest.indexOf('\n', from);
    }
    rest = rest.slice(from);
  }
  rest += decoder.decode();
  if (rest.length > 0) yield { text: rest.endsWith('\r') ? rest.slice(0, -1) : rest, number: ++number, complete: false };
}
