/**
 * Browser: a viewer compares the two demo runs (spectra and fitted modes) side
 * by side: the settings table marks what differs (the observables), the
 * parameter table lists each region's intensity from both with a verdict on
 * their agreement, both minima are on maps side by side with one colour bar
 * and each region outlined in the same colour on both, each minimum's fit is
 * listed per station and component with chi-square, dof and probability, and
 * the daily curves are drawn with their error bands. Then two picks of one run.
 */
import { describe, expect, it } from 'vitest';
import { signInAs, useBrowserApp } from './harness';
import { demoNetworkId } from '@/src/ops/seed/accounts';
import { DEMO_MODE_RUN, DEMO_RUN } from '@/src/ops/seed/runs';

describe('compare side by side', () => {
  const env = useBrowserApp();

  it('shows two runs’ settings, parameters and agreement', async () => {
    const networkId = await demoNetworkId();
    const viewer = env.app.signIns.find((s) => s.role === 'viewer')!;
    const context = await env.browser.newContext({ viewport: { width: 1300, height: 900 } });
    const page = await context.newPage();
    await signInAs(page, env.app.baseUrl, viewer);
    const { runs } = (await (await page.request.get(`${env.app.baseUrl}/api/networks/${networkId}/runs`)).json()) as {
      runs: { id: string; name: string }[];
    };
    const a = runs.find((r) => r.name === DEMO_RUN)!.id;
    const b = runs.find((r) => r.name === DEMO_MODE_RUN)!.id;
    await page.goto(`${env.app.baseUrl}/n/${networkId}/compare`);
    await page.getByLabel('Run A').selectOption(a);
    await page.getByLabel('Run B').selectOption(b);
    await page.getByRole('button', { name: 'Compare' }).click();
    const settings = page.getByTestId('settings-diff');
    await settings.waitFor();
    await expect(settings.locator('tr[data-differs="true"]').filter({ hasText: 'Observables' }).count()).resolves.toBe(1);
    await expect(settings.locator('tr[data-differs="false"]').filter({ hasText: 'Source grid' }).count()).resolves.toBe(1);
    const params = page.getByTestId('parameter-table');
    await params.getByText(/Middle belt\.intensity/).waitFor();
    await expect(params.getByText(/agree \(≤ 1σ\)|within 2σ|differ \(> 2σ\)/).count()).resolves.toBeGreaterThan(0);
    await page.getByText('Best-minimum intensities of both runs').waitFor();

    // Maps side by side: the same colour bar on both, and a region outlined in one colour on both.
    const maps = page.getByTestId('compare-maps');
    await maps.getByTestId('compare-map-A').locator('svg path').first().waitFor();
    const bars = maps.locator('svg[aria-label^="Colour bar"]');
    await expect(bars.count()).resolves.toBe(2);
    expect(await bars.nth(0).getAttribute('aria-label')).toBe(await bars.nth(1).getAttribute('aria-label'));
    const outlines = (side: 'A' | 'B') =>
      maps.getByTestId(`compare-map-${side}`).evaluate((el) => {
        const out: Record<string, string> = {};
        for (const t of el.querySelectorAll('title')) {
          const shape = t.parentElement!;
          const stroke = shape.getAttribute('stroke');
          const name = (t.textContent ?? '').split(':')[0];
          if (stroke && stroke.startsWith('#') && shape.tagName !== 'g') out[name] = stroke;
        }
        return out;
      });
    const [inA, inB] = [await outlines('A'), await outlines('B')];
    const shared = Object.keys(inA).filter((k) => k in inB);
    expect(shared).toContain('Middle belt');
    for (const k of shared) expect(inB[k], k).toBe(inA[k]);
    // Fit per station and component for both minima.
    for (const side of ['A', 'B']) {
      const fit = page.getByTestId(`compare-fit-${side}`);
      await fit.getByRole('columnheader', { name: 'P(≥ χ²)' }).waitFor();
      await expect(fit.locator('tbody tr').count()).resolves.toBeGreaterThan(0);
    }
    // The daily curves carry their ±1σ bands (translucent areas under the lines).
    const curves = page.locator('figure', { hasText: 'Best-minimum intensities of both runs' });
    await curves.locator('svg.cv-plot [fill-opacity]').first().waitFor();

    // Two picks of one run: the same minimum against itself agrees everywhere.
    await page.goto(`${env.app.baseUrl}/n/${networkId}/compare?a=${a}&b=${a}&am=0&bm=0`);
    await params.waitFor();
    await expect(page.getByTestId('settings-diff').locator('tr[data-differs="true"]').count()).resolves.toBe(0);
    await expect(params.getByText(/differ \(> 2σ\)/).count()).resolves.toBe(0);
    await context.close();
  });
});
