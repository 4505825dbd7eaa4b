import { randomBytes } from 'node:crypto';
import { expect } from 'vitest';
import type { Client } from '../../support/test-app';
import type { CreateProductRequest } from '../../../../shared/schemas/catalog';
import {
  benchProfileRequest,
  dayFromToday,
  loadConfigurationRequest,
  productRequest,
  roundupRequest,
} from '../../../support/plan-requests';

/** A short random tag, so each test's names (platform, maker, bench) are its own in the shared test database. */
export function tag(): string {
  return randomBytes(4).toString('hex');
}

export { dayFromToday };

export function productBody(platform: string, overrides: Partial<CreateProductRequest> = {}): CreateProductRequest {
  return productRequest(`Korvath ${tag()}`, `HX4 Test ${tag()}`, platform, overrides);
}

/** Creates a product through the API and returns its id. */
export async function createProduct(agent: Client, platform: string, overrides: Partial<CreateProductRequest> = {}) {
  const response = await agent.post('/api/catalog/products').send(productBody(platform, overrides));
  expect(response.status, response.text).toBe(201);
  return response.body.id as number;
}

export async function addPrice(
  agent: Client,
  productId: number,
  price: { region: string; currency: string; amountMinor: number; observedOn: string; source?: string },
) {
  const response = await agent
    .post(`/api/catalog/products/${productId}/prices`)
    .send({ source: 'Brightmoor Direct web shop', ...price });
  expect(response.status, response.text).toBe(201);
  return response.body.id as number;
}

/** A bench profile of the test plan, with the given set-up fields changed. */
export async function createBenchProfile(editor: Client, changes: Record<string, unknown> = {}) {
  const response = await editor.post('/api/bench-profiles').send(benchProfileRequest(`Open bench ${tag()}`, changes));
  expect(response.status, response.text).toBe(201);
  return response.body.id as number;
}

export async function createLoadConfiguration(editor: Client, overrides: Record<string, unknown> = {}) {
  const response = await editor
    .post('/api/load-configurations')
    .send(loadConfigurationRequest(`Stock all-core ${tag()}`, overrides));
  expect(response.status, response.text).toBe(201);
  return response.body.id as number;
}

export interface RoundupSetup {
  roundupId: number;
  platform: string;
  loadConfigurationIds: number[];
  benchProfileId: number;
}

/** A roundup in Planning with a bench profile and `configurations` load configurations. */
export async function createRoundup(
  editor: Client,
  options: { platform?: string; configurations?: number; band?: Record<string, unknown>; timeZone?: string } = {},
): Promise<RoundupSetup> {
  const platform = options.platform ?? `Helix-1700 ${tag()}`;
  const benchProfileId = await createBenchProfile(editor);
  const loadConfigurationIds: number[] = [];
  for (let i = 0; i < (options.configurations ?? 2); i++)
    loadConfigurationIds.push(await createLoadConfiguration(editor));
  const response = await editor.post('/api/roundups').send(
    roundupRequest(
      `Helix-1700 boards ${tag()}`,
      platform,
      { benchProfileId, loadConfigurationIds },
      {
        priceBand: { minMinor: 15000, maxMinor: 22000, currency: 'EUR', region: 'DE', ...options.band },
        timeZone: options.timeZone ?? 'Europe/Berlin',
      },
    ),
  );
  expect(response.status, response.text).toBe(201);
  return { roundupId: response.body.id, platform, loadConfigurationIds, benchProfileId };
}

export async function addEntry(
  editor: Client,
  roundupId: number,
  productId: number,
  kind: 'tested' | 'reference' = 'tested',
) {
  const response = await editor.post(`/api/roundups/${roundupId}/entries`).send({ productId, kind });
  expect(response.status, response.text).toBe(201);
  return response.body as { entry: { id: number; sample: { id: number } | null }; warnings: string[] };
}

export async function moveToBench(editor: Client, roundupId: number) {
  const response = await editor.post(`/api/roundups/${roundupId}/state`).send({ to: 'on-the-bench' });
  expect(response.status, response.text).toBe(200);
}

export async function matrixOf(agent: Client, roundupId: number) {
  const response = await agent.get(`/api/roundups/${roundupId}/matrix`);
  expect(response.status, response.text).toBe(200);
  return response.body as {
    rows: {
      entryId: number;
      kind: string;
      cells: { id: number; state: string; tester: { id: number } | null; actions: string[]; qaFlags?: string[] }[];
    }[];
    progress: { cellCount: number; acceptedCount: number; percentAccepted: number; unassignedCount: number };
  };
}

/** A manual run on a cell (no booking, so with a reason): "Mark recorded" needs a run behind it. */
export async function recordManualRun(agent: Client, cellId: number, peakC = 71.5) {
  const response = await agent.post(`/api/cells/${cellId}/manual-runs`).send({
    firmwareVersion: 'F1.0',
    startedAt: new Date().toISOString(),
    manualPeakC: peakC,
    manualAmbientC: 21.0,
    outsideBookingReason: 'Set-up check before the booking system was used.',
  });
  if (response.status !== 201) throw new Error(`manual run: ${response.status} ${response.text}`);
  return response.body.run as { id: number };
}
