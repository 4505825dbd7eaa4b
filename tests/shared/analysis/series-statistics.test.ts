import { describe, expect, it } from 'vitest';
import {
  indexAtOrAfter,
  linearSlope,
  medianOfSeries,
  summarizeSeries,
} from '../../../shared/domain/analysis/series-statistics';

describe('series summaries that skip gaps (first principles)', () => {
  it('summarises mean, min and max without the gaps', () => {
    expect(summarizeSeries([1, Number.NaN, 3, 8])).toEqual({ count: 3, mean: 4, min: 1, max: 8 });
    expect(summarizeSeries([Number.NaN]).count).toBe(0);
  });

  it('takes the median of odd and even counts, and of a window', () => {
    expect(medianOfSeries([5, 1, 3])).toBe(3);
    expect(medianOfSeries([4, 1, 3, 2])).toBe(2.5);
    expect(medianOfSeries([9, 9, 1, 2, 3], 2)).toBe(2);
    expect(medianOfSeries([Number.NaN, 7, Number.NaN])).toBe(7);
    expect(medianOfSeries([])).toBeNaN();
  });

  it('agrees with sorting on random data with ties', () => {
    let seed = 3;
    for (let trial = 0; trial < 200; trial++) {
      const values = Array.from({ length: 1 + (trial % 40) }, () => (seed = (seed * 16807) % 2147483647) % 7);
      const sorted = [...values].sort((a, b) => a - b);
      const middle = sorted.length >> 1;
      const expected = sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
      expect(medianOfSeries(values)).toBe(expected);
    }
  });

  it('finds the first sample at or after a time', () => {
    expect(indexAtOrAfter([0, 1, 2, 3], 1.5)).toBe(2);
    expect(indexAtOrAfter([0, 1, 2, 3], 2)).toBe(2);
    expect(indexAtOrAfter([0, 1, 2, 3], 9)).toBe(4);
  });

  it('fits the least-squares slope of a line exactly', () => {
    expect(linearSlope([0, 1, 2, 3], [10, 12, 14, 16])).toBeCloseTo(2, 12);
    expect(linearSlope([0, 1, 2, 3], [10, Number.NaN, 14, 16])).toBeCloseTo(2, 12);
    expect(linearSlope([0], [1])).toBeNaN();
  });
});
