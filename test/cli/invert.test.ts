/**
 * `invert` command contract: one JSON document on stdout with starts, seed,
 * seconds and the minima (misfit, count, sources, stdErrors, correlation),
 * counts adding up to --starts, the same minima for any --threads; bad cases
 * exit non-zero naming the problem, with nothing on stdout.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { refusals, root, runVerb } from './helpers';

const run = (args: string[]) => runVerb('invert', args, 120_000);

type Out = {
  starts: number;
  seed: number;
  seconds: number;
  minima: {
    misfit: number;
    count: number;
    sources: { name: string; lat: number; lon: number; intensity: number }[];
    stdErrors: Record<string, Record<string, number>>;
    correlation: { names: string[]; matrix: number[][] };
  }[];
};

describe('cli invert', () => {
  const file = join(root, 'fixtures/cases/two-minima.json');
  it('prints the minima of the mirror case, the same on 1 and 2 threads', () => {
    const one = run([file, '--starts', '8', '--seed', '2', '--threads', '1']);
    const two = run([file, '--starts', '8', '--seed', '2', '--threads', '2']);
    expect(one.status).toBe(0);
    expect(two.status).toBe(0);
    const a = JSON.parse(one.stdout) as Out;
    const b = JSON.parse(two.stdout) as Out;
    expect(a.starts).toBe(8);
    expect(a.seed).toBe(2);
    expect(a.seconds).toBeGreaterThan(0);
    expect(a.minima.reduce((s, m) => s + m.count, 0)).toBe(8);
    expect(b.minima).toEqual(a.minima);
    const m = a.minima[0];
    expect(m.sources[0].name).toBe('R1');
    expect(Object.keys(m.stdErrors.R1).sort()).toEqual(['intensity', 'lat', 'lon']);
    expect(m.correlation.names).toEqual(['R1.intensity', 'R1.lat', 'R1.lon']);
    expect(one.stderr).toMatch(/invert: 8\/8 starts/);
  });

  it('refuses a bad case with a message naming the problem and nothing on stdout', () => {
    const bad = refusals('invert', file, ['--threads', '1', '--starts', '2']);
    bad((x) => (x.observed[0].power[3] = 0), /observed\.0\.power\.3/);
    bad((x) => (x.unknowns[0].lat = { min: 10, max: -10 }), /unknowns\.0\.lat/);
    bad((x) => (x.observed[1].station = 'NOPE'), /NOPE/);
    bad((x) => {
      x.observed = [
        { ...x.observed[0], frequencies: x.observed[0].frequencies.slice(0, 2), power: x.observed[0].power.slice(0, 2) },
      ];
    }, /more free parameters \(3\) than data \(2\)/);
  });
});
