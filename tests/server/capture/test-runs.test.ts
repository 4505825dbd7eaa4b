import { createHash } from 'node:crypto';
import { existsSync, readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { RunAnalysisEntity } from '../../../server/entities/run-analysis.entity';
import { StoredFileEntity } from '../../../server/entities/stored-file.entity';
import { TestRunEntity } from '../../../server/entities/test-run.entity';
import { analysisEngineVersion } from '../../../shared/domain/analysis/engine-version';
import { syntheticLoggerLog } from '../../../shared/generators/synthetic-logger-log';
import { asBytes, signedInTeam, testDataSource, testUploadsDir, type Client } from '../support/test-app';
import { bookedCell, dayFromToday, matrixOf, recordManualRun } from '../planning/support/planning-fixtures';

/** A one-hour soak at 1 Hz rising first-order from 21 °C by 50 °C with τ = 600 s (peak ≈ 71 °C), ambient steady. */
function soakLog(seed = 1) {
  return syntheticLoggerLog({
    durationS: 3600,
    sampleHz: 1,
    seed,
    probes: [{ name: 'VRM 1', startC: 21, riseC: 50, tauS: 600, noiseC: 0.05 }],
    ambient: { name: 'Ambient', startC: 21, noiseC: 0.05 },
  });
}

const mapping = { time: 'Time [s]', vrm: ['VRM 1 [°C]'], ambient: 'Ambient [°C]' };

async function setUp() {
  const { editor, tester, otherTester, writer } = await signedInTeam();
  return { editor, tester, otherTester, writer, ...(await bookedCell(editor.agent, tester)) };
}

function uploadRun(agent: Client, cellId: number, body: Buffer, request: Record<string, unknown>, name = 'soak.csv') {
  return agent
    .post(`/api/cells/${cellId}/runs`)
    .attach('file', body, { filename: name, contentType: 'text/csv' })
    .field('request', JSON.stringify(request));
}

const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

describe('test runs on matrix cells', () => {
  it('when a tester uploads a logger file, then the bytes are stored as they came, analysed, and listed on the cell', async () => {
    const { tester, writer, cellId, startedAt, benchProfileId, editor } = await setUp();
    const bytes = Buffer.from(soakLog(), 'utf8');
    const response = await uploadRun(tester.agent, cellId, bytes, { firmwareVersion: 'F1.2', startedAt, mapping });
    expect(response.status, response.text).toBe(201);
    const run = response.body.run;
    expect(run).toMatchObject({ source: 'logger', firmwareVersion: 'F1.2', reviewState: 'pending' });
    expect(run.loggerFile.sha256).toBe(sha256(bytes));
    expect(run.bookingId).not.toBeNull();
    // First-order rise 21 + 50·(1 − e^(−t/τ)) after an hour with τ = 600 s: 21 + 50·(1 − e^−6) ≈ 70.88 °C
    // (first principles, step response of a first-order system).
    expect(run.analysis.peakC).toBeCloseTo(70.9, 0);
    expect(run.analysis.engineVersion).toBe(analysisEngineVersion);

    // Evidence: the stored object and the download are byte-identical to the upload.
    const ds = await testDataSource();
    const stored = await ds.getRepository(StoredFileEntity).findOneByOrFail({ id: run.loggerFile.id });
    expect(stored.sha256).toBe(sha256(bytes));
    const download = await asBytes(writer.agent.get(`/api/runs/${run.id}/logger-file`));
    expect(download.status).toBe(200);
    expect(sha256(download.body as Buffer)).toBe(sha256(bytes));
    expect(download.headers['x-content-type-options']).toBe('nosniff');
    expect(download.headers['content-disposition']).toMatch(/^attachment;/);
    expect(download.headers['content-type']).toBe('application/octet-stream');

    // The analysis records every parameter it used, including the plan's settings.
    const [analysis] = await ds.getRepository(RunAnalysisEntity).findBy({ testRunId: run.id });
    expect(analysis.parameters).toMatchObject({
      mapping,
      options: { soakMinutes: 60, ambientTargetC: 21, ambientToleranceC: 1, rubric: { comfortableBelowC: 80 } },
    });

    // The cell lists the run, and the mapping is remembered for the bench profile.
    const cellRuns = await editor.agent.get(`/api/cells/${cellId}/runs`);
    expect(cellRuns.body.runs.map((r: { id: number }) => r.id)).toEqual([run.id]);
    expect(cellRuns.body.rememberedMapping).toMatchObject(mapping);
    const profile = await editor.agent.get(`/api/bench-profiles/${benchProfileId}`);
    expect(profile.status).toBe(200);
  });

  it('when the same file is uploaded to the same cell again, then it is recognised by its hash and nothing is added', async () => {
    const { tester, cellId, startedAt } = await setUp();
    const bytes = Buffer.from(soakLog(2), 'utf8');
    const first = await uploadRun(tester.agent, cellId, bytes, { firmwareVersion: 'F1.2', startedAt, mapping });
    expect(first.status, first.text).toBe(201);
    const again = await uploadRun(
      tester.agent,
      cellId,
      bytes,
      { firmwareVersion: 'F1.2', startedAt, mapping },
      'x.csv',
    );
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('same_file');
    expect(again.body.error.message).toContain(`run ${first.body.run.id}`);
    const ds = await testDataSource();
    expect(await ds.getRepository(TestRunEntity).countBy({ matrixCellId: cellId })).toBe(1);
  });

  it('when a file cannot be analysed, then nothing is stored on disk or in the database', async () => {
    const { tester, cellId, startedAt } = await setUp();
    const before = existsSync(testUploadsDir) ? readdirSync(testUploadsDir, { recursive: true }).length : 0;
    const response = await uploadRun(tester.agent, cellId, Buffer.from('Time,VRM 1 (°C)\n0,abc\n1,def\n'), {
      firmwareVersion: 'F1.2',
      startedAt,
      mapping: { time: 'Time', vrm: ['VRM 1 (°C)'] },
    });
    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('log_parse_failed');
    expect(response.body.error.details.errors.length).toBeGreaterThan(0);
    const after = existsSync(testUploadsDir) ? readdirSync(testUploadsDir, { recursive: true }).length : 0;
    expect(after).toBe(before);
    const ds = await testDataSource();
    expect(await ds.getRepository(TestRunEntity).countBy({ matrixCellId: cellId })).toBe(0);
  });

  it('when a probe of the bench was past its calibration at the run’s start, then the analysis says so in words', async () => {
    const { editor, tester, cellId, benchId, startedAt } = await setUp();
    // Calibrated 2 years before the run with a 12-month interval: due a year before it.
    const calibratedOn = `${Number(startedAt.slice(0, 4)) - 2}${startedAt.slice(4, 10)}`;
    const probe = await editor.agent
      .post(`/api/benches/${benchId}/instruments`)
      .send({ kind: 'probe', label: 'Probe 1, rear of VRM', calibratedOn, calibrationIntervalMonths: 12 });
    expect(probe.status, probe.text).toBe(201);
    const response = await uploadRun(tester.agent, cellId, Buffer.from(soakLog(7)), {
      firmwareVersion: 'F1.2',
      startedAt,
      mapping,
    });
    expect(response.status, response.text).toBe(201);
    const flag = response.body.run.analysis.flags.find((f: { code: string }) => f.code === 'calibration-overdue');
    expect(flag).toMatchObject({ label: 'Instrument past calibration', severity: 'warning' });
    expect(flag.message).toContain('Probe 1, rear of VRM');
  });

  it('when a run starts outside every booking, then the tester is warned and may record it with a reason', async () => {
    const { tester, cellId } = await setUp();
    const body = { firmwareVersion: 'F1.2', startedAt: `${dayFromToday(2)}T20:00:00.000Z`, mapping };
    const warned = await uploadRun(tester.agent, cellId, Buffer.from(soakLog(3)), body);
    expect(warned.status).toBe(409);
    expect(warned.body.error.code).toBe('outside_booking');
    const kept = await uploadRun(tester.agent, cellId, Buffer.from(soakLog(3)), {
      ...body,
      outsideBookingReason: 'Booking calendar was down; the bench was free.',
    });
    expect(kept.status, kept.text).toBe(201);
    expect(kept.body.run.outsideBookingReason).toBe('Booking calendar was down; the bench was free.');
  });

  it('only the cell’s tester or an editor records and re-analyses; others get 403', async () => {
    const { tester, otherTester, writer, cellId, startedAt } = await setUp();
    const body = { firmwareVersion: 'F1.2', startedAt, mapping };
    expect((await uploadRun(otherTester.agent, cellId, Buffer.from(soakLog(4)), body)).status).toBe(403);
    expect((await uploadRun(writer.agent, cellId, Buffer.from(soakLog(4)), body)).status).toBe(403);
    const run = (await uploadRun(tester.agent, cellId, Buffer.from(soakLog(4)), body)).body.run;
    const other = await otherTester.agent.post(`/api/runs/${run.id}/analyses`).send({});
    expect(other.status).toBe(403);
    const own = await tester.agent.post(`/api/runs/${run.id}/analyses`).send({ options: { steadyWindowMinutes: 5 } });
    expect(own.status, own.text).toBe(201);
    expect(own.body.analyses).toHaveLength(2); // the earlier analysis stays beside the new one
  });

  it('a stored run analysed again with another mapping keeps the file and the earlier analysis; the planning matrix cell names the flags', async () => {
    const { tester, editor, cellId, roundupId, startedAt } = await setUp();
    const bytes = Buffer.from(soakLog(5));
    const recorded = await uploadRun(tester.agent, cellId, bytes, { firmwareVersion: 'F1.2', startedAt, mapping });
    expect(recorded.status, recorded.text).toBe(201);
    const run = recorded.body.run;
    const before = run.analysis;
    // Another mapping: the ambient column left out, so the engine has no room reading (its own QA flag).
    const again = await editor.agent
      .post(`/api/runs/${run.id}/analyses`)
      .send({ mapping: { time: 'Time [s]', vrm: ['VRM 1 [°C]'] } });
    expect(again.status, again.text).toBe(201);
    expect(again.body.analyses).toHaveLength(2);
    expect(again.body.analyses[0]).toEqual(before); // the earlier analysis, unchanged
    expect(again.body.analysis.id).toBe(again.body.analyses[1].id); // the newest counts
    expect(again.body.analysis.parameters.mapping).toEqual({ time: 'Time [s]', vrm: ['VRM 1 [°C]'] });
    expect(again.body.analysis.flags.map((flag: { code: string }) => flag.code)).toContain('ambient-missing');
    expect(again.body.loggerFile.sha256).toBe(sha256(bytes));
    // The planning matrix cell carries the flags of the run shown, in words, as the results matrix counts them.
    const cell = (await matrixOf(editor.agent, roundupId)).rows
      .flatMap((row) => row.cells)
      .find((entry) => entry.id === cellId);
    expect(cell?.qaFlags).toContain('No room reading');
    const results = await editor.agent.get(`/api/roundups/${roundupId}/results`);
    const resultCell = results.body.cells.find((entry: { cellId: number }) => entry.cellId === cellId);
    expect(cell?.qaFlags).toHaveLength(resultCell.flagCount);
  });

  it('a flagged run is accepted only with a written reason, kept with who and when; sending back needs a reason', async () => {
    const { tester, editor, cellId } = await setUp();
    const run = await recordManualRun(tester.agent, cellId); // manual entries carry the "manual" flag
    const bare = await editor.agent.post(`/api/runs/${run.id}/review`).send({ decision: 'accept' });
    expect(bare.status).toBe(422);
    expect(bare.body.error.code).toBe('reason_required');
    const accepted = await editor.agent
      .post(`/api/runs/${run.id}/review`)
      .send({ decision: 'accept', reason: 'Logger failed; the peak was read off the meter by two people.' });
    expect(accepted.status, accepted.text).toBe(200);
    expect(accepted.body).toMatchObject({ reviewState: 'accepted', reviewedBy: { id: editor.user.id } });
    expect(accepted.body.reviewedAt).toBeTruthy();
    expect(
      (await tester.agent.post(`/api/runs/${run.id}/review`).send({ decision: 'accept', reason: 'x' })).status,
    ).toBe(403);
    const noReason = await editor.agent.post(`/api/runs/${run.id}/review`).send({ decision: 'send-back' });
    expect(noReason.status).toBe(422);
  });

  it('when a run is submitted on a cell still in the queue, then the cell is running and may be marked recorded', async () => {
    const { tester, editor, cellId, roundupId } = await setUp();
    const cellOf = async () =>
      (await matrixOf(tester.agent, roundupId)).rows.flatMap((row) => row.cells).find((cell) => cell.id === cellId);
    expect(await cellOf()).toMatchObject({ state: 'assigned', runCount: 0, actions: ['start'] });
    await recordManualRun(tester.agent, cellId);
    expect(await cellOf()).toMatchObject({ state: 'running', runCount: 1, actions: ['pause', 'record'] });
    const recorded = await tester.agent
      .post(`/api/roundups/${roundupId}/cells/${cellId}/transitions`)
      .send({ action: 'record' });
    expect(recorded.status, recorded.text).toBe(200);
    expect(recorded.body.state).toBe('recorded');
    const history = await editor.agent.get(`/api/roundups/${roundupId}/history`);
    expect(JSON.stringify(history.body)).toMatch(/"byRunId":\d+/);
  });

  it('the editor marks the run of record; the results matrix shows its figures and verdict', async () => {
    const { tester, editor, cellId, roundupId } = await setUp();
    const first = await recordManualRun(tester.agent, cellId, 70.0);
    const second = await recordManualRun(tester.agent, cellId, 84.0);
    const marked = await editor.agent.post(`/api/runs/${first.id}/run-of-record`);
    expect(marked.status, marked.text).toBe(200);
    expect(marked.body.isRunOfRecord).toBe(true);
    const results = await editor.agent.get(`/api/roundups/${roundupId}/results`);
    const cell = results.body.cells.find((c: { cellId: number }) => c.cellId === cellId);
    expect(cell).toMatchObject({ runId: first.id, isRunOfRecord: true, runCount: 2, source: 'manual', peakC: 70 });
    // Rubric defaults: below 80 °C comfortable (common practice, no source — REFERENCES.md).
    expect(cell.verdict).toBe('comfortable');
    void second;
  });

  it('when the editor changes the rubric, then every verdict follows', async () => {
    const { tester, editor, cellId, roundupId } = await setUp();
    const run = await recordManualRun(tester.agent, cellId, 75.0);
    await editor.agent.post(`/api/runs/${run.id}/run-of-record`);
    const before = await editor.agent.get(`/api/roundups/${roundupId}/results`);
    expect(before.body.cells[0].verdict).toBe('comfortable');
    const stricter = await editor.agent
      .put(`/api/roundups/${roundupId}/rubric`)
      .send({ rubric: { comfortableBelowC: 70, warmUpToC: 90 } });
    expect(stricter.status, stricter.text).toBe(200);
    expect(stricter.body.rubricIsDefault).toBe(false);
    expect(stricter.body.cells[0].verdict).toBe('warm');
  });

  it('runs on the same firmware give the mean and its 95 % interval; another firmware is shown with the difference', async () => {
    const { tester, editor, cellId } = await setUp();
    await recordManualRun(tester.agent, cellId, 70.0);
    await recordManualRun(tester.agent, cellId, 72.0);
    const retest = await tester.agent.post(`/api/cells/${cellId}/manual-runs`).send({
      firmwareVersion: 'F1.3',
      startedAt: new Date().toISOString(),
      manualPeakC: 66.0,
      manualAmbientC: 21.0,
      outsideBookingReason: 'Retest after the firmware update, before a booking existed.',
    });
    expect(retest.status, retest.text).toBe(201);
    const runs = (await editor.agent.get(`/api/cells/${cellId}/runs`)).body;
    const [f10, f13] = runs.byFirmware;
    // Mean 71.0, s = √2; ν = 1: t(0.975, 1) = 12.706 (NIST/SEMATECH e-Handbook §1.3.6.7.2, REFERENCES.md), so the
    // half-width is 12.706 · √2 / √2 = 12.706 °C.
    expect(f10).toMatchObject({ firmwareVersion: 'F1.0', runs: 2, meanPeakC: 71 });
    expect(f10.ciLowC).toBeCloseTo(71 - 12.706, 2);
    expect(f10.ciHighC).toBeCloseTo(71 + 12.706, 2);
    expect(f13).toMatchObject({ firmwareVersion: 'F1.3', runs: 1, ciLowC: null, differenceFromFirstC: -5 });
  });

  it('every run shows the VRM electrical load of its configuration on the board’s power design', async () => {
    const { tester, cellId } = await setUp();
    const run = await recordManualRun(tester.agent, cellId);
    const detail = await tester.agent.get(`/api/runs/${run.id}`);
    // Hand calculation (first principles, I = P / V): 230 W / 1.25 V = 184 A; 8 controller phases doubled = 16
    // phases, one 60 A stage each: 184 / 16 = 11.5 A per phase and per stage, 11.5 / 60 = 19.17 % of the rating.
    expect(detail.body.vrmLoad).toMatchObject({ coreCurrentA: 184, effectivePhases: 16, totalStages: 16 });
    expect(detail.body.vrmLoad.currentPerPhaseA).toBeCloseTo(11.5, 6);
    expect(detail.body.vrmLoad.currentPerStageA).toBeCloseTo(11.5, 6);
    expect(detail.body.vrmLoad.stageLoadPercent).toBeCloseTo(19.1667, 3);
    expect(detail.body.vrmLoad.assumption).toMatch(/upper bound/);
  });
  it('when a logger file is over the size limit, then 413 and nothing is stored', async () => {
    const { tester, cellId, startedAt } = await setUp();
    const before = existsSync(testUploadsDir) ? readdirSync(testUploadsDir, { recursive: true }).length : 0;
    const huge = Buffer.alloc(25 * 1024 * 1024 + 1, 0x31);
    const response = await uploadRun(tester.agent, cellId, huge, { firmwareVersion: 'F1.2', startedAt, mapping });
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBeTruthy();
    const after = existsSync(testUploadsDir) ? readdirSync(testUploadsDir, { recursive: true }).length : 0;
    expect(after).toBe(before);
    const ds = await testDataSource();
    expect(await ds.getRepository(TestRunEntity).countBy({ matrixCellId: cellId })).toBe(0);
  });
});
