import { describe, expect, it } from 'vitest';
import { celsiusFrom, celsiusTo } from '../../../shared/domain/analysis/temperature-units';

describe('temperature units (ITS-90 definitions: K = °C + 273.15; °F = °C × 9/5 + 32)', () => {
  it.each([
    [212, 'F', 100],
    [32, 'F', 0],
    [-40, 'F', -40],
    [373.15, 'K', 100],
    [273.15, 'K', 0],
    [85.5, 'C', 85.5],
  ] as const)('%s %s is %s °C (first principles)', (value, unit, celsius) => {
    expect(celsiusFrom(value, unit)).toBeCloseTo(celsius, 10);
    expect(celsiusTo(celsius, unit)).toBeCloseTo(value, 10);
  });
});
