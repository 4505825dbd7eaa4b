import { readFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { apiAs, readyRoundup } from './support/ready-roundup';
import { scheduleAhead } from './support/local-time';
import { compareUnder, estimateOnBoardPage } from './support/public-pages';
import { signInAs } from './support/sign-in';

// The acceptance journey of embargo publishing (issue 10): an editor schedules a roundup that is genuinely ready
// (tested, verdicts set, charts approved, write-up signed off — made through the API as staff make it) a few seconds
// ahead in a named time zone; before that time it is on no public page; the job runner in the server makes it live;
// a reader without an account opens it, switches to °F, compares its boards, asks a board's page for an estimate and
// downloads the open data.

const thin = '\u2009';

test('an editor schedules a ready roundup a few seconds ahead; it goes live; a reader reads, compares, estimates and downloads', async ({
  page,
  browser,
  playwright,
  baseURL,
}) => {
  test.setTimeout(180_000);
  const editorApi = await apiAs(playwright, baseURL!, 'editor');
  const testerApi = await apiAs(playwright, baseURL!, 'tester');
  const { roundupId, title, boards, configurations } = await readyRoundup(editorApi, testerApi);
  await editorApi.dispose();
  await testerApi.dispose();
  await signInAs(page, 'editor');

  await page.goto(`/roundups/${roundupId}?tab=publishing`);
  const at = await scheduleAhead(page, 20, 'America/Los_Angeles');

  // Before the time: a reader finds nothing.
  const reader = await browser.newContext();
  const readerPage = await reader.newPage();
  const publishing = (await (await page.request.get(`/api/roundups/${roundupId}/publishing`)).json()) as {
    state: string;
  };
  expect(publishing.state).toBe('scheduled');
  await readerPage.goto('/read');
  expect(await readerPage.content()).not.toContain(title);

  // The server's job runner publishes it within seconds of the time; the staff page follows.
  await expect(page.getByText('The roundup is live')).toBeVisible({ timeout: 45_000 });
  const publicPath = await page
    .getByRole('link', { name: /^\/read\/roundups\// })
    .first()
    .textContent();
  expect(Date.now()).toBeGreaterThanOrEqual(at.getTime());

  const response = await readerPage.goto(publicPath as string);
  expect(response?.status()).toBe(200);
  await expect(readerPage.getByRole('heading', { level: 1 })).toContainText(title);
  // The home page the reader saw before is kept a minute by the browser; a reload revalidates it with its ETag.
  await readerPage.goto('/read');
  await readerPage.reload();
  await expect(readerPage.getByRole('link', { name: title })).toBeVisible();
  await readerPage.getByRole('link', { name: title }).click();
  await expect(readerPage.getByRole('heading', { level: 1, name: title })).toBeVisible();

  // °C/°F: the chart's table switches in place (the reader script), the same reading converted
  // (°F = °C × 9/5 + 32, ITS-90 definitions).
  const stockTable = readerPage.getByRole('table', {
    name: new RegExp(`${configurations[0].name}: hottest VRM reading, absolute`),
  });
  await expect(stockTable.getByRole('row')).toHaveCount(3); // header + two boards
  const firstCell = stockTable.getByRole('row').nth(1).getByRole('cell').first();
  const celsiusText = (await firstCell.innerText()).trim();
  expect(celsiusText).toMatch(new RegExp(`^\\d+\\.\\d${thin}°C`));
  await readerPage.getByRole('link', { name: 'Show temperatures in °F' }).click();
  await expect(firstCell).toContainText(`${thin}°F`);
  const shownF = Number((await firstCell.innerText()).trim().split(thin)[0]);
  expect(Math.abs(shownF - ((Number(celsiusText.split(thin)[0]) * 9) / 5 + 32))).toBeLessThanOrEqual(0.1);

  // Open data: the CSV of every run of record (two boards × two loads), units in the column names.
  const csvDownload = readerPage.waitForEvent('download');
  await readerPage.getByRole('link', { name: 'Results (CSV)' }).click();
  const csv = await csvDownload;
  expect(csv.suggestedFilename()).toMatch(/results\.csv$/);
  const csvLines = readFileSync(await csv.path(), 'utf8')
    .trim()
    .split('\r\n');
  expect(csvLines[0]).toContain('peak_c');
  expect(csvLines).toHaveLength(1 + 2 * 2);
  expect(csvLines.some((line) => line.includes(boards[0].name))).toBe(true);

  // Compare the two boards under the stock load; the unit chosen stays.
  await readerPage.getByRole('navigation', { name: 'Site' }).getByRole('link', { name: 'Compare boards' }).click();
  await readerPage.getByLabel(boards[0].name).check();
  await readerPage.getByLabel(boards[1].name).check();
  await compareUnder(readerPage, configurations[0].name);
  const compared = readerPage.getByRole('table', { name: /hottest VRM reading over the room/ });
  await expect(compared.getByRole('row')).toHaveCount(3);
  await expect(compared).toContainText('°F');

  // "Will it cope?" on a board's page: a power within the tested range gives an estimate with its cautions.
  const boardLink = compared.getByRole('link', { name: boards[0].name });
  await estimateOnBoardPage(readerPage, boardLink, boards[0].name, '230');

  // The editor changes the open-data licence line on the Publishing tab; the published page follows without an update.
  const licence = `Results by The Soak Sheet, reuse with credit (${roundupId}).`;
  await page.getByLabel('Licence line').fill(licence);
  await page.getByRole('button', { name: 'Save open data settings' }).click();
  await expect(page.getByText('Saved. Published pages show it now.')).toBeVisible();
  await readerPage.goto(publicPath as string);
  await readerPage.reload();
  await expect(readerPage.getByText(licence)).toBeVisible();
  await reader.close();
});
