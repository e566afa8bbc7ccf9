/**
 * Browser: an analyst describes a cavity model and draws a source grid,
 * launches a run on the stored demo data, watches the progress bar reach the
 * end, and opens the map, minima, fits, correlation matrix and a misfit
 * surface; opened afresh, the run page's first view comes drawn in the HTML
 * and every figure then goes live in the browser. The demo data are the invented synthetic day of the stations seeder.
 */
import { describe, expect, it } from 'vitest';
import { signInAs, useBrowserApp } from './harness';
import { demoNetworkId } from '@/src/ops/seed/accounts';

describe('configure a model and a grid, run, and read the results', () => {
  const env = useBrowserApp();

  it('goes from a new model and grid to a finished run with its figures', async () => {
    const t0 = Date.now();
    const step = (s: string) => console.log(`[runs e2e] ${((Date.now() - t0) / 1000).toFixed(1)} s: ${s}`);
    const networkId = await demoNetworkId();
    const analyst = env.app.signIns.find((s) => s.role === 'analyst')!;
    const context = await env.browser.newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    await signInAs(page, env.app.baseUrl, analyst);

    step('sign-in done');
    // A cavity model: the linear propagation parameter.
    await page.goto(`${env.app.baseUrl}/n/${networkId}/models/new`);
    await page.getByLabel('Name').fill('E2E linear');
    await page.getByLabel('Propagation parameter from').selectOption('linear');
    await page.getByText('Real part of ν').first().waitFor();
    await page.getByRole('button', { name: 'Save model' }).click();
    await page.waitForURL(/\/models\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    await page.getByRole('heading', { name: 'E2E linear · version 1' }).waitFor();

    step('model saved');
    // A source grid: one moving region and one region of cells dragged as a box.
    await page.goto(`${env.app.baseUrl}/n/${networkId}/grids/new`);
    await page.getByLabel('Name', { exact: true }).fill('E2E grid');
    await page.getByRole('button', { name: 'Add a moving region' }).click();
    await page.getByRole('button', { name: 'Add a region of cells' }).click();
    await page.getByLabel('Drag a box', { exact: true }).check();
    const canvas = page.getByTestId('grid-canvas');
    const box = (await canvas.boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.52, box.y + box.height * 0.42);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width * 0.56, box.y + box.height * 0.5, { steps: 5 });
    await page.mouse.up();
    await expect(
      page
        .getByText(/^\d+ cells?$/)
        .first()
        .textContent(),
    ).resolves.not.toBe('0 cells');
    await page.getByRole('button', { name: 'Save grid' }).click();
    await page.waitForURL(/\/grids\/[0-9a-f-]{36}$/, { timeout: 30_000 });

    step('grid saved');
    // Launch a run on one stored interval of the demo day.
    await page.goto(`${env.app.baseUrl}/n/${networkId}/runs/new`);
    await page.getByLabel('Run name').fill('E2E run');
    await page.getByLabel('Cavity model').selectOption({ label: 'E2E linear v1' });
    await page.getByLabel('Source grid').selectOption({ label: 'E2E grid v1' });
    await page.getByLabel(/^First interval start \(UTC/).fill('2026-03-14 15:00');
    await page.getByLabel(/^Last interval start \(UTC/).fill('2026-03-14 15:00');
    await page.getByLabel(/^Bins to use/).fill('5');
    await page.getByLabel('Starts').fill('2');
    await page.getByRole('button', { name: 'Check and preview' }).click();
    await page.getByTestId('run-preview').waitFor({ timeout: 30_000 });
    await page.getByRole('button', { name: 'Launch run' }).click();
    await page.waitForURL(/\/runs\/[0-9a-f-]{36}$/, { timeout: 30_000 });

    step('run launched');
    // The progress bar reaches the end.
    // The page polls the run while it is queued or running; it must reach the end without a reload.
    const state = page.getByTestId('run-state');
    const deadline = Date.now() + 420_000;
    let text = '';
    while (Date.now() < deadline) {
      try {
        await state.filter({ hasText: /Finished|Stopped by an error|Cancelled/ }).waitFor({ timeout: 20_000 });
        text = (await state.textContent()) ?? '';
        break;
      } catch {
        step(`still ${(await state.textContent()) ?? '?'}`);
      }
    }
    if (text !== 'Finished') {
      throw new Error(
        `the run did not finish (${text || 'timed out'}): ${await page
          .getByRole('alert')
          .first()
          .textContent()
          .catch(() => '')}\n${env.app.logs.slice(-40).join('\n')}`,
      );
    }
    await page.getByText('100 %').first().waitFor();

    step('run finished');
    // Map, minima, fits, correlation matrix.
    await page.locator('svg title', { hasText: 'Source regions of the selected minimum' }).waitFor({ state: 'attached' });
    await page.getByRole('table', { name: /Distinct minima/ }).waitFor();
    await page
      .getByText(/^Power at /)
      .first()
      .waitFor({ timeout: 60_000 });
    await page.getByText('Correlation matrix of the parameters').waitFor();
    await page.getByText('Research estimate, not a lightning warning').first().waitFor();

    step('figures shown');
    // Goodness of fit in the open: the run's chi2, dof and probability, the selected interval per station
    // and component, the minima's probabilities, and how the errors are meant (as stated, the default).
    await page.getByTestId('goodness').waitFor();
    await expect(page.getByTestId('goodness-run-chi2').textContent()).resolves.toMatch(/\d/);
    await expect(page.getByTestId('goodness-run-p').textContent()).resolves.toMatch(/\d/);
    const perSeries = page.getByRole('table', { name: /selected interval per station and component/ });
    await perSeries.waitFor();
    expect(await perSeries.locator('tbody tr').count()).toBeGreaterThan(0);
    await page
      .getByRole('table', { name: /Distinct minima/ })
      .getByText('P(≥ χ²)')
      .waitFor();
    await expect(page.getByTestId('error-scaling').textContent()).resolves.toMatch(/as stated/);

    // Opened afresh, the page brings its first view drawn in the HTML (before any script runs); the
    // browser then redraws every figure live (its own width, hover texts), leaving none of the server's.
    const html = await (await page.request.get(page.url())).text();
    for (const name of ['Correlation matrix of the parameters', 'Weighted residuals'])
      expect(html).toContain(`aria-label="${name}"`);
    expect(html).toMatch(/aria-label="Power at /);
    expect(html).toMatch(/aria-label="Where the \d+ starts ended"/);
    await page.reload();
    await page.waitForFunction(
      () =>
        document.querySelectorAll('[data-drawn="server"]').length === 0 &&
        document.querySelectorAll('[data-drawn="client"]').length >= 4,
      undefined,
      { timeout: 60_000 },
    );
    expect(await page.locator('svg[aria-label^="Power at "] title').count()).toBeGreaterThan(0); // hover texts are back

    step('first view drawn by the server, then live');
    // A misfit surface over the first two parameters, computed by the worker.
    await page.getByRole('button', { name: 'Map the misfit' }).click();
    await page.getByText(/^Misfit over /).waitFor({ timeout: 180_000 });
    await context.close();
  }, 900_000);
});
