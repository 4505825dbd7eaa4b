import { describe, expect, it } from 'vitest';
import { movingMedian } from '../../../shared/domain/analysis/moving-median';

const series = (...values: number[]) => Float64Array.from(values);

describe('spike rejection with a centred moving median (first principles)', () => {
  it('removes a single-sample spike and keeps a steady signal', () => {
    expect(Array.from(movingMedian(series(50, 50, 50, 95, 50, 50, 50), 5))).toEqual([50, 50, 50, 50, 50, 50, 50]);
  });

  it('removes a two-sample spike with the 5-sample window, not with 3', () => {
    const twoSpikes = series(50, 50, 50, 95, 95, 50, 50, 50);
    expect(movingMedian(twoSpikes, 5)[3]).toBe(50);
    expect(movingMedian(twoSpikes, 3)[3]).toBe(95);
  });

  it('passes a linear rise unchanged away from the ends', () => {
    const ramp = series(1, 2, 3, 4, 5, 6, 7);
    expect(Array.from(movingMedian(ramp, 5))).toEqual([2, 2.5, 3, 4, 5, 5.5, 6]);
  });

  it('skips gaps and leaves a gap only where the whole window is empty', () => {
    const gappy = series(50, Number.NaN, 52, Number.NaN, Number.NaN, Number.NaN, Number.NaN, Number.NaN, 60);
    const filtered = movingMedian(gappy, 5);
    expect(filtered[1]).toBe(51);
    expect(filtered[5]).toBeNaN();
    expect(filtered[8]).toBe(60);
  });
});
