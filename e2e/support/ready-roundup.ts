import { expect, type APIRequestContext, type APIResponse } from '@playwright/test';
import { demoAccounts } from './demo-accounts';
import {
  benchProfileRequest,
  dayFromToday,
  loadConfigurationRequest,
  productRequest,
  roundupRequest,
} from '../../tests/support/plan-requests';
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

/** Answers a successful API response's JSON; fails the test on anything else. */
export async function ok<T>(response: Promise<APIResponse>): Promise<T> {
  const answer = await response;
  expect(answer.ok(), `${answer.url()}: ${answer.status()} ${await answer.text()}`).toBe(true);
  return (await answer.json()) as T;
}

export interface ReadyRoundup {
  roundupId: number;
  title: string;
  boards: { name: string; peaksC: number[] }[];
  configurations: { id: number; name: string; packagePowerW: number }[];
}

/** What a roundup is planned with: boards (priced in DE, EUR) and load configurations, names made unique by the caller. */
export interface RoundupPlan {
  title: string;
  benchName: string;
  configurations: { name: string; packagePowerW: number; fixedClockMhz?: number }[];
  boards: { model: string; price: number }[];
}

/** Stage "planned": a roundup in Planning on a new bench profile and its load configurations, with its boards priced. */
export async function plannedRoundup(editor: APIRequestContext, plan: RoundupPlan) {
  const profile = await ok<{ id: number }>(
    editor.post('/api/bench-profiles', { data: benchProfileRequest(plan.benchName) }),
  );
  const configurations: ReadyRoundup['configurations'] = [];
  for (const { name, packagePowerW, fixedClockMhz } of plan.configurations) {
    const request = loadConfigurationRequest(name, {
      expectedPackagePowerW: packagePowerW,
      ...(fixedClockMhz ? { settingsMode: 'fixed', fixedClockMhz } : {}),
    });
    const config = await ok<{ id: number }>(editor.post('/api/load-configurations', { data: request }));
    configurations.push({ id: config.id, name, packagePowerW });
  }
  const platform = `Helix-1700 ${uniqueSuffix()}`;
  const loadConfigurationIds = configurations.map((c) => c.id);
  const roundup = await ok<{ id: number }>(
    editor.post('/api/roundups', {
      data: roundupRequest(plan.title, platform, { benchProfileId: profile.id, loadConfigurationIds }),
    }),
  );
  for (const board of plan.boards) {
    const product = await ok<{ id: number }>(
      editor.post('/api/catalog/products', {
        data: productRequest('Korvath', board.model, platform, { chipset: 'HX-B70' }),
      }),
    );
    await ok(
      editor.post(`/api/catalog/products/${product.id}/prices`, {
        data: {
          region: 'DE',
          currency: 'EUR',
          amountMinor: board.price,
          observedOn: dayFromToday(-2),
          source: 'Brightmoor Direct',
        },
      }),
    );
    await ok(editor.post(`/api/roundups/${roundup.id}/entries`, { data: { productId: product.id, kind: 'tested' } }));
  }
  return { roundupId: roundup.id, title: plan.title, configurations };
}

/**
 * Stage "tested and accepted": the roundup goes on the bench, the tester takes every cell, enters a manual run with
 * the figures of its board (row) and load configuration (column), marks it recorded; the editor accepts it and makes
 * it the run of record. Then the roundup moves on to Writing.
 */
export async function testedAndAccepted(
  editor: APIRequestContext,
  tester: APIRequestContext,
  roundup: { roundupId: number; configurations: { id: number }[] },
  figures: (row: number, column: number) => { peakC: number; throttled?: boolean },
) {
  const roundupPath = `/api/roundups/${roundup.roundupId}`;
  await ok(editor.post(`${roundupPath}/state`, { data: { to: 'on-the-bench' } }));
  const testerId = (await ok<{ user: { id: number } }>(tester.get('/api/auth/session'))).user.id;
  const matrix = await ok<{ rows: { entryId: number; cells: { id: number; loadConfigurationId: number }[] }[] }>(
    editor.get(`${roundupPath}/matrix`),
  );
  const entryIds = matrix.rows.map((r) => r.entryId);
  await ok(editor.post(`${roundupPath}/assignments`, { data: { entryIds, testerId, dueDate: dayFromToday(3) } }));
  for (const [row, { cells }] of matrix.rows.entries()) {
    for (const cell of cells) {
      const { peakC, throttled = false } = figures(
        row,
        roundup.configurations.findIndex((c) => c.id === cell.loadConfigurationId),
      );
      const transitions = `${roundupPath}/cells/${cell.id}/transitions`;
      await ok(tester.post(transitions, { data: { action: 'start', overrideReason: 'Bench free this morning' } }));
      const { run } = await ok<{ run: { id: number } }>(
        tester.post(`/api/cells/${cell.id}/manual-runs`, {
          data: {
            firmwareVersion: '1.04',
            startedAt: new Date().toISOString(),
            manualPeakC: peakC,
            manualAmbientC: 21.0,
            throttled,
            outsideBookingReason: 'Logger was away for calibration; read off the meter.',
          },
        }),
      );
      await ok(tester.post(transitions, { data: { action: 'record' } }));
      await ok(editor.post(transitions, { data: { action: 'accept' } }));
      await ok(editor.post(`/api/runs/${run.id}/run-of-record`, { data: {} }));
    }
  }
  await ok(editor.post(`${roundupPath}/state`, { data: { to: 'writing' } }));
  return matrix;
}

/**
 * Stage "ready": a verdict per board, every chart approved, sent to review and every write-up section signed off;
 * the readiness check then names no blocker.
 */
export async function madeReady(editor: APIRequestContext, roundupId: number) {
  const verdicts = await ok<{
    products: { entryId: number; catalogPrice: { amountMinor: number; currency: string } | null }[];
  }>(editor.get(`/api/roundups/${roundupId}/verdicts`));
  for (const product of verdicts.products) {
    await ok(
      editor.put(`/api/roundups/${roundupId}/verdicts/${product.entryId}`, {
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
    editor.get(`/api/roundups/${roundupId}/charts`),
  );
  for (const chart of charts.charts) {
    if (chart.status === 'empty' || chart.status === 'approved') continue;
    await ok(
      editor.post(`/api/roundups/${roundupId}/charts/${chart.key}/approval`, {
        data: { snapshotHash: chart.snapshotHash },
      }),
    );
  }
  await ok(editor.post(`/api/roundups/${roundupId}/review-request`, { data: {} }));
  const writeUp = await ok<{ sections: { id: number; reviewState: string }[] }>(
    editor.get(`/api/roundups/${roundupId}/write-up`),
  );
  for (const section of writeUp.sections) {
    if (section.reviewState !== 'signed-off') {
      await ok(editor.post(`/api/write-up/sections/${section.id}/sign-off`, { data: {} }));
    }
  }
  const readiness = await ok<{ ready: boolean; blocking: { label: string }[] }>(
    editor.get(`/api/roundups/${roundupId}/readiness`),
  );
  expect(readiness.blocking).toEqual([]);
}

/**
 * A roundup genuinely ready to schedule, made through the API as staff make it: two boards tested under two loads
 * (different package power, so a board's page can estimate between them), each cell accepted with a manual run of
 * record, a verdict per board, every chart approved, sent to review and every write-up section signed off.
 */
export async function readyRoundup(editor: APIRequestContext, tester: APIRequestContext): Promise<ReadyRoundup> {
  const suffix = uniqueSuffix();
  const boards = [
    { model: `Tallow B70 ${suffix}`, peaksC: [64.2, 78.6], price: 17900 },
    { model: `Quarry B70 ${suffix}`, peaksC: [61.5, 72.8], price: 16400 },
  ];
  const roundup = await plannedRoundup(editor, {
    title: `Helix-1700 embargo check ${suffix}`,
    benchName: `Embargo bench ${suffix}`,
    configurations: [
      { name: `Stock all-core ${suffix}`, packagePowerW: 180 },
      { name: `Fixed 5.2 GHz all-core ${suffix}`, packagePowerW: 280, fixedClockMhz: 5200 },
    ],
    boards,
  });
  await testedAndAccepted(editor, tester, roundup, (row, column) => ({ peakC: boards[row].peaksC[column] }));
  await madeReady(editor, roundup.roundupId);
  return {
    ...roundup,
    boards: boards.map((b) => ({ name: `Korvath ${b.model}`, peaksC: b.peaksC })),
  };
}
