import { expect, test, type PlaywrightWorkerArgs } from '@playwright/test';
import { demoApi, prepareAssignedCell, sender } from './support/planned-cell';
import { mainNavigation, signInAs } from './support/sign-in';
import { uniqueSuffix } from './support/unique';

/**
 * As the demo editor, through the API: a roundup on the bench with one product and one load configuration whose
 * cell is assigned to the demo tester, and a bench of its own, all with names no other run uses.
 */
async function prepareBench(playwright: PlaywrightWorkerArgs['playwright'], baseURL: string) {
  const { suffix, cellLabel } = await prepareAssignedCell(playwright, baseURL, {
    profileName: 'Open bench',
    title: 'Helix-1700 boards',
    model: 'Q50 Steady',
  });
  const api = await demoApi(playwright, baseURL, 'editor');
  try {
    const benchName = `Bench ${suffix}`;
    await sender(api)('POST', '/api/benches', { name: benchName });
    return { benchName, cellLabel };
  } finally {
    await api.dispose();
  }
}

/** A datetime-local value (local time) `days` from today at `hour`:00. */
function localSlot(days: number, hour: number): string {
  const date = new Date();
  date.setDate(date.getDate() + days);
  date.setHours(hour, 0, 0, 0);
  const pad = (value: number) => String(value).padStart(2, '0');
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}T${pad(hour)}:00`;
}

test('a bench tester books a slot, and an overlapping second booking is refused with the reason', async ({
  page,
  playwright,
  baseURL,
}) => {
  const { benchName, cellLabel } = await prepareBench(playwright, baseURL as string);
  await signInAs(page, 'tester');
  await mainNavigation(page).getByRole('link', { name: 'Benches' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Benches' })).toBeVisible();
  // The safety note is on the page wherever benches are worked on.
  await expect(page.getByText('get hot enough to burn')).toBeVisible();
  await expect(page.getByRole('row').filter({ hasText: benchName })).toContainText('In service');

  const form = page.getByRole('form', { name: 'Book a bench' });
  await form.getByLabel('Bench').selectOption({ label: benchName });
  await form.getByLabel('Starts').fill(localSlot(2, 9));
  await form.getByLabel('Ends').fill(localSlot(2, 12));
  await form.getByRole('checkbox', { name: cellLabel }).check();
  await form.getByLabel('Note').fill('Soak, then log for an hour');
  await form.getByRole('button', { name: 'Book this slot' }).click();
  await expect(form.getByRole('status').filter({ hasText: 'Booked' })).toContainText(benchName);

  // Same bench, 11:00–13:00: overlaps 09:00–12:00 by an hour.
  await form.getByLabel('Starts').fill(localSlot(2, 11));
  await form.getByLabel('Ends').fill(localSlot(2, 13));
  await form.getByRole('checkbox', { name: cellLabel }).check();
  await form.getByRole('button', { name: 'Book this slot' }).click();
  const refusal = form.getByRole('alert').filter({ hasText: 'This slot was not booked' });
  await expect(refusal).toBeVisible();
  await expect(refusal).toContainText(`${benchName} is already booked`);
  await expect(refusal).toContainText('Choose another time or bench');
  await expect(form.getByLabel('Starts')).toHaveAttribute('aria-invalid', 'true');
  // Nothing typed is lost.
  await expect(form.getByLabel('Bench')).toHaveValue(/\d+/);
  await expect(form.getByLabel('Starts')).toHaveValue(localSlot(2, 11));
  await expect(form.getByLabel('Ends')).toHaveValue(localSlot(2, 13));
  await expect(form.getByRole('checkbox', { name: cellLabel })).toBeChecked();
});

test('an editor opens a bench, records a probe whose calibration has run out and logs maintenance', async ({
  page,
}) => {
  await signInAs(page, 'editor');
  await mainNavigation(page).getByRole('link', { name: 'Benches' }).click();
  await page.getByRole('row').filter({ hasText: 'Bench B' }).getByRole('link', { name: 'Bench B' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Bench B' })).toBeVisible();
  await expect(page.getByText('get hot enough to burn')).toBeVisible();
  await expect(page.getByText('Built to the profile')).toBeVisible();

  const suffix = uniqueSuffix();
  const add = page.getByRole('form', { name: 'Add a probe or logger' });
  await add.getByLabel('Name').fill(`Probe ${suffix}, V-core rear`);
  await add.getByLabel('Type or model').fill('Type K thermocouple, 0.1 mm bead');
  const lastYear = new Date(Date.now() - 400 * 86_400_000).toISOString().slice(0, 10);
  await add.getByLabel('Last calibrated').fill(lastYear);
  await add.getByRole('button', { name: 'Add' }).click();
  const probe = page.getByRole('list', { name: 'Probes and logger' }).getByRole('listitem').filter({ hasText: suffix });
  await expect(probe).toContainText('Past due');
  await expect(page.getByText('Calibration past due')).toBeVisible();
  await probe.getByRole('button', { name: /Calibrated today/ }).click();
  await expect(probe).not.toContainText('Past due');

  const log = page.getByRole('form', { name: 'Log maintenance' });
  await log.getByLabel('What was done').fill(`New thermal tape under probe ${suffix}`);
  await log.getByRole('button', { name: 'Log it' }).click();
  await expect(page.getByRole('list', { name: 'Maintenance log' })).toContainText(
    `New thermal tape under probe ${suffix}`,
  );
});
