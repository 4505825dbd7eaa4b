import { expect, test, type Page } from '@playwright/test';
import { mainNavigation, signInAs } from './support/sign-in';
import { specFolder, writeInto } from './support/temp-folder';

const thin = '\u2009';

/** A logger file: the header line, then a row every `stepS` seconds from 0 until `endS`, its cells after the time. */
function soakCsv(header: string, endS: number, stepS: number, cells: (t: number) => string): string {
  const lines = [header];
  for (let t = 0; t < endS; t += stepS) lines.push(`${t},${cells(t)}`);
  return `${lines.join('\n')}\n`;
}

/**
 * A soak whose answer is known from first principles, not from the engine: a first-order (Newtonian) rise
 * T(t) = 21.0 + 50·(1 − e^(−t/300)) °C, logged every 10 s for 60 minutes, with the room steady at 21.0 °C and the clock
 * holding 5000 MHz. After 3600 s = 12 τ the rise is within 50·e^(−12) ≈ 0.0003 °C of 71.0 °C, so the peak prints as
 * 71.0 °C; that is below the default comfortable limit of 80 °C and nothing throttles, so the verdict is Comfortable.
 */
function firstOrderSoakCsv(): string {
  return soakCsv('Time [s],VRM 1 [°C],Ambient [°C],CPU clock [MHz]', 3600, 10, (t) => {
    const vrmC = 21 + 50 * (1 - Math.exp(-t / 300));
    return `${vrmC.toFixed(2)},21.00,5000`;
  });
}

/** The same soak with one VRM reading typed over: the sample at t = 300 s, on line 1 (header) + 31 = 32. */
function soakWithBadCell(): string {
  const lines = firstOrderSoakCsv().split('\n');
  const cells = lines[31].split(',');
  expect(cells[0]).toBe('300');
  cells[1] = 'n/a?';
  lines[31] = cells.join(',');
  return lines.join('\n');
}

const folder = specFolder('benchwire-log-check-');

test('a tester uploads a soak, confirms the guessed mapping and gets the verdict; a broken file shows its row and column', async ({
  page,
}) => {
  const goodFile = await writeInto(folder(), 'soak-first-order.csv', firstOrderSoakCsv());
  const brokenFile = await writeInto(folder(), 'soak-typed-over.csv', soakWithBadCell());

  await signInAs(page, 'tester');
  await mainNavigation(page).getByRole('link', { name: 'Log check' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Log check' })).toBeVisible();

  await page.getByLabel('Logger file').setInputFiles(goodFile);

  // The preview: how the file was read, before any analysis.
  const preview = page.getByRole('region', { name: 'How Benchwire read the file' });
  await expect(preview).toContainText('comma');
  await expect(preview).toContainText('row 1');
  await expect(preview).toContainText('360');
  const columns = preview.getByRole('table', { name: /Columns in the file/ });
  await expect(columns.getByRole('row', { name: /VRM 1 \[°C\]/ })).toContainText('VRM probe');

  // The guess is shown as a guess; the tester checks it and only then analyses.
  await expect(page.getByText('Guessed from the header names — check it')).toBeVisible();
  await expect(page.getByLabel(/^Time column/)).toHaveValue('Time [s]');
  await expect(page.getByLabel(/^Ambient column/)).toHaveValue('Ambient [°C]');
  await expect(page.getByLabel(/^Clock column/)).toHaveValue('CPU clock [MHz]');
  await expect(page.getByRole('checkbox', { name: 'VRM 1 [°C]' })).toBeChecked();
  await expect(page.getByRole('heading', { name: 'Result' })).toHaveCount(0);
  await page.getByLabel('Room target').fill('21');
  await page.getByRole('button', { name: 'Analyse' }).click();

  const results = page.getByRole('region', { name: 'Result' });
  await expect(results.getByText('Comfortable', { exact: true })).toBeVisible();
  await expect(results).toContainText(`The peak, 71.0${thin}°C, is below 80.0${thin}°C.`);
  await expect(results.getByRole('region', { name: 'Peak' })).toContainText(`71.0${thin}°C ±2.5${thin}°C`);
  await expect(results.getByRole('region', { name: 'Room (ambient probe)' })).toContainText(`21.0${thin}°C`);
  await expect(results).toContainText('one open test system in a controlled room');

  // A file with a typed-over cell: the error names the line and the column, and the tester's choices stay.
  await page.getByLabel('Room target').fill('21.5');
  await page.getByLabel('Logger file').setInputFiles(brokenFile);
  await expect(page.getByText('The file could not be read with the guessed mapping')).toBeVisible();
  const problem = page.getByRole('table', { name: 'Problems found in the logger file' }).getByRole('row').nth(1);
  await expect(problem.getByRole('cell').nth(0)).toHaveText('32');
  await expect(problem).toContainText('VRM 1 [°C]');
  await expect(problem).toContainText('is not a number');
  await expect(page.getByText('soak-typed-over.csv').first()).toBeVisible();
  await expect(page.getByLabel('Room target')).toHaveValue('21.5');
  await expect(page.getByRole('heading', { name: 'Result' })).toHaveCount(0);
});

test('a writer has no Log check entry and the page explains why', async ({ page }) => {
  await signInAs(page, 'writer');
  await expect(mainNavigation(page).getByRole('link', { name: 'Account' })).toBeVisible();
  await expect(mainNavigation(page).getByRole('link', { name: 'Log check' })).toHaveCount(0);
  await page.goto('/log-check');
  await expect(page.getByText('Your role cannot open this page')).toBeVisible();
  await expect(page.getByLabel('Logger file')).toHaveCount(0);
});

/**
 * A soak stopped after 10 minutes while still climbing: T(t) = 60 + 40·(1 − e^(−t/900)) °C. At 600 s it reads
 * 60 + 40·(1 − e^(−2/3)) = 79.5 °C; with τ = 15 min the log shows 0.67 τ of the rise (first-order step response
 * 1 − e^(−t/τ)), too little to predict the plateau, so no verdict may be given.
 */
function unfinishedSoakCsv(): string {
  return soakCsv('Time [s],VRM 1 [°C],Ambient [°C],CPU clock [MHz]', 600, 5, (t) => {
    const vrmC = 60 + 40 * (1 - Math.exp(-t / 900));
    return `${vrmC.toFixed(2)},21.00,5000`;
  });
}

/** The tester opens Log check, uploads `csv` as `name`, sees `probe` ticked by the guess and analyses; the result. */
async function analyseAsTester(page: Page, name: string, csv: string, probe: string) {
  const file = await writeInto(folder(), name, csv);
  await signInAs(page, 'tester');
  await mainNavigation(page).getByRole('link', { name: 'Log check' }).click();
  await page.getByLabel('Logger file').setInputFiles(file);
  await expect(page.getByRole('checkbox', { name: probe })).toBeChecked();
  await page.getByRole('button', { name: 'Analyse' }).click();
  return page.getByRole('region', { name: 'Result' });
}

test('a soak stopped while still climbing gets no verdict, and the box says why in words', async ({ page }) => {
  const results = await analyseAsTester(page, 'soak-unfinished.csv', unfinishedSoakCsv(), 'VRM 1 [°C]');
  await expect(results.getByText('No verdict yet', { exact: true })).toBeVisible();
  await expect(results).toContainText('No verdict from an unfinished soak: the soak lasted 9');
  await expect(results).toContainText('Soak shorter than required — withholds the verdict');
  await expect(results).toContainText('Not settled — withholds the verdict');
  await expect(results.getByText('Comfortable', { exact: true })).toHaveCount(0);
  await expect(results.getByText('soak-too-short')).toHaveCount(0);
});

/** The first-order soak with a second VRM probe that read nothing at all (its cells say OPEN). */
function soakWithDeadProbeCsv(): string {
  return soakCsv('Time [s],VRM 1 [°C],VRM 2 [°C],Ambient [°C],CPU clock [MHz]', 3600, 10, (t) => {
    const vrmC = 21 + 50 * (1 - Math.exp(-t / 300));
    return `${vrmC.toFixed(2)},OPEN,21.00,5000`;
  });
}

test('a dead probe withholds the verdict until the tester confirms it', async ({ page }) => {
  const results = await analyseAsTester(page, 'soak-dead-probe.csv', soakWithDeadProbeCsv(), 'VRM 2 [°C]');
  await expect(results.getByText('No verdict yet', { exact: true })).toBeVisible();
  await expect(results).toContainText('Dead probe — withholds the verdict');
  await results.getByRole('button', { name: 'VRM 2 [°C] is dead: judge without it' }).click();
  // The same soak as the first test without the dead probe: 71.0 °C, below 80 °C (first principles, see above).
  await expect(results.getByText('Comfortable', { exact: true })).toBeVisible();
  await expect(
    page.getByRole('checkbox', { name: 'VRM 2 [°C] is a dead probe: judge the run without it' }),
  ).toBeChecked();
});
