import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, startTestApp, type TestApp, signInAs } from './harness';

describe('smoke: the built app in a real browser', () => {
  let app: TestApp;
  let browser: Browser;
  beforeAll(async () => {
    app = await startTestApp();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await app?.stop();
  });

  it('the home page answers 200 and renders a titled HTML document', async () => {
    const page = await browser.newPage();
    const res = await page.goto(app.baseUrl + '/');
    expect(res?.status(), app.logs.slice(-20).join('\n')).toBe(200);
    expect(await page.title()).toMatch(/Cavitas/);
    await page.close();
  });

  it('the demo owner signs in with the seeded credentials', async () => {
    const owner = app.signIns.find((s) => s.role === 'owner');
    expect(owner, 'the accounts seeder exports DEMO_SIGN_INS with an owner').toBeDefined();
    const context = await browser.newContext();
    const page = await context.newPage();
    await signInAs(page, app.baseUrl, owner!);
    const cookies = await context.cookies();
    expect(cookies.some((c) => c.httpOnly)).toBe(true); // a session cookie was set
    await context.close();
  });
});
