import { describe, expect, it } from 'vitest';
import { analyseLog, previewLog } from '../../../shared/domain/analysis/analyse-log';
import { qaFlagLabels } from '../../../shared/domain/analysis/qa-flag-labels';
import { syntheticLoggerLog } from '../../../shared/generators/synthetic-logger-log';
import { qaFlagCodes, type AnalysisRequestInput } from '../../../shared/schemas/analysis';
import { deadThirdProbeSpec } from '../../support/soak-logs';

const mapping = {
  vrm: ['VRM 1 [°C]', 'VRM 2 [°C]', 'VRM 3 [°C]'],
  ambient: 'Ambient [°C]',
  clock: 'CPU clock [MHz]',
};

function analyse(text: string, request: AnalysisRequestInput) {
  const outcome = analyseLog(text, request);
  if (!outcome.ok) throw new Error(JSON.stringify(outcome.errors));
  return outcome.analysis;
}

describe('a dead probe', () => {
  const text = syntheticLoggerLog(deadThirdProbeSpec());

  it('when one VRM channel of three has no reading at all, then the verdict is withheld until the tester acts', () => {
    const analysis = analyse(text, { mapping });
    expect(analysis.channels[2]).toMatchObject({ column: 'VRM 3 [°C]', dead: true, peakC: null });
    expect(analysis.flags).toMatchObject([
      { code: 'probe-dead', label: 'Dead probe', severity: 'warning', channel: 'VRM 3 [°C]' },
    ]);
    expect(analysis.verdict).toMatchObject({ status: 'withheld', code: null, label: 'No verdict yet' });
    expect(analysis.verdict.rule).toContain('VRM 3 [°C] has no reading at all');
    expect(analysis.verdict.concerns).toEqual([{ code: 'probe-dead', label: 'Dead probe', effect: 'withholds' }]);
    // The dead probe is no dropout and does not make the run unsettled.
    expect(analysis.dropouts).toEqual([]);
    expect(analysis.reachedSteadyState).toBe(true);
  });

  it('when the tester confirms it as dead, then the run is judged without it and the flag says so', () => {
    const analysis = analyse(text, { mapping, options: { confirmedDeadProbes: ['vrm 3 [°c]'] } });
    expect(analysis.flags).toMatchObject([{ code: 'probe-dead', severity: 'info' }]);
    expect(analysis.verdict).toMatchObject({ status: 'final', code: 'comfortable' });
  });

  it('when the tester unmaps it, then nothing is flagged', () => {
    const analysis = analyse(text, { mapping: { ...mapping, vrm: ['VRM 1 [°C]', 'VRM 2 [°C]'] } });
    expect(analysis.flags).toEqual([]);
    expect(analysis.verdict.status).toBe('final');
  });
});

describe('QA flags in words', () => {
  it('every flag code has a label for people, and no label is a code', () => {
    for (const code of qaFlagCodes) {
      expect(qaFlagLabels[code]).toMatch(/^[A-Z][a-z]/);
      expect(qaFlagLabels[code]).not.toContain('-');
    }
  });
});

/** 2 Hz with whole-second clock stamps, as some loggers write: two rows per stamp. */
function twiceASecond(rows: number, firstStampRows = 2): string {
  const lines = ['Time,VRM 1 [°C]'];
  for (let i = 0; i < rows; i++) {
    const second = Math.floor((i + 2 - firstStampRows) / 2);
    const stamp = `12:${String(Math.floor(second / 60)).padStart(2, '0')}:${String(second % 60).padStart(2, '0')}`;
    lines.push(`${stamp},${(40 + i * 0.01).toFixed(2)}`);
  }
  return `${lines.join('\n')}\n`;
}

describe('repeated whole-second stamps', () => {
  it('when a logger writes twice a second with whole-second stamps, then the rows are spread 0.5 s apart and the read summary says so', () => {
    const analysis = analyse(twiceASecond(600), { mapping: { vrm: ['VRM 1 [°C]'] }, options: { soakMinutes: 5 } });
    expect(analysis.sampleIntervalS).toBe(0.5);
    expect(analysis.sampleRateHz).toBe(2);
    expect(analysis.sampleCount).toBe(600);
    expect(analysis.gaps).toEqual([]);
    // 600 rows at 2 Hz from 12:00:00: the last is the second row of 12:04:59, at 299.5 s.
    expect(analysis.loggedS).toBe(299.5);
    expect(analysis.readNotes).toEqual([
      'The time stamps repeat: about 2 rows share each stamp 1\u2009s apart, so Benchwire spread them evenly within each 1\u2009s step (every 0.50\u2009s).',
    ]);
  });

  it('before any analysis, the read panel (the preview) already says the stamps repeat and will be spread', () => {
    const previewed = previewLog(twiceASecond(600));
    expect(previewed.ok).toBe(true);
    if (previewed.ok) {
      expect(previewed.preview.timeNote).toBe(
        'The time stamps repeat: about 2 rows share each stamp 1\u2009s apart, so the analysis spreads them evenly within each 1\u2009s step (every 0.50\u2009s).',
      );
    }
    const plain = previewLog('Time,VRM 1\n0,50\n1,51\n2,52\n');
    expect(plain.ok && plain.preview.timeNote).toBeNull();
  });

  it('when the logger started mid-second (one row on the first stamp), then that row sits at the end of its second', () => {
    const analysis = analyse(twiceASecond(601, 1), { mapping: { vrm: ['VRM 1 [°C]'] }, options: { soakMinutes: 5 } });
    expect(analysis.gaps).toEqual([]);
    expect(analysis.sampleIntervalS).toBe(0.5);
    expect(analysis.loggedS).toBe(300);
  });

  it('when one row repeats in a log that otherwise does not, then it is refused as before; times that go back are refused', () => {
    const repeated = analyseLog('Time,VRM 1\n0,50\n1,51\n1,52\n2,53\n3,54\n', { mapping: { vrm: ['VRM 1'] } });
    expect(repeated.ok).toBe(false);
    if (!repeated.ok) {
      expect(repeated.errors[0]).toMatchObject({ row: 4, column: 'Time', code: 'non-monotonic-time' });
      expect(repeated.errors[0].message).toContain('repeats the time of the row before (row 3)');
    }
    const backwards = analyseLog('Time,VRM 1\n12:00:00,50\n12:00:00,51\n12:00:01,52\n12:00:00,53\n', {
      mapping: { vrm: ['VRM 1'] },
    });
    expect(backwards.ok).toBe(false);
    if (!backwards.ok) expect(backwards.errors[0]).toMatchObject({ row: 5, code: 'non-monotonic-time' });
  });
});
