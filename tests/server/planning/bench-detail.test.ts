import { describe, expect, it } from 'vitest';
import { signedInTeam } from '../support/test-app';
import { createBenchProfile, dayFromToday, tag } from './support/planning-fixtures';

/** A calendar date `months` calendar months before today (day clamped to 28 so every month has it). */
function monthsAgo(months: number): string {
  const now = new Date();
  const date = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - months, Math.min(now.getUTCDate(), 28)));
  return date.toISOString().slice(0, 10);
}

describe('bench detail', () => {
  it('shows the set-up, probes and logger with their next calibration, and a maintenance log', async () => {
    const { editor, tester, writer } = await signedInTeam();
    const benchProfileId = await createBenchProfile(editor.agent);
    const bench = await editor.agent.post('/api/benches').send({ name: `Bench ${tag()}`, benchProfileId });
    expect(bench.status, bench.text).toBe(201);
    const benchId = bench.body.id as number;

    const probe = await editor.agent.post(`/api/benches/${benchId}/instruments`).send({
      kind: 'probe',
      label: 'Probe 1, V-core rear',
      model: 'Type K thermocouple, 0.1 mm bead',
      serialNumber: 'TK-0117',
      calibratedOn: '2026-03-15',
      calibrationIntervalMonths: 12,
    });
    expect(probe.status, probe.text).toBe(201);
    // 15 Mar 2026 + 12 months, counted by hand.
    expect(probe.body.nextCalibrationDue).toBe('2027-03-15');
    const logger = await editor.agent.post(`/api/benches/${benchId}/instruments`).send({
      kind: 'logger',
      label: 'Bench logger',
      calibratedOn: monthsAgo(14),
      calibrationIntervalMonths: 12,
    });
    expect(logger.status, logger.text).toBe(201);
    expect(logger.body.calibrationOverdue).toBe(true);
    const uncalibrated = await editor.agent
      .post(`/api/benches/${benchId}/instruments`)
      .send({ kind: 'probe', label: 'Probe 2, ambient', calibrationIntervalMonths: 12 });
    expect(uncalibrated.body).toMatchObject({ nextCalibrationDue: null, calibrationOverdue: true });

    // Back from the calibration lab: a new date clears the flag.
    const recalibrated = await editor.agent
      .patch(`/api/benches/${benchId}/instruments/${logger.body.id}`)
      .send({ calibratedOn: dayFromToday(-1) });
    expect(recalibrated.status, recalibrated.text).toBe(200);
    expect(recalibrated.body.calibrationOverdue).toBe(false);

    const logged = await tester.agent
      .post(`/api/benches/${benchId}/maintenance`)
      .send({ doneOn: dayFromToday(-2), description: 'Re-seated the V-core probe; new thermal tape.' });
    expect(logged.status, logged.text).toBe(201);
    const future = await tester.agent
      .post(`/api/benches/${benchId}/maintenance`)
      .send({ doneOn: dayFromToday(3), description: 'Planned fan swap' });
    expect(future.status).toBe(422);
    expect(future.body.error.fields.doneOn).toBeTruthy();
    expect(
      (await tester.agent.post(`/api/benches/${benchId}/instruments`).send({ kind: 'probe', label: 'x' })).status,
    ).toBe(403);

    const detail = await writer.agent.get(`/api/benches/${benchId}/detail`);
    expect(detail.status, detail.text).toBe(200);
    expect(detail.body.setUp).toMatchObject({ id: benchProfileId, roomTempTargetC: expect.anything() });
    expect(detail.body.instruments.map((i: { label: string }) => i.label)).toEqual([
      'Probe 1, V-core rear',
      'Probe 2, ambient',
      'Bench logger',
    ]);
    expect(detail.body.maintenance).toEqual([
      expect.objectContaining({
        doneOn: dayFromToday(-2),
        description: 'Re-seated the V-core probe; new thermal tape.',
        recordedBy: expect.objectContaining({ id: tester.user.id }),
      }),
    ]);
    expect((await writer.agent.get('/api/benches/999999/detail')).status).toBe(404);
  });
});
