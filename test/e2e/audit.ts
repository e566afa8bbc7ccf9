/**
 * Page audit for the browser tests: an accessibility scan with axe-core (Deque's
 * rules for WCAG 2.1 A/AA and common practice) and screenshots of the page and
 * of each of its figures into test-results/screens/ (kept as test artefacts).
 *
 * axe-core is evaluated through the DevTools protocol (page.evaluate), which the
 * app's Content-Security-Policy does not govern, so the page under test keeps
 * its real headers.
 */
import { mkdirSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import type { Page } from 'playwright-core';
import type { AxeResults, ImpactValue } from 'axe-core';

export const SCREENS_DIR = path.resolve('test-results/screens');

const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

/** The WCAG 2.0/2.1 levels A and AA, plus axe's common-practice rules (landmarks, one h1, region). */
const AXE_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'best-practice'];

/** Impacts that fail a page (axe grades minor < moderate < serious < critical). */
const FAILING: ImpactValue[] = ['serious', 'critical'];

export interface AuditFinding {
  page: string;
  rule: string;
  impact: ImpactValue;
  help: string;
  targets: string[];
}

export interface PageAudit {
  page: string;
  /** Every finding, any impact. */
  findings: AuditFinding[];
  /** Only the serious and critical ones. */
  failing: AuditFinding[];
  figures: number;
}

function slug(text: string): string {
  return (
    text
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '')
      .slice(0, 60) || 'figure'
  );
}

/** Wait until the page has settled: network quiet, fonts loaded, client figures drawn. */
export async function settle(page: Page): Promise<void> {
  await page.waitForLoadState('networkidle', { timeout: 30_000 }).catch(() => undefined);
  await page.evaluate(() => document.fonts.ready.then(() => undefined));
  // A figure drawn in the browser replaces its placeholder with an <svg>; give them a moment together.
  await page
    .waitForFunction(() => [...document.querySelectorAll('figure')].every((f) => f.querySelector('svg, img, canvas, p')), null, {
      timeout: 15_000,
    })
    .catch(() => undefined);
}

/** Run axe-core on the page as it stands now. */
export async function axeScan(page: Page, name: string): Promise<AuditFinding[]> {
  const loaded = await page.evaluate(() => typeof (window as unknown as { axe?: unknown }).axe === 'object');
  if (!loaded) await page.evaluate(axeSource);
  const results = (await page.evaluate(
    (tags) =>
      (window as unknown as { axe: { run: (ctx: unknown, opts: unknown) => Promise<unknown> } }).axe.run(document, {
        runOnly: { type: 'tag', values: tags },
        resultTypes: ['violations'],
      }),
    AXE_TAGS,
  )) as AxeResults;
  return results.violations.map((v) => ({
    page: name,
    rule: v.id,
    impact: v.impact ?? 'minor',
    help: v.help,
    targets: v.nodes.slice(0, 5).map((n) => n.target.join(' ')),
  }));
}

/** Screenshots of the whole page and of each figure on it; returns how many figures were saved. */
export async function screenshots(page: Page, name: string): Promise<number> {
  mkdirSync(SCREENS_DIR, { recursive: true });
  await page.screenshot({ path: path.join(SCREENS_DIR, `${name}.png`), fullPage: true });
  const figures = page.locator('figure:visible');
  const count = await figures.count();
  for (let i = 0; i < count; i++) {
    const figure = figures.nth(i);
    const caption = figure.locator('figcaption > span').first();
    const title = (await caption.count()) ? ((await caption.textContent()) ?? '') : '';
    await figure.scrollIntoViewIfNeeded();
    await figure.screenshot({ path: path.join(SCREENS_DIR, `${name}--${String(i + 1).padStart(2, '0')}-${slug(title)}.png`) });
  }
  return count;
}

/** Settle, scan and photograph the page under `name` (a file-name-safe label). */
export async function auditPage(page: Page, name: string): Promise<PageAudit> {
  await settle(page);
  const findings = await axeScan(page, name);
  const figures = await screenshots(page, name);
  return { page: name, findings, failing: findings.filter((f) => FAILING.includes(f.impact)), figures };
}

/** One line per finding, for a failure message or a log. */
export function describeFindings(findings: AuditFinding[]): string {
  return findings.map((f) => `${f.page}: [${f.impact}] ${f.rule} — ${f.help} (${f.targets.join(', ')})`).join('\n');
}
