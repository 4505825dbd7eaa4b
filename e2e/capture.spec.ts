import sharp from 'sharp';
import { test as base, expect, type PlaywrightWorkerArgs } from '@playwright/test';
import { syntheticLoggerLog } from '../shared/generators/synthetic-logger-log';
import { prepareAssignedCell } from './support/planned-cell';
import { signInAs, signOut } from './support/sign-in';
import { specFolder, writeInto } from './support/temp-folder';

/**
 * As the demo editor, through the API: a roundup on the bench with one product and one load configuration soaking
 * 60 minutes, its cell assigned to the demo tester, and no booking (so each run says why it is outside one).
 */
async function prepareCell(playwright: PlaywrightWorkerArgs['playwright'], baseURL: string) {
  const cell = await prepareAssignedCell(playwright, baseURL, {
    profileName: 'Capture bench',
    title: 'Helix-1700 capture',
    model: 'Q70 Capture',
  });
  return { ...cell, productLabel: `${cell.maker} ${cell.model}` };
}

// Each test starts from a cell of its own, prepared within the test's two minutes.
const test = base.extend<{ setup: Awaited<ReturnType<typeof prepareCell>> }>({
  setup: async ({ playwright, baseURL }, use) => {
    await use(await prepareCell(playwright, baseURL ?? ''));
  },
});
test.describe.configure({ timeout: 120_000 });

/**
 * A 30-minute soak (generated, first-order rise to about 62 °C in a steady 21 °C room, a second probe to about 52 °C)
 * on a configuration that asks for 60 minutes: the engine flags the short soak, so the editor has a flag to accept
 * with a reason; the second probe gives the editor another mapping to analyse the stored file with.
 */
function shortSoak(seed: number): string {
  return syntheticLoggerLog({
    durationS: 1800,
    sampleHz: 0.5,
    seed,
    probes: [
      { name: 'VRM 1', startC: 22, riseC: 40, tauS: 300, noiseC: 0.1 },
      { name: 'VRM 2', startC: 22, riseC: 30, tauS: 300, noiseC: 0.1 },
    ],
    ambient: { name: 'Ambient', startC: 21, noiseC: 0.05 },
  });
}

const folder = specFolder('benchwire-capture-');

test('a tester records runs from logger files; the editor accepts a flagged run and sees it in the results', async ({
  page,
  setup,
}) => {
  const firstFile = await writeInto(folder(), 'soak-first.csv', shortSoak(1));
  const secondFile = await writeInto(folder(), 'soak-second.csv', shortSoak(2));

  await signInAs(page, 'tester');
  await page.goto('/my-bench');
  await page.getByRole('link', { name: `Record a run: ${setup.cellLabel}` }).click();
  await expect(page.getByRole('heading', { level: 1, name: setup.cellLabel })).toBeVisible();

  const recordRun = async (file: string, firmware: string, remembered: boolean) => {
    await page.getByRole('button', { name: 'Upload a log' }).click();
    await page.getByLabel('Logger file').setInputFiles(file);
    await expect(page.getByText('Mapping remembered from this bench profile’s last run')).toHaveCount(
      remembered ? 1 : 0,
    );
    await expect(page.getByRole('checkbox', { name: 'VRM 1 [°C]' })).toBeChecked();
    await page.getByLabel('Room target').fill('21');
    await page.getByRole('button', { name: 'Analyse', exact: true }).click();
    await expect(page.getByRole('region', { name: 'Result' })).toBeVisible();
    // The log's chart is there before anything is submitted.
    await expect(page.getByRole('img', { name: /VRM probes and ambient over this log/ })).toBeVisible();
    const form = page.getByRole('form', { name: 'Run details' });
    await form.getByLabel('Firmware (BIOS) version').fill(firmware);
    await form.getByRole('button', { name: 'Submit the run' }).click();
    // No booking covers the run: the server asks why, beside the field, and keeps what was typed.
    const reason = form.getByLabel('Why this run is outside your bookings');
    await expect(reason).toBeVisible();
    await expect(form.getByLabel('Firmware (BIOS) version')).toHaveValue(firmware);
    await reason.fill('Bench time was moved; the soak ran on the open bench.');
    await form.getByRole('button', { name: 'Submit the run' }).click();
    await expect(page.getByText('Run submitted')).toBeVisible();
  };

  // No run yet: the cell cannot be marked recorded.
  await expect(page.getByRole('button', { name: 'Mark recorded' })).toHaveCount(0);
  await recordRun(firstFile, '1.02', false);
  await expect(page.getByRole('table').first()).toContainText('1.02');
  await recordRun(secondFile, '1.03', true);
  await expect(page.getByRole('heading', { name: 'By firmware' })).toBeVisible();
  await expect(page.getByText(/Difference from the first firmware/)).toBeVisible();

  // The same file again is recognised by its hash, and said; nothing is added.
  await page.getByRole('button', { name: 'Upload a log' }).click();
  await page.getByLabel('Logger file').setInputFiles(firstFile);
  await page.getByLabel('Room target').fill('21');
  await page.getByRole('button', { name: 'Analyse', exact: true }).click();
  const again = page.getByRole('form', { name: 'Run details' });
  await again.getByLabel('Firmware (BIOS) version').fill('1.02');
  await again.getByRole('button', { name: 'Submit the run' }).click();
  await expect(again.getByText(/This exact file \(same SHA-256\) is already stored/)).toBeVisible();
  await expect(page.getByRole('table').first().getByRole('row')).toHaveCount(3);

  await page.getByRole('button', { name: 'Mark recorded' }).click();
  await expect(page.getByText(/The cell is Recorded/)).toBeVisible();
  await signOut(page);

  await signInAs(page, 'editor');
  await page.goto(`/roundups/${setup.roundupId}?tab=matrix`);
  // The planning matrix's cell says its run's QA flags in words, not by colour alone.
  const runsLink = page.getByRole('link', { name: `Runs of ${setup.cellLabel}` });
  await expect(page.getByRole('cell').filter({ has: runsLink })).toContainText(
    /QA flags?:.*Soak shorter than required/,
  );
  await runsLink.click();
  await expect(page.getByRole('heading', { level: 1, name: setup.cellLabel })).toBeVisible();
  const flags = page.getByRole('region', { name: 'QA flags' });
  await expect(flags.getByRole('listitem').first()).toBeVisible();

  // A flagged run is not accepted without a reason; the server's note stands beside the field.
  await page.getByRole('button', { name: 'Accept the run' }).click();
  const reason = page.getByLabel('Reason');
  await expect(reason).toHaveAttribute('aria-invalid', 'true');
  await reason.fill('The soak was short by plan: the board had settled within 0.2 °C for the last ten minutes.');
  await page.getByRole('button', { name: 'Accept the run' }).click();
  await expect(page.getByText('Accepted', { exact: true }).first()).toBeVisible();
  await page.getByRole('button', { name: 'Mark as run of record' }).click();
  await expect(page.getByText('★ Run of record')).toBeVisible();

  // The stored file analysed again with another mapping: the form starts from the mapping used, the analysis is shown
  // before it is stored, and the earlier analysis stays beside the new one.
  await page.getByRole('button', { name: 'Analyse again with another mapping' }).click();
  await expect(page.getByText('Filled in with the mapping and options of the analysis that counts now')).toBeVisible();
  await expect(page.getByRole('checkbox', { name: 'VRM 1 [°C]' })).toBeChecked();
  await expect(page.getByRole('checkbox', { name: 'VRM 2 [°C]' })).toBeChecked();
  await page.getByRole('checkbox', { name: 'VRM 1 [°C]' }).uncheck();
  await page.getByRole('button', { name: 'Analyse', exact: true }).click();
  await expect(page.getByRole('region', { name: 'Result' })).toBeVisible();
  await page.getByRole('button', { name: 'Store as a new analysis' }).click();
  await expect(page.getByText('A new analysis is stored beside the earlier ones')).toBeVisible();
  const analyses = page.getByRole('table', { name: 'Analyses of this run, oldest first' });
  await expect(analyses.getByRole('row')).toHaveCount(3);
  await expect(analyses.getByRole('row').nth(1)).toContainText('VRM: VRM 1 [°C], VRM 2 [°C]');
  await expect(analyses.getByRole('row').nth(2)).toContainText('VRM: VRM 2 [°C]');
  await expect(analyses.getByRole('row').nth(2)).toContainText('Counts for the run');

  await page.goto(`/roundups/${setup.roundupId}?tab=results`);
  const results = page.getByRole('table', { name: 'Results' });
  const row = results.getByRole('row', { name: new RegExp(setup.productLabel) });
  await expect(row).toContainText('°C');
  await expect(row).toContainText(/Comfortable|Warm|Hot but held|Throttled/);
  await expect(row).toContainText(/flag/);
  await page.getByRole('button', { name: 'Delta over ambient' }).click();
  await expect(page.getByRole('button', { name: 'Delta over ambient' })).toHaveAttribute('aria-pressed', 'true');
});

/** A camera-sized JPEG of random noise (noise does not compress, so the upload takes a while on a slow link). */
async function noisePhoto(width: number, height: number, format: 'jpeg' | 'png'): Promise<Buffer> {
  const pixels = Buffer.alloc(width * height * 3);
  for (let index = 0; index < pixels.length; index += 1) pixels[index] = Math.imul(index, 2654435761) >>> 24;
  const image = sharp(pixels, { raw: { width, height, channels: 3 } });
  return format === 'jpeg' ? image.jpeg({ quality: 95 }).toBuffer() : image.png().toBuffer();
}

test('a tester adds photos to a product with progress and thumbnails, reorders them by keyboard, edits and removes one', async ({
  page,
  setup,
}) => {
  const notAPhoto = await writeInto(folder(), 'board-overview.jpg', 'Time,VRM 1\n0,21.0\n');
  const overview = await writeInto(folder(), 'overview.jpg', await noisePhoto(1600, 1200, 'jpeg'));
  const closeUp = await writeInto(folder(), 'power-stages.png', await noisePhoto(640, 480, 'png'));

  await signInAs(page, 'tester');
  await page.goto(`/roundups/${setup.roundupId}`);
  await page.getByRole('link', { name: `Photos of ${setup.productLabel}` }).click();
  await expect(page.getByRole('heading', { level: 1, name: setup.productLabel })).toBeVisible();
  const form = page.getByRole('form', { name: 'Add a photo' });

  // Alt text is required, and a file that is not an image is refused by its content whatever its name; nothing
  // typed is lost.
  await form.getByLabel('Photo file').setInputFiles(notAPhoto);
  await form.getByLabel('What it shows').selectOption({ label: 'Board overview' });
  await form.getByLabel('Caption').fill('The whole board, heatsinks on');
  await form.getByRole('button', { name: 'Add the photo' }).click();
  await expect(form.getByLabel('Alt text')).toHaveAttribute('aria-invalid', 'true');
  await form.getByLabel('Alt text').fill('A black ATX board seen from above with two finned VRM heatsinks');
  await form.getByRole('button', { name: 'Add the photo' }).click();
  await expect(form.getByText(/not a JPEG, PNG or WebP image/)).toBeVisible();
  await expect(form.getByLabel('Caption')).toHaveValue('The whole board, heatsinks on');
  await expect(form.getByLabel('Alt text')).toHaveValue(/two finned VRM heatsinks/);

  // On a slow link the upload shows how far it got, then its thumbnail.
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.emulateNetworkConditions', {
    offline: false,
    latency: 20,
    downloadThroughput: -1,
    uploadThroughput: 256 * 1024,
  });
  await form.getByLabel('Photo file').setInputFiles(overview);
  await form.getByRole('button', { name: 'Add the photo' }).click();
  const progress = form.getByRole('progressbar', { name: 'Uploading the photo' });
  await expect(progress).toBeVisible();
  await expect(progress).toHaveAttribute('aria-valuetext', /Uploading .* of /);
  await expect(page.getByText('Photo added as number 1.')).toBeVisible({ timeout: 30_000 });
  await cdp.send('Network.emulateNetworkConditions', {
    offline: false,
    latency: 0,
    downloadThroughput: -1,
    uploadThroughput: -1,
  });
  const photos = page.getByRole('list', { name: 'Photos in order' });
  const first = photos.getByRole('img', { name: /two finned VRM heatsinks/ });
  await expect(first).toBeVisible();
  await expect.poll(() => first.evaluate((image: HTMLImageElement) => image.naturalWidth)).toBeGreaterThan(0);
  // The form is empty again for the next photo.
  await expect(form.getByLabel('Caption')).toHaveValue('');

  await form.getByLabel('Photo file').setInputFiles(closeUp);
  await form.getByLabel('What it shows').selectOption({ label: 'Power delivery close-up' });
  await form.getByLabel('Alt text').fill('Close-up of the power stages under the left heatsink');
  await form.getByRole('button', { name: 'Add the photo' }).click();
  await expect(page.getByText('Photo added as number 2.')).toBeVisible();
  await expect(photos.getByRole('listitem')).toHaveCount(2);

  // Reorder with the keyboard: focus the second photo's "earlier" button and press Enter.
  const earlier = photos.getByRole('button', { name: /Move photo 2 earlier/ });
  await earlier.focus();
  await page.keyboard.press('Enter');
  await expect(photos.getByRole('listitem').first()).toContainText('Power delivery close-up');
  await expect(page.getByText('Photo moved to place 1 of 2.')).toBeAttached();
  await page.reload();
  await expect(photos.getByRole('listitem').first()).toContainText('Power delivery close-up');

  // Edit a caption; an emptied alt text is refused beside the field.
  await photos.getByRole('button', { name: 'Edit photo 2 (The whole board, heatsinks on)' }).click();
  const edit = page.getByRole('form', { name: 'Edit photo 2' });
  await edit.getByLabel('Alt text').fill('');
  await edit.getByRole('button', { name: 'Save' }).click();
  await expect(edit.getByLabel('Alt text')).toHaveAttribute('aria-invalid', 'true');
  await edit.getByLabel('Alt text').fill('The board from above, both heatsinks fitted');
  await edit.getByLabel('Caption').fill('Board overview as shipped');
  await edit.getByRole('button', { name: 'Save' }).click();
  await expect(photos.getByText('Board overview as shipped')).toBeVisible();

  await photos.getByRole('button', { name: /Remove photo 1/ }).click();
  await page.getByRole('dialog').getByRole('button', { name: 'Remove the photo' }).click();
  await expect(photos.getByRole('listitem')).toHaveCount(1);
  await expect(photos.getByRole('img', { name: 'The board from above, both heatsinks fitted' })).toBeVisible();
});
