import { describe, expect, it } from 'vitest';
import { analyseLog, previewLog } from '../../../shared/domain/analysis/analyse-log';
import { syntheticLoggerLog } from '../../../shared/generators/synthetic-logger-log';
import {
  analysisPreviewFailureSchema,
  analysisPreviewResponseSchema,
  analysisRequestSchema,
  logPreviewSchema,
} from '../../../shared/schemas/analysis';

const text = syntheticLoggerLog({
  durationS: 120,
  sampleHz: 1,
  delimiter: ';',
  decimalComma: true,
  time: 'clock',
  preamble: ['Benchwire bench logger', 'Interval;1;s'],
  probes: [
    { name: 'VRM 1', startC: 40, riseC: 10, tauS: 60 },
    { name: 'VRM 2', startC: 40, riseC: 8, tauS: 60 },
  ],
  ambient: { name: 'Ambient', startC: 21 },
  power: { name: 'Package power [W]', watts: 180 },
});

describe('the preview a tester sees before confirming the mapping', () => {
  it('shows delimiter, decimal separator, preamble, header, columns with guessed roles and units, and the first rows', () => {
    const outcome = previewLog(text);
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    const { preview } = outcome;
    expect(logPreviewSchema.safeParse(preview).success).toBe(true);
    expect(preview).toMatchObject({
      delimiter: ';',
      decimalSeparator: ',',
      preambleLines: ['Benchwire bench logger', 'Interval;1;s'],
      headerRow: 3,
      timeColumn: 'Time',
      timeFormat: 'clock',
      dataRowCount: 120,
    });
    expect(preview.rows).toHaveLength(20);
    expect(preview.rows[0][0]).toBe('00:00:00');
    expect(preview.columns.map((column) => [column.name, column.guessedRole, column.guessedUnit])).toEqual([
      ['Time', 'time', null],
      ['VRM 1 [°C]', 'vrm', 'C'],
      ['VRM 2 [°C]', 'vrm', 'C'],
      ['Ambient [°C]', 'ambient', 'C'],
      ['Package power [W]', 'power', null],
    ]);
    expect(preview.guessedMapping).toEqual({
      time: 'Time',
      vrm: ['VRM 1 [°C]', 'VRM 2 [°C]'],
      ambient: 'Ambient [°C]',
      clock: null,
      power: 'Package power [W]',
    });
  });
});

describe('analyseLog, the function behind POST /api/log-check/analyse', () => {
  it('answers a confirmed mapping with the 200 document', () => {
    const request = analysisRequestSchema.parse({
      mapping: { vrm: ['VRM 1 [°C]', 'VRM 2 [°C]'], ambient: 'Ambient [°C]', power: 'Package power [W]' },
      options: { soakMinutes: 2, steadyWindowMinutes: 1 },
    });
    const outcome = analyseLog(text, request);
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    expect(
      analysisPreviewResponseSchema.safeParse({ preview: outcome.preview, analysis: outcome.analysis }).success,
    ).toBe(true);
    expect(outcome.analysis.flags.map((flag) => flag.code)).not.toContain('mapping-guessed');
  });

  it('answers a bad file with the 422 document: the preview when it exists and every error', () => {
    const outcome = analyseLog('Time;VRM 1\n0;50\n1;oops\n', { mapping: { vrm: ['VRM 1'] } });
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(analysisPreviewFailureSchema.safeParse({ preview: outcome.preview, errors: outcome.errors }).success).toBe(
      true,
    );
    expect(outcome.preview?.columns).toHaveLength(2);
    expect(outcome.errors).toEqual([expect.objectContaining({ row: 3, column: 'VRM 1', code: 'not-a-number' })]);
  });

  it('fills every option with its default when the request leaves them out', () => {
    expect(analysisRequestSchema.parse({}).options).toMatchObject({
      soakMinutes: 60,
      steadyWindowMinutes: 10,
      steadyRiseLimitC: 1,
      spikeWindowSamples: 5,
      ambientTargetC: 21,
      referenceRoomC: 21,
      throttleFraction: 0.85,
      throttleMinSeconds: 10,
      toleranceClass: 'iec-60584-1-class-2',
      useNormalizedPeak: false,
      rubric: { comfortableBelowC: 80, warmUpToC: 100 },
    });
    expect(analysisRequestSchema.safeParse({ options: { spikeWindowSamples: 4 } }).success).toBe(false);
  });
});
