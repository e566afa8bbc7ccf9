import { describe, expect, it } from 'vitest';
import { signInAs, useBrowserApp } from './harness';

describe('smoke: the built app in a real browser', () => {
  const env = useBrowserApp();

  it('the home page answers 200 and renders a titled HTML document', async () => {
    const page = await env.browser.newPage();
    const res = await page.goto(env.app.baseUrl + '/');
    expect(res?.status(), env.app.logs.slice(-20).join('\n')).toBe(200);
    expect(await page.title()).toMatch(/Cavitas/);
    await page.close();
  });

  it('the demo owner signs in with the seeded credentials', async () => {
    const owner = env.app.signIns.find((s) => s.role === 'owner');
    expect(owner, 'the accounts seeder exports DEMO_SIGN_INS with an owner').toBeDefined();
    const context = await env.browser.newContext();
    const page = await context.newPage();
    await signInAs(page, env.app.baseUrl, owner!);
    const cookies = await context.cookies();
    expect(cookies.some((c) => c.httpOnly)).toBe(true); // a session cookie was set
    await context.close();
  });
});
