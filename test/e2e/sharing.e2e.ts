/**
 * Browser: an analyst comments on the demo run and makes a read-only link to
 * it; a fresh browser context that is not signed in opens the link and sees
 * the run's map, minima, fits and the comment shown as text (and nothing to
 * change or write); once the analyst revokes the link, the same address
 * answers a plain page with status 410 saying it was withdrawn.
 */
import { describe, expect, it } from 'vitest';
import { signInAs, useBrowserApp } from './harness';
import { demoNetworkId } from '@/src/ops/seed/accounts';
import { DEMO_RUN } from '@/src/ops/seed/runs';

describe('comment on a run and share it by link', () => {
  const env = useBrowserApp();

  it('comments, makes a link, opens it signed out, revokes it', async () => {
    const networkId = await demoNetworkId();
    const analyst = env.app.signIns.find((s) => s.role === 'analyst')!;
    const member = await env.browser.newContext({ viewport: { width: 1300, height: 900 } });
    const page = await member.newPage();
    await signInAs(page, env.app.baseUrl, analyst);
    const runs = (await (await page.request.get(`${env.app.baseUrl}/api/networks/${networkId}/runs`)).json()) as {
      runs: { id: string; name: string }[];
    };
    const runId = runs.runs.find((r) => r.name === DEMO_RUN)!.id;
    await page.goto(`${env.app.baseUrl}/n/${networkId}/runs/${runId}`);
    await page.getByLabel('Link lasts (days)').fill('3');
    await page.getByRole('button', { name: 'Make a read-only link' }).click();
    const url = await page.getByTestId('new-link-url').inputValue();
    expect(url).toMatch(/\/shared\/[A-Za-z0-9_.-]+$/);
    // Other browser tests may share this demo run too (as its owner): work on the analyst's own link row
    // (the demo analyst's name is set in src/ops/seed/accounts.ts).
    const ownLink = page.getByTestId('run-links').locator('tbody tr').filter({ hasText: 'Teodor Rask' });
    await ownLink.getByRole('cell', { name: 'Open', exact: true }).waitFor();
    const remark = 'The <b>second</b> minimum looks as good & deserves a look';
    await page.getByRole('textbox', { name: 'Comment' }).fill(remark);
    await page.getByRole('button', { name: 'Post comment' }).click();
    await page.getByTestId('comment-body').filter({ hasText: remark }).waitFor();

    const outsider = await env.browser.newContext({ viewport: { width: 1300, height: 900 } });
    const guest = await outsider.newPage();
    const opened = await guest.goto(url);
    expect(opened?.status()).toBe(200);
    expect(new URL(guest.url()).pathname).toMatch(/^\/shared\/.+\/run$/);
    await guest.getByTestId('shared-run-name').filter({ hasText: DEMO_RUN }).waitFor();
    await guest.getByRole('heading', { name: 'Minima' }).waitFor();
    await guest.getByText('Station and component').first().waitFor();
    await guest.locator('svg path').first().waitFor();
    expect(await guest.getByRole('button', { name: /Delete|Cancel run|Make a read-only link/ }).count()).toBe(0);
    expect(await guest.getByRole('link', { name: /CSV|JSON/ }).count()).toBe(0);
    // The comment is there, as text (no <b> element made of it), and there is nothing to write with.
    await guest.getByTestId('comment-body').filter({ hasText: remark }).waitFor();
    expect(await guest.getByTestId('comment-body').locator('b').count()).toBe(0);
    expect(await guest.getByRole('button', { name: 'Post comment' }).count()).toBe(0);
    // The link's API answers for this run only; the network's API still wants a sign-in.
    expect((await guest.request.get(`${env.app.baseUrl}/api/networks/${networkId}/runs/${runId}`)).status()).toBe(401);

    await ownLink.getByRole('button', { name: 'Revoke' }).click();
    await ownLink.getByText(/Revoked by/).waitFor();
    const again = await guest.goto(url);
    expect(again?.status()).toBe(410);
    await guest.getByTestId('link-state').filter({ hasText: 'This link was withdrawn' }).waitFor();
    await outsider.close();
    await member.close();
  });
});
