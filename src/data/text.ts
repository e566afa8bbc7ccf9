/** Whole text of a byte stream (for the JSON layout, which is parsed whole). */
export async function textOf(chunks: AsyncIterable<Uint8Array>): Promise<string> {
  const decoder = new TextDecoder('utf-8');
  let out = '';
  for await (const chunk of chunks) out += decoder.decode(chunk, { stream: true });
  return out + decoder.decode();
}
