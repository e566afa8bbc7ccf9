/**
 * Byte chunks to text lines (UTF-8, LF or CRLF), streaming: memory holds one
 * chunk plus one partial line.
 */
export async function* linesOf(chunks: AsyncIterable<Uint8Array>): AsyncGenerator<string> {
  const decoder = new TextDecoder('utf-8', { fatal: false });
  let rest = '';
  for await (const chunk of chunks) {
    rest += decoder.decode(chunk, { stream: true });
    let nl = rest.indexOf('\n');
    let start = 0;
    while (nl !== -1) {
      const line = rest.slice(start, nl);
      yield line.endsWith('\r') ? line.slice(0, -1) : line;
      start = nl + 1;
      nl = rest.indexOf('\n', start);
    }
    rest = rest.slice(start);
  }
  rest += decoder.decode();
  if (rest.length) yield rest.endsWith('\r') ? rest.slice(0, -1) : rest;
}

/** Whole text of a byte stream (for the JSON layout, which is parsed whole). */
export async function textOf(chunks: AsyncIterable<Uint8Array>): Promise<string> {
  const decoder = new TextDecoder('utf-8');
  let out = '';
  for await (const chunk of chunks) out += decoder.decode(chunk, { stream: true });
  return out + decoder.decode();
}
