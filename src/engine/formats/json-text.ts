/**
 * Parse JSON text; on a syntax error, find where it is (the JSON grammar of
 * RFC 8259 walked once more, only on failure) and report that line.
 */
import { FormatError } from './format-error';

/** Offset of the first syntax error in `text`, or -1 when it parses. */
export function jsonErrorOffset(text: string): number {
  let i = 0;
  const ws = () => {
    while (i < text.length && ' \t\n\r'.includes(text[i])) i++;
  };
  const fail = (): never => {
    throw i;
  };
  const value = (): void => {
    ws();
    const c = text[i];
    if (c === '{') {
      i++;
      ws();
      if (text[i] === '}') return void i++;
      for (;;) {
        ws();
        if (text[i] !== '"') fail();
        string();
        ws();
        if (text[i] !== ':') fail();
        i++;
        value();
        ws();
        if (text[i] === ',') i++;
        else if (text[i] === '}') return void i++;
        else fail();
      }
    } else if (c === '[') {
      i++;
      ws();
      if (text[i] === ']') return void i++;
      for (;;) {
        value();
        ws();
        if (text[i] === ',') i++;
        else if (text[i] === ']') return void i++;
        else fail();
      }
    } else if (c === '"') string();
    else {
      const m = /^(-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?|true|false|null)/.exec(text.slice(i, i + 400));
      if (!m) fail();
      else i += m[0].length;
    }
  };
  const string = () => {
    i++;
    while (i < text.length && text[i] !== '"') {
      if (text.charCodeAt(i) < 0x20) fail();
      i += text[i] === '\\' ? 2 : 1;
    }
    if (i >= text.length) fail();
    i++;
  };
  try {
    value();
    ws();
    return i < text.length ? i : -1;
  } catch (at) {
    return typeof at === 'number' ? at : 0;
  }
}

export function parseJsonText(text: string, file: string): unknown {
  try {
    return JSON.parse(text);
  } catch (e) {
    const at = jsonErrorOffset(text);
    let line: number | null = null;
    if (at >= 0) {
      line = 1;
      for (let k = 0; k < at && k < text.length; k++) if (text.charCodeAt(k) === 10) line++;
    }
    throw new FormatError(file, line, null, `not valid JSON (${(e as Error).message.split('\n')[0].slice(0, 80)})`);
  }
}
