import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../../', import.meta.url));
const run = (...args: string[]) =>
  spawnSync(join(root, 'node_modules/.bin/tsx'), ['src/cli/main.ts', ...args], { cwd: root, encoding: 'utf8', timeout: 60_000 });
const dir = mkdtempSync(join(tmpdir(), 'cavitas-pipe-'));
const write = (name: string, data: unknown) => {
  const file = join(dir, name);
  writeFileSync(file, typeof data === 'string' ? data : JSON.stringify(data));
  return file;
};

describe('cli spectrum', () => {
  it('matches scipy.signal.welch (fixtures/welch/generate.py) and suppresses the mains when asked', () => {
    // Reference: scipy.signal.welch, window='hann', nperseg = fs * segmentSeconds, other arguments default.
    const fx = JSON.parse(readFileSync(join(root, 'fixtures/welch/welch-cases.json'), 'utf8'));
    const c = fx.cases.find((k: { name: string }) => k.name === 'fs200-seg2000');
    const res = run('spectrum', write('s.json', { sampleRateHz: 200, samples: c.samples, segmentSeconds: 10 }));
    expect(res.status).toBe(0);
    const out = JSON.parse(res.stdout) as { frequencies: number[]; power: number[] };
    expect(out.frequencies).toHaveLength(c.frequencies.length);
    const peak = Math.max(...c.power);
    out.power.forEach((p, k) => expect(Math.abs(p - c.power[k])).toBeLessThanOrEqual(1e-6 * Math.max(c.power[k], 1e-9 * peak)));
    const mains = JSON.parse(
      run('spectrum', write('m.json', { sampleRateHz: 200, samples: c.samples, segmentSeconds: 10, mainsHz: 50 })).stdout,
    );
    // the fixture's 0.4-amplitude 50 Hz tone stands far above the noise floor, and is gone after suppression
    expect(c.power[500] / c.power[450]).toBeGreaterThan(20);
    expect(mains.power[500] / c.power[450]).toBeLessThan(3);
    expect(mains.power[450]).toBe(out.power[450]);
  });

  it('reports its Welch statistics: segments averaged, window, overlap and K_eff (Welch 1967, eq. 7)', () => {
    const fx = JSON.parse(readFileSync(join(root, 'fixtures/welch/welch-cases.json'), 'utf8'));
    const c = fx.cases.find((k: { name: string }) => k.name === 'fs200-seg2000');
    const out = JSON.parse(
      run('spectrum', write('w.json', { sampleRateHz: 200, samples: c.samples, segmentSeconds: 10 })).stdout,
    );
    // 45 s in 10 s segments every 5 s: 8 segments; Hann at 50 % overlap, rho = 1/6
    expect(out.welch).toEqual({ segments: 8, window: 'hann', overlap: 0.5, effectiveAverages: expect.any(Number) });
    expect(out.welch.effectiveAverages).toBeCloseTo(8 / (1 + (2 * (1 - 1 / 8)) / 36), 12);
  });

  it('names the wrong field and exits non-zero', () => {
    const bad = run('spectrum', write('b.json', { sampleRateHz: 200, samples: [1, 2, 'x'], segmentSeconds: 10 }));
    expect(bad.status).not.toBe(0);
    expect(bad.stdout).toBe('');
    expect(bad.stderr).toMatch(/field "samples\[2\]"/);
    const syntax = run('spectrum', write('c.json', '{\n"sampleRateHz": 200,\n"samples": [1,,2]\n}'));
    expect(syntax.status).not.toBe(0);
    expect(syntax.stderr).toMatch(/line 3: not valid JSON/);
  });
});

describe('cli fit', () => {
  it('fits the example spectrum with the requested number of modes, sorted by frequency', () => {
    const res = run('fit', join(root, 'fixtures/series/example-spectrum.json'), '--modes', '4');
    expect(res.status).toBe(0);
    const out = JSON.parse(res.stdout);
    expect(out.modes).toHaveLength(4);
    const fs = out.modes.map((m: { frequency: number }) => m.frequency);
    expect([...fs].sort((a, b) => a - b)).toEqual(fs);
    // the example was made with modes at 7.9, 14.2, 20.5 and 26.6 Hz (fixtures/series/generate.py)
    [7.9, 14.2, 20.5, 26.6].forEach((f, n) => expect(Math.abs(fs[n] - f)).toBeLessThan(4 * out.modes[n].errors.frequency + 0.02));
    for (const m of out.modes) expect(m.q).toBeCloseTo(m.frequency / (2 * m.halfWidth), 12);
    expect(Object.keys(out.background)).toEqual(['b0', 'b1']);
    expect(out.misfit).toBeGreaterThan(0);
    // the band it fitted and no averages (the file gives none: the scatter was estimated from the misfit)
    expect(out.band.minHz).toBe(3);
    expect(out.band.maxHz).toBeGreaterThan(fs[3]);
    expect(out.averages).toBeNull();
  });

  it('reports per mode the peak, the error of ln peak and the correlation of (frequency, ln peak, halfWidth)', () => {
    const out = JSON.parse(run('fit', join(root, 'fixtures/series/example-spectrum.json'), '--modes', '4').stdout);
    for (const m of out.modes) {
      expect(m.peak).toBeCloseTo(m.amplitude + out.background.b0 + out.background.b1 * m.frequency, 10);
      expect(m.errors.lnPeak).toBeGreaterThan(0);
      expect(m.correlation).toHaveLength(3);
      for (let a = 0; a < 3; a++) {
        expect(m.correlation[a][a]).toBe(1);
        for (let b = 0; b < 3; b++) {
          expect(m.correlation[a][b]).toBeCloseTo(m.correlation[b][a], 12);
          expect(Math.abs(m.correlation[a][b])).toBeLessThanOrEqual(1 + 1e-12);
        }
      }
    }
  });

  it('refuses Welch statistics that are too few or contradictory, naming the field', () => {
    const spec = JSON.parse(readFileSync(join(root, 'fixtures/series/example-spectrum.json'), 'utf8'));
    const few = run(
      'fit',
      write('w1.json', { ...spec, welch: { segments: 3, window: 'hann', overlap: 0.5, effectiveAverages: 2.9 } }),
    );
    expect(few.status).not.toBe(0);
    expect(few.stderr).toMatch(/welch\.segments.*at least 4/);
    const over = run(
      'fit',
      write('w2.json', { ...spec, welch: { segments: 10, window: 'hann', overlap: 0.5, effectiveAverages: 12 } }),
    );
    expect(over.status).not.toBe(0);
    expect(over.stderr).toMatch(/welch\.effectiveAverages.*exceeds the 10 segments/);
  });

  it('names bad inputs', () => {
    const short = run('fit', write('f.json', { frequencies: [1, 2, 3], power: [1, 2] }));
    expect(short.status).not.toBe(0);
    expect(short.stderr).toMatch(/field "power": has 2 values/);
    const modes = run('fit', join(root, 'fixtures/series/example-spectrum.json'), '--modes', '2');
    expect(modes.status).not.toBe(0);
    expect(modes.stderr).toMatch(/--modes must be a whole number from 3 to 7/);
  });
});
