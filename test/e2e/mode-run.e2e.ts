/**
 * Browser: a viewer opens the demo run that inverted the stations' fitted
 * modes and reads how good it is and how the starts went: the mode fits
 * (observed and predicted frequency, peak intensity and half-width per mode,
 * with a sortable table of weighted residuals) and the starts picture drawn
 * at each start's own final misfit, with the unconverged marked apart. The
 * demo data are the invented synthetic day of the stations seeder.
 */
import { describe, expect, it } from 'vitest';
import { signInAs, useBrowserApp } from './harness';
import { demoNetworkId } from '@/src/ops/seed/accounts';
import { DEMO_MODE_RUN } from '@/src/ops/seed/runs';
import { listRuns } from '@/db/repo/runs';

describe("a mode-parameter run's page", () => {
  const env = useBrowserApp();

  it('shows the mode fits with their residual table and every start at its own misfit', async () => {
    const networkId = await demoNetworkId();
    const run = (await listRuns(networkId)).find((r) => r.name === DEMO_MODE_RUN)!;
    expect(run.state).toBe('finished');
    const viewer = env.app.signIns.find((s) => s.role === 'viewer')!;
    const context = await env.browser.newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signInAs(page, env.app.baseUrl, viewer);
    await page.goto(`${env.app.baseUrl}/n/${networkId}/runs/${run.id}`);

    // How good it is: three figures for the chosen station and component, and the residual table.
    const fits = page.getByTestId('mode-fits');
    await fits.waitFor({ timeout: 60_000 });
    await fits.getByText(/^Mode frequency, /).waitFor();
    await fits.locator('svg[aria-label^="Peak intensity, "]').waitFor({ state: 'attached', timeout: 30_000 });
    await fits.locator('svg[aria-label^="Half-width, "]').waitFor({ state: 'attached' });
    const table = page.getByTestId('mode-residuals');
    const rows = table.locator('tbody tr');
    expect(await rows.count()).toBeGreaterThan(0);
    // Sorting by mode number puts mode 1 first.
    await table.getByRole('button', { name: 'Mode', exact: true }).click();
    await expect.poll(() => rows.first().locator('td').nth(2).textContent()).toBe('1');

    // How sure we are: the starts picture from each start's own end, one mark per drawn start.
    const starts = page.getByTestId('starts-picture');
    await starts.waitFor();
    expect(await starts.getAttribute('data-own-misfits')).toBe('yes');
    await starts.locator('svg[aria-label^="Where the "]').waitFor({ state: 'attached', timeout: 30_000 });
    expect(await starts.locator('svg[aria-label^="Where the "] g[data-mark="dot"] > *').count()).toBeGreaterThan(0);
    expect(errors).toEqual([]);
    await context.close();
  }, 300_000);
});
