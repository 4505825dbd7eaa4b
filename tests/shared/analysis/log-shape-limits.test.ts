import { describe, expect, it } from 'vitest';
import { analyseLog, previewLog } from '../../../shared/domain/analysis/analyse-log';
import { lineTooLong, tableTooLarge } from '../../../shared/domain/analysis/log-shape-limits';
import { syntheticLoggerLog } from '../../../shared/generators/synthetic-logger-log';
import { logAnalysisLimits } from '../../../shared/upload-limits';

// Small limits so the cases stay small; the counts below are counted by hand from the texts.
const limits = { maxLineChars: 20, maxColumns: 4, maxCells: 30 };

describe('logger files of an unreasonable shape are refused before they are read', () => {
  it('names the first line over the limit, with LF, CRLF and CR-only line ends', () => {
    const long = 'x'.repeat(21);
    expect(lineTooLong(`Time,VRM\n0,40\n${long}\n`, limits)).toMatchObject({ row: 3, code: 'line-too-long' });
    expect(lineTooLong(`Time,VRM\r\n${long}\r\n`, limits)).toMatchObject({ row: 2 });
    expect(lineTooLong(`Time,VRM\r0,40\r1,41\r${long}`, limits)).toMatchObject({ row: 4 });
    // Exactly 20 characters is within the limit.
    expect(lineTooLong('x'.repeat(20), limits)).toBeNull();
  });

  it('counts columns and cells against the limits', () => {
    expect(tableTooLarge(1, 5, 2, limits)).toMatchObject({ row: 1, code: 'too-many-columns' });
    // 4 columns × 8 rows = 32 cells > 30.
    expect(tableTooLarge(1, 4, 8, limits)).toMatchObject({ row: null, code: 'too-many-cells' });
    expect(tableTooLarge(1, 3, 10, limits)).toBeNull();
  });

  it('the pipeline answers with the limit as a parse error, and the preview is refused the same way', () => {
    const wide = ['Time,VRM 1,VRM 2,VRM 3,VRM 4', '0,1,2,3,4', '1,1,2,3,4', '2,1,2,3,4'].join('\n');
    const outcome = analyseLog(wide, {}, { limits: { ...limits, maxLineChars: 100 } });
    expect(outcome).toMatchObject({ ok: false, errors: [{ code: 'too-many-columns' }] });
    expect(previewLog(wide, { ...limits, maxLineChars: 100 })).toMatchObject({ ok: false });
  });

  it('a real soak log is well inside the shared limits: one hour at 10 Hz with eight channels', () => {
    const text = syntheticLoggerLog({
      durationS: 3600,
      sampleHz: 10,
      probes: [1, 2, 3, 4, 5].map((index) => ({ name: `VRM ${index}`, startC: 32, riseC: 45, tauS: 400 })),
      ambient: { name: 'Ambient', startC: 21 },
      clock: { name: 'CPU clock [MHz]', mhz: 4600 },
      power: { name: 'Package power [W]', watts: 210 },
    });
    const outcome = previewLog(text, logAnalysisLimits);
    expect(outcome.ok).toBe(true);
  });
});
