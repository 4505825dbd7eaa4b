// The invented test plan as API request bodies: a bench profile, a stock load, a board with its power design and a
// roundup on the Helix-1700 platform. API tests, Playwright specs and the capture benchmark build their plans from
// these, each with names of its own.

/** A calendar date `days` from today (UTC), YYYY-MM-DD. */
export function dayFromToday(days: number): string {
  return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

/** An open-bench profile in a 21 °C ± 1 °C room with one type K probe under the V-core stages. */
export function benchProfileRequest(name: string, overrides: Record<string, unknown> = {}) {
  return {
    name,
    caseAndFans: 'Open test bench, one 120 mm fan at 800 rpm aimed at the board',
    cooler: 'Quillon Arctide 360 liquid cooler',
    psu: 'Ostrel Works 1000 W Platinum',
    memory: '2 × 16 GB at 6000 MT/s, profile timings',
    roomTempTargetC: 21,
    roomTempToleranceC: 1,
    probeType: 'Type K thermocouple, 0.1 mm bead',
    probePlacement: 'Board rear under the V-core stages, taped',
    requiredSoakMinutes: 60,
    ...overrides,
  };
}

/** A stock all-core load on a 16-core sample soaking 60 minutes. */
export function loadConfigurationRequest(name: string, overrides: Record<string, unknown> = {}) {
  return {
    name,
    cpuDescription: 'Helix HX-16 sample, 16 cores',
    settingsMode: 'stock',
    expectedPackagePowerW: 230,
    coreVoltageV: 1.25,
    soakMinutes: 60,
    ...overrides,
  };
}

/** An ATX board for the platform with a doubled 8-phase V-core design and the usual rear I/O. */
export function productRequest(
  maker: string,
  model: string,
  platform: string,
  overrides: Record<string, unknown> = {},
) {
  return {
    maker,
    model,
    platform,
    socket: 'HX4',
    chipset: 'HX-B50',
    formFactor: 'atx' as const,
    releaseDate: '2025-03-14',
    powerDesign: {
      controller: 'KV-PWM8',
      controllerPhases: 8,
      phaseMultiplication: 'doubled' as const,
      stagesPerPhase: 1,
      vcoreStageType: 'integrated-power-stage' as const,
      vcoreStagePart: 'KVS-60',
      vcoreStageCurrentA: 60,
      socRailStages: 2,
      otherRails: '1 stage auxiliary',
      heatsinkNotes: 'Two finned blocks joined by a heat pipe',
    },
    features: {
      rearUsb: { usb2: 4, usb5g: 2, usb10g: 2, usb20g: 1, usb40g: 0 },
      frontUsbCHeader: 'usb-10g' as const,
      lanSpeedMbps: 2500,
      wifi: 'wifi-6e' as const,
      m2Slots: 3,
      sataPorts: 4,
      audio: '7.1 HD audio',
      ioShieldPrefitted: true,
    },
    ...overrides,
  };
}

/** A roundup in Planning for the platform, publishing in 60 days, priced EUR 150–220 in Germany. */
export function roundupRequest(
  title: string,
  platform: string,
  plan: { benchProfileId: number; loadConfigurationIds: number[] },
  overrides: Record<string, unknown> = {},
) {
  return {
    title,
    platform,
    priceBand: { minMinor: 15000, maxMinor: 22000, currency: 'EUR', region: 'DE' },
    targetPublishDate: dayFromToday(60),
    timeZone: 'Europe/Berlin',
    ...plan,
    ...overrides,
  };
}

/** Sends one API request as a signed-in staff member and answers its JSON; throws on anything but success. */
export type SendRequest = (method: 'GET' | 'POST', path: string, body?: unknown) => Promise<unknown>;

export interface AssignedCell {
  roundupId: number;
  entryId: number;
  cellId: number;
  maker: string;
  model: string;
  loadName: string;
}

/**
 * As an editor: a roundup on the bench with one board under one stock load, its one cell assigned to the tester and
 * due in five days. `suffix` keeps every name apart from other runs.
 */
export async function planAssignedCell(
  send: SendRequest,
  options: { suffix: string; testerId: number; profileName: string; title: string; model: string },
): Promise<AssignedCell> {
  const { suffix } = options;
  const platform = `Helix-1700 ${suffix}`;
  const created = async (path: string, body: unknown) => ((await send('POST', path, body)) as { id: number }).id;
  const benchProfileId = await created('/api/bench-profiles', benchProfileRequest(`${options.profileName} ${suffix}`));
  const loadName = `Stock all-core ${suffix}`;
  const loadConfigurationId = await created('/api/load-configurations', loadConfigurationRequest(loadName));
  const maker = `Quillon ${suffix}`;
  const productId = await created('/api/catalog/products', productRequest(maker, options.model, platform));
  const roundupId = await created(
    '/api/roundups',
    roundupRequest(`${options.title} ${suffix}`, platform, {
      benchProfileId,
      loadConfigurationIds: [loadConfigurationId],
    }),
  );
  const { entry } = (await send('POST', `/api/roundups/${roundupId}/entries`, { productId, kind: 'tested' })) as {
    entry: { id: number };
  };
  await send('POST', `/api/roundups/${roundupId}/state`, { to: 'on-the-bench' });
  await send('POST', `/api/roundups/${roundupId}/assignments`, {
    entryIds: [entry.id],
    testerId: options.testerId,
    dueDate: dayFromToday(5),
  });
  const matrix = (await send('GET', `/api/roundups/${roundupId}/matrix`)) as { rows: { cells: { id: number }[] }[] };
  return {
    roundupId,
    entryId: entry.id,
    cellId: matrix.rows[0].cells[0].id,
    maker,
    model: options.model,
    loadName,
  };
}
