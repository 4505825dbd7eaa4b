import { describe, expect, it } from 'vitest';
import { repeatRunStatistics } from '../../../shared/domain/analysis/repeat-run-statistics';
import { studentTCritical } from '../../../shared/domain/analysis/student-t';

describe("Student's t critical values", () => {
  it.each([
    // NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.2, two-sided 95 % (upper 0.025 critical values).
    [1, 12.706],
    [2, 4.303],
    [3, 3.182],
    [4, 2.776],
    [5, 2.571],
    [10, 2.228],
    [30, 2.042],
  ])('ν = %s gives %s (NIST/SEMATECH e-Handbook t-table)', (degreesOfFreedom, tabulated) => {
    expect(Math.abs(studentTCritical(0.95, degreesOfFreedom) - tabulated)).toBeLessThanOrEqual(0.0005);
  });

  it('refuses nonsense levels and degrees of freedom', () => {
    expect(() => studentTCritical(1.2, 3)).toThrow(RangeError);
    expect(() => studentTCritical(0.95, 0)).toThrow(RangeError);
  });
});

describe('repeated runs of one cell', () => {
  it('gives mean, sample standard deviation and a 95 % interval (first principles, t from the NIST/SEMATECH table)', () => {
    // Peaks 80, 82, 84: mean 82; s = √((4 + 0 + 4) / 2) = 2; half-width = 4.303 × 2 / √3 = 4.969. The table rounds
    // t to 0.0005, worth 0.0005 × 2 / √3 = 0.0006 °C of half-width.
    const result = repeatRunStatistics([80, 82, 84]);
    const tableHalfWidth = (4.303 * 2) / Math.sqrt(3);
    expect(result.mean).toBe(82);
    expect(result.standardDeviation).toBeCloseTo(2, 12);
    expect(Math.abs(result.tCritical! - 4.303)).toBeLessThanOrEqual(0.0005);
    expect(Math.abs(result.halfWidth! - tableHalfWidth)).toBeLessThan(0.0006);
    expect(Math.abs(result.low! - (82 - tableHalfWidth))).toBeLessThan(0.0006);
    expect(Math.abs(result.high! - (82 + tableHalfWidth))).toBeLessThan(0.0006);
  });

  it('gives only the mean for a single run', () => {
    expect(repeatRunStatistics([79.5])).toMatchObject({
      runs: 1,
      mean: 79.5,
      standardDeviation: null,
      halfWidth: null,
    });
  });

  it('refuses an empty list or a missing value', () => {
    expect(() => repeatRunStatistics([])).toThrow(RangeError);
    expect(() => repeatRunStatistics([80, Number.NaN])).toThrow(RangeError);
  });
});
