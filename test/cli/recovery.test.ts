/**
 * `recovery` command contract: on a well-posed invented network with a known truth, the stated errors hold up
 * over 50 noise realisations — pulls (estimate - truth) / stdError with spread near 1 and the +-1 stdError interval
 * holding the truth in about 68 % of them (the standard check of stated errors on synthetic data; Tarantola 2005,
 * Inverse Problem Theory, ch. 1; common practice) — with log-normal noise of a stated sigma and with raw series
 * through the pipeline's own Welch estimate (log bias and bin correlation; Welch 1967). The same seed gives the
 * same study on any thread count; bad input exits 2 naming the field.
 */
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { RecoveryResult } from '@/src/engine/studies/types';
import { meanAndSpread } from '@/src/engine/stats/mean-spread';
import { refusals, root, runVerb } from './helpers';

const sigmaCase = join(root, 'fixtures/studies/siting-case.json');
const welchCase = join(root, 'fixtures/studies/recovery-welch-case.json');
const REALISATIONS = 50;

function study(file: string, args: string[]): RecoveryResult {
  const res = runVerb('recovery', [file, ...args], 600_000);
  expect(res.stderr).toMatch(/recovery: \d+\/\d+ realisations/);
  expect(res.status).toBe(0);
  return JSON.parse(res.stdout) as RecoveryResult;
}

/** Pulls of all parameters taken together: spread about their common mean, and the share within +-1. */
function pooled(r: RecoveryResult) {
  const n = r.realisations;
  const { mean } = meanAndSpread(r.parameters.map((p) => p.pullMean));
  const ss = r.parameters.reduce((a, p) => a + p.pullSpread ** 2 * (n - 1) + n * (p.pullMean - mean) ** 2, 0);
  return {
    spread: Math.sqrt(ss / (n * r.parameters.length - 1)),
    coverage68: meanAndSpread(r.parameters.map((p) => p.coverage68)).mean,
  };
}

function expectHonest(r: RecoveryResult) {
  expect(r.realisations).toBe(REALISATIONS);
  expect(r.singular).toBe(0);
  expect(r.parameters.map((p) => p.name)).toEqual(['R1.intensity', 'R1.lat', 'R1.lon', 'R2.intensity', 'R2.lat', 'R2.lon']);
  const all = pooled(r);
  expect(all.spread).toBeGreaterThan(0.8);
  expect(all.spread).toBeLessThan(1.25);
  expect(all.coverage68).toBeGreaterThan(0.58);
  expect(all.coverage68).toBeLessThan(0.78);
  // each parameter alone, within about 3.5 sigma of sampling scatter for 50 realisations
  for (const p of r.parameters) {
    expect(Math.abs(p.pullMean)).toBeLessThan(0.5);
    expect(p.pullSpread).toBeGreaterThan(0.65);
    expect(p.pullSpread).toBeLessThan(1.4);
    expect(p.coverage68).toBeGreaterThan(0.45);
    expect(p.coverage95).toBeGreaterThan(0.8);
    expect(Math.abs(p.mean - p.truth)).toBeLessThan(4 * (p.spread / Math.sqrt(REALISATIONS)) + 1e-9);
  }
  // chi-square of each realisation has mean N - n: the mean of 50 within 4 sqrt(2 (N - n) / 50)
  expect(Math.abs(r.meanMisfit - r.degreesOfFreedom)).toBeLessThan(4 * Math.sqrt((2 * r.degreesOfFreedom) / REALISATIONS));
}

describe('cli recovery', () => {
  it('log-normal noise: pulls of spread 0.8-1.25 and 68 % coverage within 58-78 % over 50 realisations', () => {
    const r = study(sigmaCase, ['--realisations', String(REALISATIONS), '--seed', '1', '--starts', '16', '--threads', '1']);
    expect(r.seed).toBe(1);
    expectHonest(r);
  }, 600_000);

  it('Welch noise from raw series: the same holds with the log bias and bin correlation', () => {
    expectHonest(study(welchCase, ['--realisations', String(REALISATIONS), '--seed', '2', '--starts', '16', '--threads', '1']));
  }, 600_000);

  it('gives the same study for the same seed, on one thread or two, and another for another seed', () => {
    const args = ['--realisations', '3', '--starts', '8'];
    const a = study(sigmaCase, [...args, '--seed', '7', '--threads', '1']);
    const b = study(sigmaCase, [...args, '--seed', '7', '--threads', '2']);
    const c = study(sigmaCase, [...args, '--seed', '8', '--threads', '1']);
    expect(b).toEqual(a);
    expect(c.parameters[0].mean).not.toBe(a.parameters[0].mean);
  }, 300_000);

  it('refuses bad input naming the field, with exit code 2 and nothing on stdout', () => {
    const bad = refusals('recovery', sigmaCase, ['--realisations', '2', '--starts', '2', '--threads', '1']);
    bad((x) => (x.noise = { sigmaLog: -0.1 }), /noise\.sigmaLog.*above 0/);
    bad((x) => (x.sources[0].lon = 60), /sources\[0\] \(R1\)\.lon: 60 lies outside/);
    for (const [args, pattern] of [
      [['--realisations', '0'], /--realisations must be a whole number from 1/],
      [[], /--realisations N is required/],
    ] as const) {
      const res = runVerb('recovery', [sigmaCase, ...args]);
      expect(res.status).toBe(2);
      expect(res.stdout).toBe('');
      expect(res.stderr).toMatch(pattern);
    }
    const welch = refusals('recovery', welchCase, ['--realisations', '1', '--starts', '2', '--threads', '1']);
    welch((x) => (x.band.minHz = 6.1), /band\.minHz: with Welch noise/);
  }, 300_000);
});
