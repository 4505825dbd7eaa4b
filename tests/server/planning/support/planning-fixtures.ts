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

async function newPlan(editor: Client, configurations: number) {
  const benchProfileId = await createBenchProfile(editor);
  const loadConfigurationIds: number[] = [];
  for (let i = 0; i < configurations; i++) loadConfigurationIds.push(await createLoadConfiguration(editor));
  return { benchProfileId, loadConfigurationIds };
}

export interface RoundupSetup {
  roundupId: number;
  platform: string;
  loadConfigurationIds: number[];
  benchProfileId: number;
}

/**
 * A roundup in Planning with a new bench profile and `configurations` new load configurations, or on a given `plan`
 * (say, an earlier roundup's bench profile and load configurations).
 */
export async function createRoundup(
  editor: Client,
  options: {
    platform?: string;
    configurations?: number;
    plan?: { benchProfileId: number; loadConfigurationIds: number[] };
    band?: Record<string, unknown>;
    timeZone?: string;
  } = {},
): Promise<RoundupSetup> {
  const platform = options.platform ?? `Helix-1700 ${tag()}`;
  const { benchProfileId, loadConfigurationIds } = options.plan ?? (await newPlan(editor, options.configurations ?? 2));
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

/** Moves a roundup on to a state; expects the move to succeed. */
export async function moveRoundup(editor: Client, roundupId: number, to: string) {
  const response = await editor.post(`/api/roundups/${roundupId}/state`).send({ to });
  expect(response.status, response.text).toBe(200);
  return response.body;
}

export async function moveToBench(editor: Client, roundupId: number) {
  await moveRoundup(editor, roundupId, 'on-the-bench');
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

/** What a tester reads off the bench display for a manual run: peak, ambient (21 °C unless said), throttling. */
export interface ManualFigures {
  peakC: number;
  ambientC?: number;
  throttled?: boolean;
  /** When the run started; now unless said. */
  startedAt?: string;
}

/** A manual run on a cell (no booking, so with a reason): "Mark recorded" needs a run behind it. */
export async function recordManualRun(agent: Client, cellId: number, figures: number | ManualFigures = 71.5) {
  const run = typeof figures === 'number' ? { peakC: figures } : figures;
  const response = await agent.post(`/api/cells/${cellId}/manual-runs`).send({
    firmwareVersion: 'F1.0',
    startedAt: run.startedAt ?? new Date().toISOString(),
    manualPeakC: run.peakC,
    manualAmbientC: run.ambientC ?? 21.0,
    throttled: run.throttled ?? false,
    outsideBookingReason: 'Set-up check before the booking system was used.',
  });
  if (response.status !== 201) throw new Error(`manual run: ${response.status} ${response.text}`);
  return response.body.run as { id: number };
}

/** Adds `count` tested boards to a roundup; `make` creates each product (a plain catalog board by default). */
export async function addTestedBoards(
  editor: Client,
  roundup: { roundupId: number; platform: string },
  count: number,
  make: (index: number) => Promise<number> = () => createProduct(editor, roundup.platform),
) {
  const boards: { productId: number; entryId: number }[] = [];
  for (let index = 0; index < count; index++) {
    const productId = await make(index);
    const { entry } = await addEntry(editor, roundup.roundupId, productId);
    boards.push({ productId, entryId: entry.id });
  }
  return boards;
}

/** A roundup in Planning with `products` tested boards (one by default) × its load configurations. */
export async function plannedRoundup(
  editor: Client,
  options: Parameters<typeof createRoundup>[1] & { products?: number } = {},
) {
  const setup = await createRoundup(editor, options);
  const boards = await addTestedBoards(editor, setup, options.products ?? 1);
  return {
    ...setup,
    productIds: boards.map((board) => board.productId),
    entryIds: boards.map((board) => board.entryId),
  };
}

/** The same roundup moved on to the bench, with its matrix. */
export async function roundupOnTheBench(editor: Client, options: Parameters<typeof plannedRoundup>[1] = {}) {
  const planned = await plannedRoundup(editor, options);
  await moveToBench(editor, planned.roundupId);
  return { ...planned, matrix: await matrixOf(editor, planned.roundupId) };
}

/** Assigns cells, or whole rows by entry, to a tester with a due date. */
export async function assignCells(
  editor: Client,
  roundupId: number,
  cells: { cellIds: number[] } | { entryIds: number[] },
  testerId: number,
  dueDate: string,
) {
  const response = await editor.post(`/api/roundups/${roundupId}/assignments`).send({ ...cells, testerId, dueDate });
  expect(response.status, response.text).toBe(200);
}

/** A new bench of the lab; returns its id. */
export async function createBench(editor: Client, location = 'Back room') {
  const response = await editor.post('/api/benches').send({ name: `Bench ${tag()}`, location });
  expect(response.status, response.text).toBe(201);
  return response.body.id as number;
}

/** A tester books cells on a bench; returns the booking as answered. */
export async function bookBench(
  tester: Client,
  benchId: number,
  booking: { startsAt: string; endsAt: string; cellIds: number[]; note?: string },
) {
  const response = await tester.post(`/api/benches/${benchId}/bookings`).send(booking);
  expect(response.status, response.text).toBe(201);
  return response.body;
}

/**
 * A roundup on the bench (one board, one configuration by default) whose first cell is assigned to the tester and
 * booked by them on a new bench tomorrow 08:00–12:00 UTC; `startedAt` lies inside the booking.
 */
export async function bookedCell(
  editor: Client,
  tester: { agent: Client; user: { id: number } },
  options: Parameters<typeof plannedRoundup>[1] = {},
) {
  const setup = await roundupOnTheBench(editor, { configurations: 1, ...options });
  const cellId = setup.matrix.rows[0].cells[0].id;
  await assignCells(editor, setup.roundupId, { cellIds: [cellId] }, tester.user.id, dayFromToday(3));
  const benchId = await createBench(editor);
  const day = dayFromToday(1);
  await bookBench(tester.agent, benchId, {
    startsAt: `${day}T08:00:00.000Z`,
    endsAt: `${day}T12:00:00.000Z`,
    cellIds: [cellId],
  });
  return { ...setup, entryId: setup.entryIds[0], cellId, benchId, startedAt: `${day}T08:30:00.000Z` };
}

/** A catalog board on the platform with these price records, in order (DE and EUR unless said). */
export async function pricedProduct(
  agent: Client,
  platform: string,
  prices: { amountMinor: number; observedOn: string; region?: string; currency?: string }[],
  overrides: Partial<CreateProductRequest> = {},
) {
  const productId = await createProduct(agent, platform, overrides);
  for (const price of prices) await addPrice(agent, productId, { region: 'DE', currency: 'EUR', ...price });
  return productId;
}

/** Why a start has no booking behind it, for tests about cells rather than bench time. */
export const startWithoutBooking = 'Bench free this morning; booking follows';

/** Moves a cell on (a start says why no booking covers it); expects the move to succeed. */
export async function moveCell(agent: Client, roundupId: number, cellId: number, action: string) {
  const response = await agent
    .post(`/api/roundups/${roundupId}/cells/${cellId}/transitions`)
    .send(action === 'start' ? { action, overrideReason: startWithoutBooking } : { action });
  expect(response.status, response.text).toBe(200);
  return response.body;
}

/** The tester starts the cell, enters a manual run and marks it recorded; the editor accepts. Returns the run. */
export async function acceptedCell(
  editor: Client,
  tester: Client,
  roundupId: number,
  cellId: number,
  figures: number | ManualFigures = 71.5,
) {
  await moveCell(tester, roundupId, cellId, 'start');
  const run = await recordManualRun(tester, cellId, figures);
  await moveCell(tester, roundupId, cellId, 'record');
  await moveCell(editor, roundupId, cellId, 'accept');
  return run;
}
