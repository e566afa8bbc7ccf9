/**
 * `siting` command contract: the standard errors linearised at the case's sources, without and with each
 * candidate station, agree within 2 % with an outside computation — a finite-difference Jacobian of an
 * independent numpy forward model with mpmath kernels, then (J^T W J)^-1 (fixtures/studies/siting_reference.py;
 * Tarantola 2005, Inverse Problem Theory, §3.2) — and a well-placed candidate lowers them. Bad input exits 2
 * naming the field, with nothing on stdout.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { RegionErrors, SitingResult } from '@/src/engine/studies/types';
import { refusals, root, runVerb } from './helpers';

const caseFile = join(root, 'fixtures/studies/siting-case.json');
const sitesFile = join(root, 'fixtures/studies/siting-sites.json');
const reference = JSON.parse(readFileSync(join(root, 'fixtures/studies/siting_reference.json'), 'utf8')) as SitingResult;
/** Agreement asked of the linearised errors against the outside computation. */
const AGREEMENT = 0.02;

function expectClose(got: RegionErrors, want: RegionErrors) {
  expect(Object.keys(got).sort()).toEqual(Object.keys(want).sort());
  for (const [region, errs] of Object.entries(want))
    for (const [kind, v] of Object.entries(errs)) expect(Math.abs(got[region][kind as 'lat']! / v! - 1)).toBeLessThan(AGREEMENT);
}

describe('cli siting', () => {
  it('agrees with the numpy reference to 2 %, and a well-placed candidate lowers the errors', () => {
    const res = runVerb('siting', [caseFile, '--candidates', sitesFile]);
    expect(res.status).toBe(0);
    const out = JSON.parse(res.stdout) as SitingResult;
    expectClose(out.baseline.stdErrors, reference.baseline.stdErrors);
    expect(out.candidates).toHaveLength(reference.candidates.length);
    out.candidates.forEach((c, i) => {
      expect([c.lat, c.lon, c.components]).toEqual([
        reference.candidates[i].lat,
        reference.candidates[i].lon,
        reference.candidates[i].components,
      ]);
      expectClose(c.stdErrors, reference.candidates[i].stdErrors);
      // more data never widens a linearised error
      for (const [region, errs] of Object.entries(c.stdErrors))
        for (const [kind, v] of Object.entries(errs))
          expect(v).toBeLessThanOrEqual(out.baseline.stdErrors[region][kind as 'lat']! * (1 + 1e-9));
    });
    // the first candidate stands near region R2, which the network sees from afar: its centre errors shrink by a third
    const near = out.candidates[0].stdErrors.R2;
    expect(near.lat!).toBeLessThan((2 / 3) * out.baseline.stdErrors.R2.lat!);
    expect(near.lon!).toBeLessThan((2 / 3) * out.baseline.stdErrors.R2.lon!);
  });

  it('refuses a bad case naming the field, with exit code 2 and nothing on stdout', () => {
    const bad = refusals('siting', caseFile, ['--candidates', sitesFile]);
    bad((x) => delete x.noise, /field "noise"/);
    bad((x) => (x.noise.sigmaLog = 0), /noise\.sigmaLog.*above 0/);
    bad((x) => (x.sources[1].lat = 15), /sources\[1\] \(R2\)\.lat: 15 lies outside/);
    bad((x) => (x.sources[0].name = 'R9'), /sources\[0\]\.name: no unknown is named "R9"/);
  });

  it('refuses bad candidates naming them', () => {
    const dir = mkdtempSync(join(tmpdir(), 'cavitas-siting-'));
    const check = (sites: unknown, pattern: RegExp) => {
      const f = join(dir, 'sites.json');
      writeFileSync(f, JSON.stringify(sites));
      const res = runVerb('siting', [caseFile, '--candidates', f]);
      expect(res.status).toBe(2);
      expect(res.stdout).toBe('');
      expect(res.stderr).toMatch(pattern);
    };
    check([{ lat: 48.2, lon: 11.4, components: ['Ez'] }], /candidates\[0\].*on the site of station NRA/);
    check([{ lat: 0, lon: 0, components: ['Ez'], sigmaLog: -0.1 }], /field "0\.sigmaLog".*above 0/);
    check([], /at least one candidate/);
    const missing = runVerb('siting', [caseFile]);
    expect(missing.status).toBe(2);
    expect(missing.stderr).toMatch(/--candidates/);
  });
});
