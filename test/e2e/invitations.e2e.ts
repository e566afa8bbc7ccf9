/**
 * Invitation round trip in a real browser: a new scientist signs up, creates
 * a network and invites a colleague as viewer; the administrator finds the
 * caught invitation in the mailbox page but sees its envelope only; the
 * colleague accepts it (the link read from their copy of the mail) in a
 * second browser context by creating an account, lands in the network, and
 * as a viewer can neither see role controls nor change a role through the API.
 * Screenshots of the key pages go to test-results/e2e/.
 */
import fs from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { useBrowserApp } from './harness';
import { getMail, listMail } from '@/db/repo/mail';

const SHOTS = 'test-results/e2e';
const stamp = Date.now().toString(36);
const founder = { name: 'Ysolde Brankov', email: `founder.${stamp}@example.org`, password: 'founder-long-pass-1' };
const colleague = { name: 'Odo Marchetti', email: `colleague.${stamp}@example.org`, password: 'colleague-long-pass-2' };
const networkName = `Saltmarsh Listening Posts ${stamp}`;

async function shot(page: Page, name: string) {
  fs.mkdirSync(SHOTS, { recursive: true });
  await page.screenshot({ path: `${SHOTS}/${name}.png`, fullPage: true });
}

describe('invitations in the browser', () => {
  const env = useBrowserApp();
  let networkUrl = '';
  let inviteLink = '';

  it('a new user signs up, creates a network and invites a colleague', async () => {
    const ctx = await env.browser.newContext();
    const page = await ctx.newPage();
    await page.goto(env.app.baseUrl + '/sign-up');
    await page.getByLabel('Your name').fill(founder.name);
    await page.getByLabel('E-mail address').fill(founder.email);
    await page.getByLabel('Password').fill(founder.password);
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.waitForURL('**/networks', { timeout: 60_000 });

    await page.getByLabel('Network name').fill(networkName);
    await page.getByRole('button', { name: 'Create network' }).click();
    await page.waitForURL(/\/n\/[0-9a-f-]{36}$/, { timeout: 60_000 });
    networkUrl = page.url();
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe(networkName);
    await shot(page, 'network-overview');

    await page
      .getByRole('navigation', { name: /sections/ })
      .getByRole('link', { name: 'Members' })
      .click();
    await page.waitForURL('**/members');
    await page.getByLabel('E-mail address').fill(colleague.email);
    await page.getByLabel('Role', { exact: true }).selectOption('viewer');
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await expect(page.getByText(`Invitation sent to ${colleague.email}`).waitFor({ timeout: 30_000 })).resolves.toBeUndefined();
    await shot(page, 'members-owner');
    await ctx.close();
  });

  it('the administrator finds the invitation in the mailbox page', async () => {
    const admin = env.app.signIns.find((s) => s.role === 'administrator')!;
    const ctx = await env.browser.newContext();
    const page = await ctx.newPage();
    await page.goto(env.app.baseUrl + '/sign-in?next=/admin/mail');
    await page.getByLabel('E-mail address').fill(admin.email);
    await page.getByLabel('Password').fill(admin.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/admin/mail', { timeout: 60_000 });
    let found = false;
    for (let i = 0; i < 20 && !found; i++) {
      found = (await page.getByRole('link', { name: new RegExp(networkName) }).count()) > 0;
      if (!found) {
        await page.waitForTimeout(500);
        await page.reload();
      }
    }
    expect(found, 'invitation mail listed').toBe(true);
    await shot(page, 'admin-mailbox');
    await page
      .getByRole('link', { name: new RegExp(networkName) })
      .first()
      .click();
    // The administrator sees the envelope only: the body holds a live invitation link.
    await page.getByTestId('mail-withheld').waitFor();
    expect(await page.getByTestId('mail-body').count()).toBe(0);
    expect(await page.content()).not.toMatch(/\/invitations\/[A-Za-z0-9_-]{20,}/);
    await ctx.close();
    // The colleague has no account yet: their copy is read where their mail would arrive.
    const [mail] = await listMail({ to: colleague.email, limit: 1 });
    inviteLink = (await getMail(mail.id))?.text?.match(/https?:\/\/\S+\/invitations\/\S+/)?.[0] ?? '';
    expect(inviteLink).toMatch(/\/invitations\//);
  });

  it('the colleague accepts in a second browser context by creating an account', async () => {
    const ctx = await env.browser.newContext();
    const page = await ctx.newPage();
    await page.goto(env.app.baseUrl + new URL(inviteLink).pathname);
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe(`Join ${networkName}`);
    await shot(page, 'invitation-accept');
    await page.getByLabel('Your name').fill(colleague.name);
    await page.getByLabel('Choose a password').fill(colleague.password);
    await page.getByRole('button', { name: 'Create account and join' }).click();
    await page.waitForURL(networkUrl, { timeout: 60_000 });

    await page.goto(networkUrl + '/members');
    await page.getByRole('heading', { name: 'Members', level: 1 }).waitFor();
    expect(await page.getByRole('combobox').count()).toBe(0); // no role selects for a viewer
    await expect(page.getByText('Only owners can invite people').isVisible()).resolves.toBe(true);
    await shot(page, 'members-viewer');

    // Even a hand-made request is refused by the server.
    const networkId = networkUrl.split('/n/')[1];
    const result = await page.evaluate(async (id) => {
      const members = await (await fetch(`/api/networks/${id}/members`)).json();
      const target = members.members.find((m: { role: string }) => m.role === 'owner');
      const r = await fetch(`/api/networks/${id}/members/${target.userId}`, {
        method: 'PATCH',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ role: 'viewer' }),
      });
      return { status: r.status, body: await r.json() };
    }, networkId);
    expect(result.status).toBe(403);
    expect(result.body.error.code).toBe('forbidden');
    await ctx.close();
  });

  it('the invitation link cannot be used a second time', async () => {
    const ctx = await env.browser.newContext();
    const page = await ctx.newPage();
    await page.goto(env.app.baseUrl + new URL(inviteLink).pathname);
    await expect(page.getByText('already been used').isVisible()).resolves.toBe(true);
    await ctx.close();
  });
});
