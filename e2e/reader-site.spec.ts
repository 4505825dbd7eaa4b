import { readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { expect, test } from '@playwright/test';
import { compareUnder, estimateOnBoardPage } from './support/public-pages';

const thin = '\u2009';
const demoTitle = 'Helix-1700 boards under €150';

test.describe('reader site with JavaScript off', () => {
  test.use({ javaScriptEnabled: false });

  test('a reader opens the live demo roundup, switches to °F, compares boards, asks for an estimate and downloads the open data', async ({
    page,
  }) => {
    await page.goto('/read');
    await expect(page.getByRole('heading', { level: 1, name: 'Power-delivery roundups' })).toBeVisible();
    await page.getByRole('link', { name: demoTitle }).click();

    // The whole page is there without JavaScript: picks, cautions, methodology, a chart and table per load.
    await expect(page.getByRole('heading', { level: 1, name: demoTitle })).toBeVisible();
    await expect(page.getByRole('main')).toBeVisible();
    await expect(page.getByRole('banner')).toBeVisible();
    await expect(page.getByRole('heading', { name: 'The picks at a glance' })).toBeVisible();
    await expect(
      page.getByText('Power-delivery heatsinks and the rear of a board get hot enough to burn'),
    ).toBeVisible();
    await expect(page.getByRole('heading', { name: 'How we tested' })).toBeVisible();
    const stockTable = page.getByRole('table', { name: /HX-16 stock, all-core load: hottest VRM reading, absolute/ });
    await expect(stockTable).toBeVisible();
    await expect(stockTable.getByRole('row')).toHaveCount(5); // header + four boards
    await expect(page.getByRole('heading', { name: 'Where each sample came from' })).toBeVisible();
    await expect(page.getByRole('heading', { name: 'Corrections and updates' })).toBeVisible();
    const firstPeak = (await stockTable.getByRole('row').nth(1).getByRole('cell').first().innerText()).trim();
    expect(firstPeak).toMatch(new RegExp(`^\\d+\\.\\d${thin}°C`));

    // °F by a plain link: the same reading, converted (°F = °C × 9/5 + 32, ITS-90 definitions).
    await page.getByRole('link', { name: 'Show temperatures in °F' }).click();
    await expect(page).toHaveURL(/unit=F/);
    const celsius = Number(firstPeak.split(thin)[0]);
    const firstCell = stockTable.getByRole('row').nth(1).getByRole('cell').first();
    await expect(firstCell).toContainText(`${thin}°F`);
    const shownF = Number((await firstCell.innerText()).trim().split(thin)[0]);
    // The page converts the unrounded reading, so allow the 0.05 °C rounding of the °C figure (× 9/5).
    expect(Math.abs(shownF - ((celsius * 9) / 5 + 32))).toBeLessThanOrEqual(0.1);

    // Open data: the CSV of every run of record, and a raw logger file (the demo editor allows them).
    const csvDownload = page.waitForEvent('download');
    await page.getByRole('link', { name: 'Results (CSV)' }).click();
    const csv = await csvDownload;
    expect(csv.suggestedFilename()).toMatch(/results\.csv$/);
    const csvText = readFileSync(await csv.path(), 'utf8');
    expect(csvText.split('\r\n')[0]).toContain('peak_c');
    expect(csvText.trim().split('\r\n')).toHaveLength(1 + 4 * 3);
    const rawDownload = page.waitForEvent('download');
    await page.locator('.raw-files a').first().click();
    expect((await rawDownload).suggestedFilename()).toMatch(/^run-\d+\.csv$/);

    // Compare with a GET form.
    await page.getByRole('navigation', { name: 'Site' }).getByRole('link', { name: 'Compare boards' }).click();
    await page.getByLabel('Korvath KV Ridgeline B50').check();
    await page.getByLabel('Tarnwell Wend B50').check();
    await compareUnder(page, 'HX-16 stock, all-core load');
    const compared = page.getByRole('table', { name: /hottest VRM reading over the room/ });
    await expect(compared.getByRole('row')).toHaveCount(3);
    await expect(compared).toContainText('°F'); // the choice of unit stays

    // The estimate on a board's page.
    const board = 'Korvath KV Ridgeline B50';
    await estimateOnBoardPage(page, compared.getByRole('link', { name: board }), board, '250');
  });
});

test.describe('reader site with JavaScript on', () => {
  test('charts are drawn over the tables and °C/°F switches in place, within the reader JS budget', async ({
    page,
  }) => {
    const scripts: string[] = [];
    page.on('response', (response) => {
      if (response.request().resourceType() === 'script') scripts.push(response.url());
    });
    await page.goto('/read');
    await page.getByRole('link', { name: demoTitle }).click();
    await expect(page.locator('figure[data-chart="results"] canvas').first()).toBeVisible();
    await expect(page.locator('figure[data-chart="results"] canvas')).toHaveCount(3);
    const firstCell = page.locator('.results-table tbody tr').first().locator('td').first();
    const before = await firstCell.innerText();
    const url = page.url();
    await page.getByRole('link', { name: 'Show temperatures in °F' }).click();
    await expect(firstCell).toContainText('°F');
    expect(before).toContain('°C');
    // No page load: the address gained the unit, and the same document switched in place.
    expect(page.url().split('?')[0]).toBe(url.split('?')[0]);
    await page.reload();
    await expect(firstCell).toContainText('°F');

    // No React on reader pages: only the reader entry and its chunks load.
    expect(scripts.length).toBeGreaterThan(0);
    expect(scripts.some((s) => /\/assets\/main-/.test(s))).toBe(false);
  });

  test('the reader script and everything it loads stay within 80 KB gzipped (from the build output)', () => {
    const clientDir = path.resolve('dist/client');
    const manifest = JSON.parse(readFileSync(path.join(clientDir, '.vite/manifest.json'), 'utf8')) as Record<
      string,
      { file: string; imports?: string[]; dynamicImports?: string[] }
    >;
    const seen = new Set<string>();
    const walk = (key: string) => {
      if (seen.has(key)) return;
      seen.add(key);
      for (const next of [...(manifest[key].imports ?? []), ...(manifest[key].dynamicImports ?? [])]) walk(next);
    };
    walk('src/public/chart-island.ts');
    const files = [...seen].map((key) => manifest[key].file);
    expect(files.some((file) => /main-/.test(file))).toBe(false);
    const gzipped = files.reduce((sum, file) => sum + gzipSync(readFileSync(path.join(clientDir, file))).length, 0);
    expect(gzipped).toBeLessThanOrEqual(80 * 1024);
  });
});
