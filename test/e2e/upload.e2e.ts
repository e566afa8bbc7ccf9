/**
 * Browser: an analyst uploads a time-series file on a demo station's page,
 * watches processing finish, sees the fitted modes of an interval and flags it.
 * The file is invented: Gaussian noise with a Lorentzian-mode spectrum
 * (frequency-domain synthesis, Timmer & Koenig 1995) around the usual
 * Schumann-resonance frequencies (common practice: about 7.8, 14.1, 20.3 Hz).
 */
import { mkdtempSync, writeFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signInAs, useBrowserApp } from './harness';
import { demoNetworkId } from '@/src/ops/seed/accounts';
import { getStationByCode } from '@/db/repo/stations';
import { seriesCsv, TEST_MODES } from '@/test/data/series-maker';

describe('upload a station file and see its modes', () => {
  const env = useBrowserApp();
  let dir = '';
  beforeAll(async () => {
    dir = mkdtempSync(path.join(tmpdir(), 'cavitas-upload-'));
  });
  afterAll(async () => {
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  it('uploads, processes and shows the fitted modes', async () => {
    const networkId = await demoNetworkId();
    const station = (await getStationByCode(networkId, 'BRQ'))!;
    expect(station, 'the stations seeder creates BRQ').toBeTruthy();
    const file = path.join(dir, 'brq-2026-03-15.csv');
    writeFileSync(
      file,
      seriesCsv({
        station: 'BRQ',
        fs: station.sampleRateHz,
        startUtc: '2026-03-15T06:00:00Z',
        seconds: 600,
        seed: Date.now() % 100000,
        components: { Ez: { kind: 'modes', modes: TEST_MODES, floor: 0.3, unit: 'mV/m' } },
      }),
    );

    const analyst = env.app.signIns.find((s) => s.role === 'analyst')!;
    const context = await env.browser.newContext();
    const page = await context.newPage();
    await signInAs(page, env.app.baseUrl, analyst);

    await page.goto(`${env.app.baseUrl}/n/${networkId}/stations/${station.id}`);
    await expect(page.getByText('Field safety').first().isVisible()).resolves.toBe(true);
    await page.getByRole('tab', { name: 'Files' }).click();
    await page.locator('#upload-files').setInputFiles(file);
    // processing finishes: the file's row says "processed"
    const row = page.getByRole('row').filter({ hasText: 'brq-2026-03-15.csv' });
    await row.getByText('processed').waitFor({ timeout: 90_000 });

    await page.reload();
    await page.getByLabel('UTC day').selectOption('2026-03-15');
    await page.getByLabel('Component').selectOption('Ez');
    await page.getByRole('button', { name: 'Spectrum' }).first().click();
    const modes = page.getByRole('table', { name: 'Fitted modes' });
    await modes.waitFor({ timeout: 30_000 });
    const first = await modes.getByRole('row').nth(1).getByRole('cell').nth(1).textContent();
    expect(Math.abs(Number(first) - TEST_MODES[0].f)).toBeLessThan(0.5);

    // an analyst flags the interval with a reason; the table shows it
    const intervalRow = page.getByRole('row').filter({ hasText: '2026-03-15 06:00 UTC' });
    await intervalRow.getByRole('button', { name: 'Flag', exact: true }).click();
    await page.getByLabel(/Why should runs leave out/).fill('invented test: tractor beside the antenna');
    await page.getByRole('button', { name: 'Flag interval' }).click();
    await page.getByText('invented test: tractor beside the antenna').waitFor({ timeout: 30_000 });
    await expect(intervalRow.getByRole('button', { name: 'Unflag' }).count()).resolves.toBe(1);
    await context.close();
  });
});
