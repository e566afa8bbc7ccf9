/**
 * Browser: every page of the demo, signed out, as the network's owner and as the
 * administrator, is scanned with axe-core (WCAG 2.1 A/AA and common practice) and
 * photographed (the page and each figure, into test-results/screens/). No page
 * may have a serious or critical finding. Then a few key flows by keyboard alone:
 * tab order reaches every control with a visible focus ring, tabs move with the
 * arrow keys, and a confirmation closes with Escape.
 *
 * With GUIDE_SHOTS=1 the walkthrough's images in public/guide/ are taken afresh.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import { signInAs, useBrowserApp } from './harness';
import { auditPage, describeFindings, SCREENS_DIR, type PageAudit } from './audit';
import { demoNetworkId } from '@/src/ops/seed/accounts';
import { DEMO_MODE_RUN, DEMO_RUN } from '@/src/ops/seed/runs';

const VIEWPORT = { width: 1280, height: 860 };
const GUIDE_DIR = path.resolve('public/guide');

describe('every page: accessibility scan and screenshots', () => {
  const env = useBrowserApp();
  const audits: PageAudit[] = [];

  afterAll(() => {
    mkdirSync(SCREENS_DIR, { recursive: true });
    writeFileSync(path.join(SCREENS_DIR, 'axe-findings.json'), JSON.stringify(audits, null, 2));
  });

  async function visit(page: Page, url: string, name: string, ready?: () => Promise<unknown>): Promise<PageAudit> {
    const res = await page.goto(env.app.baseUrl + url);
    expect(res?.status(), `${url} answers`).toBeLessThan(500);
    await ready?.();
    const audit = await auditPage(page, name);
    audits.push(audit);
    return audit;
  }

  async function guideShot(page: Page, file: string): Promise<void> {
    if (process.env.GUIDE_SHOTS !== '1') return;
    mkdirSync(GUIDE_DIR, { recursive: true });
    await page.screenshot({ path: path.join(GUIDE_DIR, file) });
  }

  /** Scrolls a section's heading to the top of the window, below the sticky header. */
  async function toTop(page: Page, heading: string): Promise<void> {
    await page
      .getByRole('heading', { name: heading })
      .first()
      .evaluate((el) => {
        el.scrollIntoView({ block: 'start' });
        window.scrollBy(0, -110);
      });
  }

  /** A signed-in owner of the demo network, and a reader of the network's API as that owner. */
  async function asOwner() {
    const networkId = await demoNetworkId();
    const owner = env.app.signIns.find((s) => s.role === 'owner')!;
    const context = await env.browser.newContext({ viewport: VIEWPORT });
    const page = await context.newPage();
    await signInAs(page, env.app.baseUrl, owner);
    const api = async <T>(p: string) =>
      (await (await page.request.get(`${env.app.baseUrl}/api/networks/${networkId}${p}`)).json()) as T;
    return { networkId, context, page, api };
  }

  function expectClean(group: string): void {
    const failing = audits.filter((a) => a.page.startsWith(group)).flatMap((a) => a.failing);
    expect(failing, describeFindings(failing)).toEqual([]);
  }

  it('signed-out pages and a shared run link', async () => {
    const { networkId, context: member, page: ownerPage, api } = await asOwner();
    const { runs } = await api<{ runs: { id: string; name: string }[] }>('/runs');
    const runId = runs.find((r) => r.name === DEMO_RUN)!.id;
    const made = await ownerPage.request.post(`${env.app.baseUrl}/api/networks/${networkId}/runs/${runId}/links`, {
      data: { expiresInDays: 2 },
      headers: { origin: env.app.baseUrl },
    });
    expect(made.status()).toBe(201);
    const link = new URL(((await made.json()) as { url: string }).url);
    await member.close();

    const outsider = await env.browser.newContext({ viewport: VIEWPORT });
    const page = await outsider.newPage();
    await visit(page, '/sign-in', 'out-sign-in');
    await guideShot(page, '1-sign-in.png');
    await visit(page, '/sign-up', 'out-sign-up');
    await visit(page, '/forgot-password', 'out-forgot-password');
    await visit(page, '/reset-password?token=not-a-real-token', 'out-reset-password');
    await visit(page, '/invitations/not-a-real-token', 'out-invitation');
    await visit(page, link.pathname, 'out-shared-run', () => page.getByRole('heading', { name: 'Minima' }).waitFor());
    await outsider.close();
    expectClean('out-');
  }, 300_000);

  it('every page of the demo network, as its owner', async () => {
    const { networkId, context, page, api } = await asOwner();
    const { runs } = await api<{ runs: { id: string; name: string }[] }>('/runs');
    const { stations } = await api<{ stations: { id: string }[] }>('/stations');
    const { grids } = await api<{ grids: { id: string }[] }>('/grids');
    const { models } = await api<{ models: { id: string }[] }>('/models');
    const n = `/n/${networkId}`;
    const runA = runs.find((r) => r.name === DEMO_RUN)!.id;
    const runB = runs.find((r) => r.name === DEMO_MODE_RUN)!.id;

    await visit(page, '/networks', 'owner-networks');
    await visit(page, n, 'owner-overview');
    await guideShot(page, '2-overview.png');
    await visit(page, `${n}/stations`, 'owner-stations');
    await visit(page, `${n}/stations/${stations[0].id}`, 'owner-station-day', () =>
      page.locator('figure svg').first().waitFor({ timeout: 30_000 }),
    );
    await guideShot(page, '3-station-day.png');
    await page.getByRole('tab', { name: 'Files' }).click();
    audits.push(await auditPage(page, 'owner-station-files'));
    await visit(page, `${n}/stations/new`, 'owner-station-new');
    await visit(page, `${n}/stations/${stations[0].id}/edit`, 'owner-station-edit');
    await visit(page, `${n}/grids`, 'owner-grids');
    await visit(page, `${n}/grids/${grids[0].id}`, 'owner-grid');
    await visit(page, `${n}/grids/new`, 'owner-grid-new');
    await visit(page, `${n}/grids/${grids[0].id}/edit`, 'owner-grid-edit');
    await visit(page, `${n}/models`, 'owner-models');
    await visit(page, `${n}/models/${models[0].id}`, 'owner-model');
    await visit(page, `${n}/models/new`, 'owner-model-new');
    await visit(page, `${n}/models/${models[0].id}/edit`, 'owner-model-edit');
    await visit(page, `${n}/runs`, 'owner-runs');
    await visit(page, `${n}/runs/new`, 'owner-run-new');
    for (const [id, name] of [
      [runA, 'owner-run-spectra'],
      [runB, 'owner-run-modes'],
    ] as const) {
      await visit(page, `${n}/runs/${id}`, name, () => page.getByRole('heading', { name: 'What came out' }).first().waitFor());
      if (id === runA) {
        await toTop(page, 'What came out');
        await guideShot(page, '4-run-map.png');
        await toTop(page, 'How good it is');
        await guideShot(page, '5-run-fits.png');
      }
    }
    await visit(page, `${n}/compare?a=${runA}&b=${runB}&am=0&bm=0`, 'owner-compare', () =>
      page.getByTestId('parameter-table').waitFor(),
    );
    await guideShot(page, '6-compare.png');
    await visit(page, `${n}/members`, 'owner-members');
    await visit(page, '/account', 'owner-account');
    await visit(page, '/mail', 'owner-mail');
    await context.close();
    expectClean('owner-');
    // Every figure of a run page was photographed (map, fits, residuals, correlations, starts, day curves).
    for (const name of ['owner-run-spectra', 'owner-run-modes'])
      expect(audits.find((a) => a.page === name)?.figures, name).toBeGreaterThan(5);
  }, 900_000);

  it('the administrator’s pages', async () => {
    const admin = env.app.signIns.find((s) => s.role === 'administrator')!;
    const context = await env.browser.newContext({ viewport: VIEWPORT });
    const page = await context.newPage();
    await signInAs(page, env.app.baseUrl, admin);
    await visit(page, '/admin', 'admin-home');
    await visit(page, '/admin/settings', 'admin-settings');
    await visit(page, '/admin/mail', 'admin-mail');
    await context.close();
    expectClean('admin-');
  }, 300_000);

  it('by keyboard: every control of the sign-in form in order, with a visible focus ring', async () => {
    const context = await env.browser.newContext({ viewport: VIEWPORT });
    const page = await context.newPage();
    await page.goto(`${env.app.baseUrl}/sign-in`);
    const controls = await page.locator('main input:visible, main button:visible, main a[href]:visible').count();
    const reached = new Set<string>();
    for (let i = 0; i < 40 && reached.size < controls; i++) {
      await page.keyboard.press('Tab');
      const focus = await page.evaluate(() => {
        const el = document.activeElement as HTMLElement | null;
        if (!el || el === document.body) return null;
        const style = getComputedStyle(el);
        return {
          inMain: !!el.closest('main'),
          key: `${el.tagName}:${el.getAttribute('name') ?? el.getAttribute('href') ?? el.textContent?.trim()}`,
          ring: style.outlineStyle !== 'none' && parseFloat(style.outlineWidth) >= 1,
        };
      });
      if (!focus?.inMain) continue;
      expect(focus.ring, `${focus.key} shows where the focus is`).toBe(true);
      reached.add(focus.key);
    }
    expect(reached.size).toBe(controls);
    // Type and submit without the mouse.
    const owner = env.app.signIns.find((s) => s.role === 'owner')!;
    await page.getByLabel(/e-?mail/i).focus();
    await page.keyboard.type(owner.email);
    await page.keyboard.press('Tab');
    await page.keyboard.type(owner.password);
    await page.keyboard.press('Enter');
    await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'), { timeout: 30_000 });
    await context.close();
  });

  it('by keyboard: station tabs move with the arrow keys; a removal question closes with Escape', async () => {
    const { networkId, context, page, api } = await asOwner();
    const { stations } = await api<{ stations: { id: string }[] }>('/stations');
    await page.goto(`${env.app.baseUrl}/n/${networkId}/stations/${stations[0].id}`);
    await page.getByRole('tab', { name: 'Day view' }).focus();
    await page.keyboard.press('ArrowRight');
    await expect(page.getByRole('tab', { name: 'Files' }).getAttribute('aria-selected')).resolves.toBe('true');
    await expect(page.evaluate(() => document.activeElement?.getAttribute('role'))).resolves.toBe('tab');

    await page.goto(`${env.app.baseUrl}/n/${networkId}/stations/${stations[0].id}/edit`);
    const remove = page.getByRole('button', { name: /^Remove station/ });
    await remove.focus();
    await page.keyboard.press('Enter');
    const keep = page.getByRole('button', { name: /^Keep/ });
    await keep.waitFor();
    await expect(keep.evaluate((el) => el === document.activeElement)).resolves.toBe(true);
    await page.keyboard.press('Escape');
    await keep.waitFor({ state: 'detached' });
    await expect(remove.evaluate((el) => el === document.activeElement)).resolves.toBe(true);
    await context.close();
  });
});
