import { describe, expect, it } from 'vitest';
import { parseSeriesJson, parseSpectrumJson } from '@/src/engine/formats/pipeline-json';
import { parseJsonText } from '@/src/engine/formats/json-text';

describe('pipeline JSON documents', () => {
  it('accepts a series and works out the segment length', () => {
    const s = parseSeriesJson({ sampleRateHz: 200, samples: new Array(2000).fill(0), segmentSeconds: 10, extra: 1 }, 's.json');
    expect(s.segmentLength).toBe(2000);
  });

  it('names the wrong field', () => {
    expect(() => parseSeriesJson({ sampleRateHz: -1, samples: [1, 2], segmentSeconds: 1 }, 's.json')).toThrow(
      /s\.json, field "sampleRateHz"/,
    );
    expect(() => parseSeriesJson({ sampleRateHz: 10, samples: [1, 'x', 3], segmentSeconds: 0.2 }, 's.json')).toThrow(
      /field "samples\[1\]"/,
    );
    expect(() => parseSeriesJson({ sampleRateHz: 10, samples: [1, 2, 3], segmentSeconds: 0.25 }, 's.json')).toThrow(
      /field "segmentSeconds": 0.25 s at 10 Hz/,
    );
    expect(() => parseSeriesJson({ sampleRateHz: 10, samples: [1, 2, 3], segmentSeconds: 1 }, 's.json')).toThrow(
      /field "samples": 3 samples are fewer/,
    );
    expect(() => parseSeriesJson({ samples: [1, 2, 3], segmentSeconds: 1 }, 's.json')).toThrow(/field "sampleRateHz"/);
    expect(() => parseSpectrumJson({ frequencies: [1, 2, 3], power: [1, 2] }, 'p.json')).toThrow(/field "power": has 2 values/);
    expect(() => parseSpectrumJson({ frequencies: [1, 3, 2], power: [1, 2, 3] }, 'p.json')).toThrow(/field "frequencies\[2\]"/);
    expect(() => parseSpectrumJson({ frequencies: [1, 2], power: [1, -2] }, 'p.json')).toThrow(/field "power\[1\]"/);
  });

  it('gives the line of a JSON syntax error', () => {
    expect(() => parseJsonText('{\n  "a": 1,\n  "b": oops\n}', 'bad.json')).toThrow(/bad\.json, line 3: not valid JSON/);
  });
});

describe('JSON syntax locator', () => {
  it('agrees with JSON.parse on what parses (RFC 8259 grammar)', async () => {
    const { jsonErrorOffset } = await import('@/src/engine/formats/json-text');
    const good = ['{"a":[1,-2.5e3,true,null,"x\\"y"]}', ' [ ] ', '"s"', '{"n":{"m":[{}]}}', '0'];
    const bad = ['{"a":1,}', '[1 2]', '{"a" 1}', '01', '"open', '{"a":1}}', 'nul'];
    for (const t of good) expect(jsonErrorOffset(t)).toBe(-1);
    for (const t of bad) {
      expect(() => JSON.parse(t)).toThrow();
      expect(jsonErrorOffset(t)).toBeGreaterThanOrEqual(0);
    }
  });
});
