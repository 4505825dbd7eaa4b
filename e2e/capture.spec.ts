import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { expect, test, type APIRequestContext, type PlaywrightWorkerArgs } from '@playwright/test';
import { syntheticLoggerLog } from '../shared/generators/synthetic-logger-log';
import { demoAccounts } from './support/demo-accounts';
import { signInAs, signOut } from './support/sign-in';
import { uniqueSuffix } from './support/unique';

async function ok<T = { id: number }>(response: Awaited<ReturnType<APIRequestContext['post']>>): Promise<T> {
  expect(response.ok(), await response.text()).toBe(true);
  return (await response.json()) as T;
}

interface CaptureSetup {
  roundupId: number;
  productLabel: string;
  cellLabel: string;
}

/**
 * As the demo editor, through the API: a roundup on the bench with one product and one load configuration soaking
 * 60 minutes, its cell assigned to the demo tester, and no booking (so each run says why it is outside one).
 */
async function prepareCell(playwright: PlaywrightWorkerArgs['playwright'], baseURL: string): Promise<CaptureSetup> {
  const api = await playwright.request.newContext({ baseURL, extraHTTPHeaders: { Origin: baseURL } });
  try {
    const suffix = uniqueSuffix();
    const editor = demoAccounts.editor;
    await ok<unknown>(
      await api.post('/api/auth/sign-in', { data: { email: editor.email, password: editor.password } }),
    );
    const platform = `Helix-1700 ${suffix}`;
    const day = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
    const profile = await ok(
      await api.post('/api/bench-profiles', {
        data: {
          name: `Capture bench ${suffix}`,
          caseAndFans: 'Open test bench, one 120 mm fan at 800 rpm aimed at the board',
          cooler: 'Tidewell 360 liquid cooler',
          psu: 'Ostrel Works 1000 W',
          memory: '2 × 16 GB at 6000 MT/s',
          roomTempTargetC: 21,
          roomTempToleranceC: 1,
          probeType: 'Type K thermocouple, 0.1 mm bead',
          probePlacement: 'Board rear under the V-core stages, taped',
          requiredSoakMinutes: 60,
        },
      }),
    );
    const loadName = `Stock all-core ${suffix}`;
    const load = await ok(
      await api.post('/api/load-configurations', {
        data: {
          name: loadName,
          cpuDescription: 'Helix HX-16 sample, 16 cores',
          settingsMode: 'stock',
          expectedPackagePowerW: 230,
          coreVoltageV: 1.25,
          soakMinutes: 60,
        },
      }),
    );
    const maker = `Quillon ${suffix}`;
    const model = 'Q70 Capture';
    const product = await ok(
      await api.post('/api/catalog/products', {
        data: { maker, model, platform, socket: 'HX4', chipset: 'HX-B50', formFactor: 'atx' },
      }),
    );
    const roundup = await ok(
      await api.post('/api/roundups', {
        data: {
          title: `Helix-1700 capture ${suffix}`,
          platform,
          priceBand: { minMinor: 15000, maxMinor: 22000, currency: 'EUR', region: 'DE' },
          targetPublishDate: day(60),
          timeZone: 'Europe/Berlin',
          benchProfileId: profile.id,
          loadConfigurationIds: [load.id],
        },
      }),
    );
    const { entry } = await ok<{ entry: { id: number } }>(
      await api.post(`/api/roundups/${roundup.id}/entries`, { data: { productId: product.id, kind: 'tested' } }),
    );
    expect((await api.post(`/api/roundups/${roundup.id}/state`, { data: { to: 'on-the-bench' } })).ok()).toBe(true);
    const { testers } = (await (await api.get('/api/testers')).json()) as {
      testers: { id: number; displayName: string }[];
    };
    const tester = testers.find((person) => person.displayName === demoAccounts.tester.displayName);
    expect(tester).toBeTruthy();
    await ok<unknown>(
      await api.post(`/api/roundups/${roundup.id}/assignments`, {
        data: { entryIds: [entry.id], testerId: tester?.id, dueDate: day(5) },
      }),
    );
    return { roundupId: roundup.id, productLabel: `${maker} ${model}`, cellLabel: `${maker} ${model} · ${loadName}` };
  } finally {
    await api.dispose();
  }
}

/**
 * A 30-minute soak (generated, first-order rise to about 62 °C in a steady 21 °C room) on a configuration that asks
 * for 60 minutes: the engine flags the short soak, so the editor has a flag to accept with a reason.
 */
function shortSoak(seed: number): string {
  return syntheticLoggerLog({
    durationS: 1800,
    sampleHz: 0.5,
    seed,
    probes: [{ name: 'VRM 1', startC: 22, riseC: 40, tauS: 300, noiseC: 0.1 }],
    ambient: { name: 'Ambient', startC: 21, noiseC: 0.05 },
  });
}

let folder: string;

test.beforeAll(async () => {
  folder = await mkdtemp(path.join(tmpdir(), 'benchwire-capture-'));
});

test.afterAll(async () => {
  await rm(folder, { recursive: true, force: true });
});

test('a tester records runs from logger files; the editor accepts a flagged run and sees it in the results', async ({
  page,
  playwright,
  baseURL,
}) => {
  test.setTimeout(120_000);
  const setup = await prepareCell(playwright, baseURL ?? '');
  const firstFile = path.join(folder, 'soak-first.csv');
  const secondFile = path.join(folder, 'soak-second.csv');
  await writeFile(firstFile, shortSoak(1));
  await writeFile(secondFile, shortSoak(2));

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
    await page.getByRole('button', { name: 'Analyse' }).click();
    await expect(page.getByRole('region', { name: 'Result' })).toBeVisible();
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

  await recordRun(firstFile, '1.02', false);
  await expect(page.getByRole('table').first()).toContainText('1.02');
  await recordRun(secondFile, '1.03', true);
  await expect(page.getByRole('heading', { name: 'By firmware' })).toBeVisible();
  await expect(page.getByText(/Difference from the first firmware/)).toBeVisible();
  await signOut(page);

  await signInAs(page, 'editor');
  await page.goto(`/roundups/${setup.roundupId}?tab=matrix`);
  await page.getByRole('link', { name: `Runs of ${setup.cellLabel}` }).click();
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

  await page.goto(`/roundups/${setup.roundupId}?tab=results`);
  const results = page.getByRole('table', { name: 'Results' });
  const row = results.getByRole('row', { name: new RegExp(setup.productLabel) });
  await expect(row).toContainText('°C');
  await expect(row).toContainText(/Comfortable|Warm|Hot but held|Throttled/);
  await expect(row).toContainText(/flag/);
  await page.getByRole('button', { name: 'Delta over ambient' }).click();
  await expect(page.getByRole('button', { name: 'Delta over ambient' })).toHaveAttribute('aria-pressed', 'true');
});
