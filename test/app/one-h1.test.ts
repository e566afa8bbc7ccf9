/**
 * Every page has one top-level heading (common practice for accessible pages; WCAG 2.1 technique
 * G141, headings organise the page): an <h1>, a PageHeader (which renders one) or a Panel with
 * level={1} — one per JSX branch of the page file — unless the page only redirects.
 */
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = new URL('../../app/', import.meta.url).pathname;

function pages(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return pages(path);
    return name === 'page.tsx' ? [path] : [];
  });
}

describe('one h1 per page', () => {
  for (const file of pages(root)) {
    const name = relative(root, file);
    it(name, () => {
      const text = readFileSync(file, 'utf8');
      const headings = (text.match(/<h1[\s>]|<PageHeader[\s>]|<Panel\s+level=\{1\}/g) ?? []).length;
      const onlyRedirects = !/return\s*\(?\s*</.test(text) && /redirect\(/.test(text);
      // a page may return different JSX in separate branches (e.g. an invitation found or not): one heading each
      const branches = (text.match(/return\s*\(\s*</g) ?? []).length;
      if (onlyRedirects) expect(headings).toBe(0);
      else {
        expect(headings, `${name} has no top-level heading`).toBeGreaterThanOrEqual(1);
        expect(headings, `${name} has more top-level headings than JSX branches`).toBeLessThanOrEqual(Math.max(1, branches));
      }
    });
  }
});
