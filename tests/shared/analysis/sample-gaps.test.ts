import { describe, expect, it } from 'vitest';
import { findDropouts, findTimeGaps, nominalSampleInterval } from '../../../shared/domain/analysis/sample-gaps';

describe('gaps in a log', () => {
  it('takes the nominal interval as the median step, so gaps do not move it', () => {
    expect(nominalSampleInterval(Float64Array.from([0, 0.1, 0.2, 0.3, 5, 5.1]))).toBeCloseTo(0.1, 12);
  });

  it('finds missing samples in the time column (first principles: a 5 s step at 1 s holds 4 missing samples)', () => {
    expect(findTimeGaps(Float64Array.from([0, 1, 2, 7, 8]), 1)).toEqual([{ startS: 2, endS: 7, missingSamples: 4 }]);
    expect(findTimeGaps(Float64Array.from([0, 1, 2.4, 3.4]), 1)).toEqual([]);
  });

  it('finds probe dropouts as runs of gap samples', () => {
    const values = Float64Array.from([50, Number.NaN, Number.NaN, 51, Number.NaN]);
    expect(findDropouts('VRM 1', Float64Array.from([0, 1, 2, 3, 4]), values)).toEqual([
      { channel: 'VRM 1', startS: 1, endS: 2, samples: 2 },
      { channel: 'VRM 1', startS: 4, endS: 4, samples: 1 },
    ]);
  });
});
