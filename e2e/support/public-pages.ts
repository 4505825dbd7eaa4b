import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { expect, type Locator, type Page } from '@playwright/test';
import { publicPaths, readerBase } from '../../server/public-site/public-paths';

/** The server files that declare the pages a reader reaches without an account. */
const publicRouteFiles = [
  'server/public-site/reader-routes.ts',
  'server/mail/subscriber-pages.ts',
  'server/publishing/public-routes.ts',
];

/**
 * Every GET address the public site answers, read from the `router.get(…)` lines of its route files, so tests that
 * visit every public page cover a new one as soon as it is declared. `${readerBase}` and `publicPaths.x()` are
 * resolved; parameters stay as written (`/read/roundups/:slug`).
 */
export function publicRoutePatterns(): string[] {
  const patterns: string[] = [];
  for (const file of publicRouteFiles) {
    const source = readFileSync(resolve(import.meta.dirname, '..', '..', file), 'utf8');
    for (const [, first] of source.matchAll(/router\.get\(\s*([^,]+),/g)) {
      patterns.push(resolvePattern(first.trim(), file));
    }
  }
  return [...new Set(patterns)];
}

function resolvePattern(expression: string, file: string): string {
  const literal = /^['`](.*)['`]$/.exec(expression);
  if (literal) return literal[1].replace(/\$\{readerBase\}/g, readerBase);
  if (expression === 'readerBase') return readerBase;
  const call = /^publicPaths\.(\w+)\(\)$/.exec(expression);
  if (call && call[1] in publicPaths) return (publicPaths as unknown as Record<string, () => string>)[call[1]]();
  throw new Error(`${file}: cannot read the address of router.get(${expression}, …); write it as a literal`);
}

/**
 * "Will it cope?" on a board's page, reached from its link: a package power out of range is refused and the room
 * temperature typed stays; `watts` in range gives an estimate in °F.
 */
export async function estimateOnBoardPage(page: Page, link: Locator, board: string, watts: string) {
  await link.click();
  await expect(page.getByRole('heading', { level: 1, name: board })).toBeVisible();
  await expect(page.getByText('This is an estimate, not a guarantee')).toBeVisible();
  await page.getByLabel('CPU package power (W)').fill('5000');
  await page.getByLabel('Room temperature (°F)').fill('75');
  await page.getByRole('button', { name: 'Estimate' }).click();
  await expect(page.getByText('Enter a package power between 10 and 1000 W.')).toBeVisible();
  await expect(page.getByLabel('Room temperature (°F)')).toHaveValue('75');
  await page.getByLabel('CPU package power (W)').fill(watts);
  await page.getByRole('button', { name: 'Estimate' }).click();
  await expect(page.getByRole('heading', { name: /Estimated hottest VRM reading/ })).toBeVisible();
  await expect(page.locator('.estimate-figure')).toContainText('°F');
}

/**
 * On the Compare boards page, with the boards ticked: chooses the load configuration whose name the option shows and
 * sends the form (its button looked for `within` the given part of the page).
 */
export async function compareUnder(page: Page, configuration: string, within: Page | Locator = page) {
  const option = await page.locator('#compare-configuration option', { hasText: configuration }).getAttribute('value');
  await page.getByLabel('Load configuration').selectOption(option ?? '');
  await within.getByRole('button', { name: 'Compare' }).click();
}
