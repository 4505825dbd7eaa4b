import { describe, expect, it } from 'vitest';
import { signedIn, testApp } from '../support/test-app';
import {
  addEntry,
  createBenchProfile,
  createLoadConfiguration,
  createProduct,
  createRoundup,
  dayFromToday,
  matrixOf,
  moveToBench,
  tag,
  recordManualRun,
  assignCells,
  moveCell,
} from './support/planning-fixtures';

describe('roundup plans', () => {
  it('an editor creates a roundup with band, target date, bench profile and ordered configurations', async () => {
    const app = await testApp();
    const { agent: editor, user } = await signedIn(app, 'editor');
    const benchProfileId = await createBenchProfile(editor);
    const slow = await createLoadConfiguration(editor, { soakMinutes: 30 });
    const fixed = await createLoadConfiguration(editor, {
      settingsMode: 'fixed',
      fixedClockMhz: 5200,
      coreVoltageV: 1.325,
      expectedPackagePowerW: 285.5,
    });
    const response = await editor.post('/api/roundups').send({
      title: `Helix-1700 boards under €220 ${tag()}`,
      platform: 'Helix-1700',
      priceBand: { minMinor: 15000, maxMinor: 22000, currency: 'eur', region: 'de' },
      targetPublishDate: '2099-09-15',
      timeZone: 'Europe/Berlin',
      benchProfileId,
      loadConfigurationIds: [fixed, slow],
    });
    expect(response.status, response.text).toBe(201);
    expect(response.body).toMatchObject({
      state: 'planning',
      priceBand: { minMinor: 15000, maxMinor: 22000, currency: 'EUR', region: 'DE' },
      benchProfile: { id: benchProfileId, roomTempTargetC: 21, requiredSoakMinutes: 60 },
      createdBy: { id: user.id },
      nextState: { to: 'on-the-bench', allowed: false, problems: ['Add at least one product to test.'] },
      planEditable: true,
    });
    expect(response.body.loadConfigurations.map((c: { id: number }) => c.id)).toEqual([fixed, slow]);
    expect(response.body.loadConfigurations[0]).toMatchObject({
      fixedClockMhz: 5200,
      coreVoltageV: 1.325,
      expectedPackagePowerW: 285.5,
    });
    expect(response.body.planWarnings).toEqual([expect.stringMatching(/soaks 30 min, shorter than the 60 min/)]);
  });

  it('a band whose upper bound is below the lower one, a fixed configuration without a clock, and a bad zone are refused', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const band = await editor.post('/api/roundups').send({
      title: 'Backwards',
      platform: 'Helix-1700',
      priceBand: { minMinor: 30000, maxMinor: 20000, currency: 'EUR', region: 'DE' },
      timeZone: 'Mars/Olympus',
    });
    expect(band.status).toBe(400);
    expect(band.body.error.fields['priceBand.maxMinor']).toMatch(/not be below/);
    expect(band.body.error.fields.timeZone).toMatch(/IANA/);
    const fixed = await editor.post('/api/load-configurations').send({
      name: `No clock ${tag()}`,
      cpuDescription: 'Helix HX-16 sample',
      settingsMode: 'fixed',
      expectedPackagePowerW: 250,
      coreVoltageV: 1.3,
      soakMinutes: 60,
    });
    expect(fixed.status).toBe(400);
    expect(fixed.body.error.fields.fixedClockMhz).toBeTruthy();
  });

  it('every plan change lands in the roundup history with who, when and what', async () => {
    const app = await testApp();
    const { agent: editor, user } = await signedIn(app, 'editor');
    const { agent: writer } = await signedIn(app, 'writer');
    const { roundupId, platform, loadConfigurationIds, benchProfileId } = await createRoundup(editor, {
      configurations: 2,
    });
    const product = await createProduct(editor, platform);
    await addEntry(editor, roundupId, product);
    const third = await createLoadConfiguration(editor);
    await editor
      .put(`/api/roundups/${roundupId}/load-configurations`)
      .send({ loadConfigurationIds: [third, loadConfigurationIds[0]] });
    await editor
      .patch(`/api/roundups/${roundupId}`)
      .send({ priceBand: { minMinor: 16000, maxMinor: 24000, currency: 'EUR', region: 'DE' }, title: 'Renamed' });
    await editor.patch(`/api/bench-profiles/${benchProfileId}`).send({ roomTempToleranceC: 1.5 });

    const history = await writer.get(`/api/roundups/${roundupId}/history`);
    expect(history.status).toBe(200);
    const entries = history.body.entries as {
      action: string;
      actor: { id: number };
      at: string;
      details: Record<string, unknown>;
    }[];
    expect(entries.map((e) => e.action)).toEqual([
      'roundup.bench_profile_edited',
      'roundup.updated',
      'roundup.load_configurations_set',
      'roundup.entry_added',
      'roundup.created',
    ]);
    expect(entries.every((e) => e.actor.id === user.id && /Z$/.test(e.at))).toBe(true);
    expect(entries[1].details.priceBand).toEqual({
      from: { minMinor: 15000, maxMinor: 22000, currency: 'EUR', region: 'DE' },
      to: { minMinor: 16000, maxMinor: 24000, currency: 'EUR', region: 'DE' },
    });
    expect(entries[2].details).toMatchObject({ added: [third], removed: [loadConfigurationIds[1]] });
    expect(entries[0].details).toMatchObject({ changes: { roomTempToleranceC: { from: 1, to: 1.5 } } });

    // The matrix follows the configuration list: one column out, one in, in the new order.
    const matrix = await editor.get(`/api/roundups/${roundupId}/matrix`);
    expect(matrix.body.columns.map((c: { loadConfigurationId: number }) => c.loadConfigurationId)).toEqual([
      third,
      loadConfigurationIds[0],
    ]);
    expect(matrix.body.rows[0].cells.map((c: { loadConfigurationId: number }) => c.loadConfigurationId)).toEqual([
      third,
      loadConfigurationIds[0],
    ]);
  });

  it('the state moves forward only, with its conditions; a configuration with work cannot leave the plan', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const { agent: tester, user: testerUser } = await signedIn(app, 'tester');
    const { roundupId, platform, loadConfigurationIds } = await createRoundup(editor, { configurations: 1 });
    const jump = await editor.post(`/api/roundups/${roundupId}/state`).send({ to: 'live' });
    expect(jump.status).toBe(422);
    expect(jump.body.error.message).toMatch(/can only move forward to On the bench/);
    const empty = await editor.post(`/api/roundups/${roundupId}/state`).send({ to: 'on-the-bench' });
    expect(empty.status).toBe(422);
    expect(empty.body.error.code).toBe('state_change_blocked');

    const { entry } = await addEntry(editor, roundupId, await createProduct(editor, platform));
    await moveToBench(editor, roundupId);
    const back = await editor.post(`/api/roundups/${roundupId}/state`).send({ to: 'planning' });
    expect(back.status).toBe(422);

    await assignCells(editor, roundupId, { entryIds: [entry.id] }, testerUser.id, dayFromToday(2));
    const [cell] = (await matrixOf(editor, roundupId)).rows[0].cells;
    await moveCell(tester, roundupId, cell.id, 'start');
    const drop = await editor.put(`/api/roundups/${roundupId}/load-configurations`).send({ loadConfigurationIds: [] });
    expect(drop.status).toBe(409);
    expect(drop.body.error.code).toBe('configuration_has_work');

    const early = await editor.post(`/api/roundups/${roundupId}/state`).send({ to: 'writing' });
    expect(early.status).toBe(422);
    expect(early.body.error.message).toMatch(/1 matrix cell\(s\) are not accepted yet/);
    await recordManualRun(tester, cell.id);
    await moveCell(tester, roundupId, cell.id, 'record');
    await moveCell(editor, roundupId, cell.id, 'accept');
    const writing = await editor.post(`/api/roundups/${roundupId}/state`).send({ to: 'writing' });
    expect(writing.status, writing.text).toBe(200);
    expect(writing.body).toMatchObject({ state: 'writing', planEditable: false, progress: { percentAccepted: 100 } });
    expect(writing.body.nextState).toMatchObject({
      to: 'in-review',
      allowed: true,
      problems: [],
    });

    // Once writing, the plan is locked.
    const locked = await editor.put(`/api/roundups/${roundupId}/load-configurations`).send({ loadConfigurationIds });
    expect(locked.status).toBe(422);
    expect(locked.body.error.code).toBe('plan_locked');
  });

  it('editors see roundups by state with matrix progress and unassigned cells on their dashboard', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const { agent: writer } = await signedIn(app, 'writer');
    const { agent: admin } = await signedIn(app, 'admin');
    const { roundupId, platform } = await createRoundup(editor, { configurations: 3 });
    await addEntry(editor, roundupId, await createProduct(editor, platform));
    const dashboard = await editor.get('/api/dashboard');
    const planning = dashboard.body.roundupsByState.find((g: { state: string }) => g.state === 'planning');
    const mine = planning.roundups.find((r: { id: number }) => r.id === roundupId);
    expect(mine.progress).toMatchObject({ cellCount: 3, acceptedCount: 0, percentAccepted: 0, unassignedCount: 3 });
    expect(dashboard.body.unassignedCells).toContainEqual({ roundupId, title: mine.title, unassignedCount: 3 });
    expect((await writer.get('/api/dashboard')).body.view).toBe('overview');
    expect((await admin.get('/api/dashboard')).body.view).toBe('overview');
  });
});
