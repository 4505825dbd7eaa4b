import { expect, test, type APIRequestContext } from '@playwright/test';
import { demoAccounts } from './support/demo-accounts';
import { signInAs } from './support/sign-in';
import { uniqueSuffix } from './support/unique';

// An editor decides the verdicts of a roundup whose testing is done, approves every chart, the roundup goes to review
// and, with its write-up signed off, shows as ready to schedule.

async function apiAs(
  playwright: { request: { newContext: (options: object) => Promise<APIRequestContext> } },
  baseURL: string,
  role: 'editor' | 'tester',
) {
  const api = await playwright.request.newContext({ baseURL, extraHTTPHeaders: { Origin: baseURL } });
  const account = demoAccounts[role];
  const signIn = await api.post('/api/auth/sign-in', { data: { email: account.email, password: account.password } });
  expect(signIn.status()).toBe(200);
  return api;
}

async function ok<T>(response: Promise<import('@playwright/test').APIResponse>): Promise<T> {
  const answer = await response;
  expect(answer.ok(), `${answer.url()}: ${answer.status()} ${await answer.text()}`).toBe(true);
  return (await answer.json()) as T;
}

const day = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

/** A roundup in Writing: two boards under one stock load, each cell accepted with a manual run of record. */
async function roundupReadyForEditing(editor: APIRequestContext, tester: APIRequestContext) {
  const suffix = uniqueSuffix();
  const profile = await ok<{ id: number }>(
    editor.post('/api/bench-profiles', {
      data: {
        name: `Charts bench ${suffix}`,
        caseAndFans: 'Open test bench, one 120 mm fan',
        cooler: 'Quillon Arctide 360 liquid cooler',
        psu: 'Ostrel Works 1000 W Platinum',
        memory: '2 × 16 GB at 6000 MT/s',
        roomTempTargetC: 21,
        roomTempToleranceC: 1,
        probeType: 'Type K thermocouple, 0.1 mm bead',
        probePlacement: 'Board rear under the V-core stages',
        requiredSoakMinutes: 60,
      },
    }),
  );
  const config = await ok<{ id: number }>(
    editor.post('/api/load-configurations', {
      data: {
        name: `Stock all-core ${suffix}`,
        cpuDescription: 'Helix HX-16 sample, 16 cores',
        settingsMode: 'stock',
        expectedPackagePowerW: 230,
        coreVoltageV: 1.25,
        soakMinutes: 60,
      },
    }),
  );
  const platform = `Helix-1700 ${suffix}`;
  const roundup = await ok<{ id: number }>(
    editor.post('/api/roundups', {
      data: {
        title: `Charts check ${suffix}`,
        platform,
        priceBand: { minMinor: 15000, maxMinor: 22000, currency: 'EUR', region: 'DE' },
        targetPublishDate: day(40),
        timeZone: 'Europe/Berlin',
        benchProfileId: profile.id,
        loadConfigurationIds: [config.id],
      },
    }),
  );
  const boards = [
    { model: `Tallow B70 ${suffix}`, peakC: 74.2, throttled: false, price: 17900 },
    { model: `Quarry B70 ${suffix}`, peakC: 69.5, throttled: true, price: 16400 },
  ];
  for (const board of boards) {
    const product = await ok<{ id: number }>(
      editor.post('/api/catalog/products', {
        data: {
          maker: 'Korvath',
          model: board.model,
          platform,
          socket: 'HX4',
          chipset: 'HX-B70',
          formFactor: 'atx',
          releaseDate: '2025-03-14',
          powerDesign: {
            controller: 'KV-PWM8',
            controllerPhases: 8,
            phaseMultiplication: 'doubled',
            stagesPerPhase: 1,
            vcoreStageType: 'integrated-power-stage',
            vcoreStagePart: 'KVS-60',
            vcoreStageCurrentA: 60,
            socRailStages: 2,
            otherRails: '1 stage auxiliary',
            heatsinkNotes: 'Two finned blocks',
          },
          features: {
            rearUsb: { usb2: 4, usb5g: 2, usb10g: 2, usb20g: 1, usb40g: 0 },
            frontUsbCHeader: 'usb-10g',
            lanSpeedMbps: 2500,
            wifi: 'wifi-6e',
            m2Slots: 3,
            sataPorts: 4,
            audio: '7.1 HD audio',
            ioShieldPrefitted: true,
          },
        },
      }),
    );
    await ok(
      editor.post(`/api/catalog/products/${product.id}/prices`, {
        data: {
          region: 'DE',
          currency: 'EUR',
          amountMinor: board.price,
          observedOn: day(-2),
          source: 'Brightmoor Direct',
        },
      }),
    );
    await ok(editor.post(`/api/roundups/${roundup.id}/entries`, { data: { productId: product.id, kind: 'tested' } }));
  }
  await ok(editor.post(`/api/roundups/${roundup.id}/state`, { data: { to: 'on-the-bench' } }));
  const testerId = (await ok<{ user: { id: number } }>(tester.get('/api/auth/session'))).user.id;
  const matrix = await ok<{ rows: { entryId: number; cells: { id: number }[] }[] }>(
    editor.get(`/api/roundups/${roundup.id}/matrix`),
  );
  await ok(
    editor.post(`/api/roundups/${roundup.id}/assignments`, {
      data: { entryIds: matrix.rows.map((r) => r.entryId), testerId, dueDate: day(3) },
    }),
  );
  for (const [index, row] of matrix.rows.entries()) {
    const cellId = row.cells[0].id;
    const transitions = `/api/roundups/${roundup.id}/cells/${cellId}/transitions`;
    await ok(tester.post(transitions, { data: { action: 'start', overrideReason: 'Bench free this morning' } }));
    const { run } = await ok<{ run: { id: number } }>(
      tester.post(`/api/cells/${cellId}/manual-runs`, {
        data: {
          firmwareVersion: '1.04',
          startedAt: new Date().toISOString(),
          manualPeakC: boards[index].peakC,
          manualAmbientC: 21.0,
          throttled: boards[index].throttled,
          outsideBookingReason: 'Logger was away for calibration; read off the meter.',
        },
      }),
    );
    await ok(tester.post(transitions, { data: { action: 'record' } }));
    await ok(editor.post(transitions, { data: { action: 'accept' } }));
    await ok(editor.post(`/api/runs/${run.id}/run-of-record`, { data: {} }));
  }
  await ok(editor.post(`/api/roundups/${roundup.id}/state`, { data: { to: 'writing' } }));
  return { roundupId: roundup.id, boards };
}

test('an editor sets verdicts, approves every chart and sees the roundup become ready to schedule', async ({
  page,
  playwright,
  baseURL,
}) => {
  test.setTimeout(180_000);
  const editorApi = await apiAs(playwright, baseURL!, 'editor');
  const testerApi = await apiAs(playwright, baseURL!, 'tester');
  const { roundupId, boards } = await roundupReadyForEditing(editorApi, testerApi);

  await signInAs(page, 'editor');
  await page.goto(`/roundups/${roundupId}`);
  await page.getByRole('navigation', { name: 'Editorial' }).getByRole('link', { name: 'Verdicts' }).click();
  await expect(page.getByRole('heading', { name: 'Verdicts', level: 1 })).toBeVisible();

  // The cool board: a bench pick, which the measurements back.
  const cool = page.getByRole('region', { name: `Korvath ${boards[0].model}` });
  await cool.getByLabel('Label').selectOption({ label: 'Bench pick' });
  await cool.getByLabel('Best for').fill('A quiet stock build that stays cool');
  await expect(cool.getByLabel('Price at publication')).toHaveValue('179.00');
  await cool.getByRole('button', { name: 'Save verdict' }).click();
  await expect(cool.getByRole('status').filter({ hasText: 'Saved' })).toBeVisible();

  // The board that throttled: recommending it needs a written reason, and nothing typed is lost on the way.
  const hot = page.getByRole('region', { name: `Korvath ${boards[1].model}` });
  await expect(hot.getByText('Throttled', { exact: true })).toBeVisible();
  await hot.getByLabel('Label').selectOption({ label: 'Recommended' });
  await expect(hot.getByText('This label goes against the measurements')).toBeVisible();
  await hot.getByLabel('Best for').fill('Budget builds that never raise the clocks');
  await hot.getByRole('button', { name: 'Save verdict' }).click();
  await expect(hot.getByText('write why it stands')).toBeVisible();
  await expect(hot.getByLabel('Best for')).toHaveValue('Budget builds that never raise the clocks');
  await hot
    .getByLabel('Reason')
    .fill('It throttled once at a load no stock board of this price holds; at stock it is the value pick.');
  await hot.getByRole('button', { name: 'Save verdict' }).click();
  await expect(hot.getByRole('status').filter({ hasText: 'Saved' })).toBeVisible();

  // Charts: the throttled board is labelled in words as well as hatched; approve each chart.
  await page.getByRole('navigation', { name: 'Editorial' }).getByRole('link', { name: 'Charts' }).click();
  await expect(page.getByRole('heading', { name: 'Charts', level: 1 })).toBeVisible();
  await expect(page.getByRole('img', { name: /Throttled/ }).first()).toBeVisible();
  const approveButtons = page.getByRole('button', { name: /^(Approve chart|Approve again)$/ });
  await expect(approveButtons).toHaveCount(4);
  for (let left = 4; left > 0; left--) {
    await approveButtons.first().click();
    await expect(approveButtons).toHaveCount(left - 1);
  }
  await expect(page.getByText('Every chart with something to draw is approved.')).toBeVisible();

  // Send to review; with the write-up signed off, nothing blocks any more.
  await page
    .getByRole('navigation', { name: 'Editorial' })
    .getByRole('link', { name: /Ready to schedule/ })
    .click();
  await expect(page.getByRole('heading', { name: 'Ready to schedule?', level: 1 })).toBeVisible();
  await expect(page.getByRole('link', { name: /Write-up section/ }).first()).toBeVisible();
  await page.getByRole('button', { name: 'Send to review' }).click();
  await expect(page.getByText('The roundup is In review.')).toBeVisible();

  const writeUp = await ok<{ sections: { id: number; reviewState: string }[] }>(
    editorApi.get(`/api/roundups/${roundupId}/write-up`),
  );
  for (const section of writeUp.sections) {
    if (section.reviewState !== 'signed-off') {
      await ok(editorApi.post(`/api/write-up/sections/${section.id}/sign-off`, { data: {} }));
    }
  }
  await page.reload();
  await expect(page.getByText('Ready to schedule', { exact: true })).toBeVisible();
  // The roundup itself shows the computed condition.
  await page.goto(`/roundups/${roundupId}`);
  await expect(
    page.getByRole('navigation', { name: 'Editorial' }).getByRole('link', { name: 'Ready to schedule ✓' }),
  ).toBeVisible();

  await editorApi.dispose();
  await testerApi.dispose();
});
