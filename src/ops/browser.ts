/**
 * Headless Chromium for the browser tests and the page benchmark: Debian's
 * /usr/bin/chromium driven by playwright-core, never a downloaded browser.
 */
import { chromium, type Browser } from 'playwright-core';
import { CHROMIUM } from './test-plan';

/** Flags for a sandboxed root session on a machine without a network. */
export const CHROMIUM_FLAGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-dev-shm-usage',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** Headless chromium; playwright gives each launch a new temporary profile folder. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: CHROMIUM, headless: true, args: CHROMIUM_FLAGS });
}
