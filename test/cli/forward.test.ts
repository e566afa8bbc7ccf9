import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { predictSpectraDirect } from '@/src/engine/forward/direct-spectra';
import type { Spectrum } from '@/src/engine/forward/types';

const root = fileURLToPath(new URL('../../', import.meta.url));
const run = (file: string) =>
  spawnSync(join(root, 'node_modules/.bin/tsx'), ['src/cli/main.ts', 'forward', file], {
    cwd: root,
    encoding: 'utf8',
    timeout: 60_000,
  });

describe('cli forward', () => {
  for (const name of ['forward-near-antipode.json', 'forward-two-sources-ij.json'])
    it(`${name}: one spectrum per station and component in input order, agreeing with table-free evaluation to 1e-4`, () => {
      const file = join(root, 'fixtures/cases', name);
      const res = run(file);
      expect(res.status).toBe(0);
      const out = JSON.parse(res.stdout) as { spectra: Spectrum[] };
      const c = JSON.parse(readFileSync(file, 'utf8'));
      const want = c.stations.flatMap((s: { code: string; components: string[] }) => s.components.map((k) => `${s.code}.${k}`));
      expect(out.spectra.map((s) => `${s.station}.${s.component}`)).toEqual(want);
      const ref = predictSpectraDirect(c);
      out.spectra.forEach((s, i) => {
        expect(s.frequencies).toEqual(ref[i].frequencies);
        // absolute floor far below any physical level: B vanishes exactly at the antipode
        s.power.forEach((p, j) => expect(Math.abs(p - ref[i].power[j])).toBeLessThanOrEqual(1e-4 * ref[i].power[j] + 1e-40));
      });
    });

  it('a source given by grid cells is one point per cell centre sharing the intensity by area (the polar row: 36 equal shares at 85 N)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'cavitas-fwd-'));
    const base = {
      cavity: { model: 'linear', earthRadiusKm: 6371, heightKm: 60 },
      band: { minHz: 6, maxHz: 30, stepHz: 2 },
      stations: [{ code: 'QQA', lat: 12, lon: 40, components: ['Ez', 'Bns', 'Bew'] }],
    };
    const cells = join(dir, 'cells.json');
    const points = join(dir, 'points.json');
    writeFileSync(
      cells,
      JSON.stringify({
        ...base,
        sources: [{ cells: { cellSizeDeg: 10, ids: Array.from({ length: 36 }, (_, i) => 612 + i) }, intensity: 3.6e4 }],
      }),
    );
    writeFileSync(
      points,
      JSON.stringify({
        ...base,
        sources: Array.from({ length: 36 }, (_, i) => ({ lat: 85, lon: -175 + 10 * i, intensity: 1e3 })),
      }),
    );
    const a = run(cells);
    const b = run(points);
    expect(a.status, a.stderr).toBe(0);
    const pa = (JSON.parse(a.stdout) as { spectra: Spectrum[] }).spectra;
    const pb = (JSON.parse(b.stdout) as { spectra: Spectrum[] }).spectra;
    pa.forEach((s, i) =>
      s.power.forEach((p, j) => expect(Math.abs(p - pb[i].power[j])).toBeLessThanOrEqual(1e-12 * pb[i].power[j])),
    );
  });

  it('a malformed case exits non-zero with a message naming the field, and no stack trace', () => {
    const dir = mkdtempSync(join(tmpdir(), 'cavitas-fwd-'));
    const file = join(dir, 'bad.json');
    const c = JSON.parse(readFileSync(join(root, 'fixtures/cases/forward-near-antipode.json'), 'utf8'));
    c.stations[1].components = ['Ez', 'Bx'];
    writeFileSync(file, JSON.stringify(c));
    const res = run(file);
    expect(res.status).not.toBe(0);
    expect(res.stdout).toBe('');
    expect(res.stderr).toMatch(/stations\.1\.components\.1/);
    expect(res.stderr).not.toMatch(/\n\s+at /);
    writeFileSync(file, '{ "cavity": ');
    const broken = run(file);
    expect(broken.status).not.toBe(0);
    expect(broken.stderr).toMatch(/not valid JSON/);
  });
});
