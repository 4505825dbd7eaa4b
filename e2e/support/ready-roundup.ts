import { expect, type APIRequestContext, type APIResponse } from '@playwright/test';
import { demoAccounts } from './demo-accounts';
import { uniqueSuffix } from './unique';

/** An API session of a demo account, with the Origin the server asks of every write. */
export async function apiAs(
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

async function ok<T>(response: Promise<APIResponse>): Promise<T> {
  const answer = await response;
  expect(answer.ok(), `${answer.url()}: ${answer.status()} ${await answer.text()}`).toBe(true);
  return (await answer.json()) as T;
}

const day = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

export interface ReadyRoundup {
  roundupId: number;
  title: string;
  boards: { name: string; peaksC: number[] }[];
  configurations: { id: number; name: string; packagePowerW: number }[];
}

/**
 * A roundup genuinely ready to schedule, made through the API as staff make it: two boards tested under two loads
 * (different package power, so a board's page can estimate between them), each cell accepted with a manual run of
 * record, a verdict per board, every chart approved, sent to review and every write-up section signed off.
 */
export async function readyRoundup(editor: APIRequestContext, tester: APIRequestContext): Promise<ReadyRoundup> {
  const suffix = uniqueSuffix();
  const profile = await ok<{ id: number }>(
    editor.post('/api/bench-profiles', {
      data: {
        name: `Embargo bench ${suffix}`,
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
  const configurations: ReadyRoundup['configurations'] = [];
  for (const [name, packagePowerW, fixedClockMhz] of [
    [`Stock all-core ${suffix}`, 180, null],
    [`Fixed 5.2 GHz all-core ${suffix}`, 280, 5200],
  ] as const) {
    const config = await ok<{ id: number }>(
      editor.post('/api/load-configurations', {
        data: {
          name,
          cpuDescription: 'Helix HX-16 sample, 16 cores',
          settingsMode: fixedClockMhz ? 'fixed' : 'stock',
          fixedClockMhz,
          expectedPackagePowerW: packagePowerW,
          coreVoltageV: 1.25,
          soakMinutes: 60,
        },
      }),
    );
    configurations.push({ id: config.id, name, packagePowerW });
  }
  const platform = `Helix-1700 ${suffix}`;
  const title = `Helix-1700 embargo check ${suffix}`;
  const roundup = await ok<{ id: number }>(
    editor.post('/api/roundups', {
      data: {
        title,
        platform,
        priceBand: { minMinor: 15000, maxMinor: 22000, currency: 'EUR', region: 'DE' },
        targetPublishDate: day(40),
        timeZone: 'Europe/Berlin',
        benchProfileId: profile.id,
        loadConfigurationIds: configurations.map((c) => c.id),
      },
    }),
  );
  const boards = [
    { model: `Tallow B70 ${suffix}`, peaksC: [64.2, 78.6], price: 17900 },
    { model: `Quarry B70 ${suffix}`, peaksC: [61.5, 72.8], price: 16400 },
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
  const matrix = await ok<{ rows: { entryId: number; cells: { id: number; loadConfigurationId: number }[] }[] }>(
    editor.get(`/api/roundups/${roundup.id}/matrix`),
  );
  await ok(
    editor.post(`/api/roundups/${roundup.id}/assignments`, {
      data: { entryIds: matrix.rows.map((r) => r.entryId), testerId, dueDate: day(3) },
    }),
  );
  for (const [index, row] of matrix.rows.entries()) {
    for (const cell of row.cells) {
      const column = configurations.findIndex((c) => c.id === cell.loadConfigurationId);
      const transitions = `/api/roundups/${roundup.id}/cells/${cell.id}/transitions`;
      await ok(tester.post(transitions, { data: { action: 'start', overrideReason: 'Bench free this morning' } }));
      const { run } = await ok<{ run: { id: number } }>(
        tester.post(`/api/cells/${cell.id}/manual-runs`, {
          data: {
            firmwareVersion: '1.04',
            startedAt: new Date().toISOString(),
            manualPeakC: boards[index].peaksC[column],
            manualAmbientC: 21.0,
            throttled: false,
            outsideBookingReason: 'Logger was away for calibration; read off the meter.',
          },
        }),
      );
      await ok(tester.post(transitions, { data: { action: 'record' } }));
      await ok(editor.post(transitions, { data: { action: 'accept' } }));
      await ok(editor.post(`/api/runs/${run.id}/run-of-record`, { data: {} }));
    }
  }
  await ok(editor.post(`/api/roundups/${roundup.id}/state`, { data: { to: 'writing' } }));

  const verdicts = await ok<{
    products: { entryId: number; catalogPrice: { amountMinor: number; currency: string } | null }[];
  }>(editor.get(`/api/roundups/${roundup.id}/verdicts`));
  for (const product of verdicts.products) {
    await ok(
      editor.put(`/api/roundups/${roundup.id}/verdicts/${product.entryId}`, {
        data: {
          label: 'fine-at-stock',
          bestFor: 'Stock builds that never raise the limits',
          price: product.catalogPrice ?? { amountMinor: 16000, currency: 'EUR' },
          reason: 'Both boards held their limits without throttling.',
        },
      }),
    );
  }
  const charts = await ok<{ charts: { key: string; status: string; snapshotHash: string }[] }>(
    editor.get(`/api/roundups/${roundup.id}/charts`),
  );
  for (const chart of charts.charts) {
    if (chart.status === 'empty' || chart.status === 'approved') continue;
    await ok(
      editor.post(`/api/roundups/${roundup.id}/charts/${chart.key}/approval`, {
        data: { snapshotHash: chart.snapshotHash },
      }),
    );
  }
  await ok(editor.post(`/api/roundups/${roundup.id}/review-request`, { data: {} }));
  const writeUp = await ok<{ sections: { id: number; reviewState: string }[] }>(
    editor.get(`/api/roundups/${roundup.id}/write-up`),
  );
  for (const section of writeUp.sections) {
    if (section.reviewState !== 'signed-off') {
      await ok(editor.post(`/api/write-up/sections/${section.id}/sign-off`, { data: {} }));
    }
  }
  const readiness = await ok<{ ready: boolean; blocking: { label: string }[] }>(
    editor.get(`/api/roundups/${roundup.id}/readiness`),
  );
  expect(readiness.blocking).toEqual([]);
  return {
    roundupId: roundup.id,
    title,
    boards: boards.map((b) => ({ name: `Korvath ${b.model}`, peaksC: b.peaksC })),
    configurations,
  };
}
