import { describe, expect, it } from 'vitest';
import { formatCelsius, formatDuration } from '../../../shared/domain/analysis/run-time-format';
import { seededGaussian, seededRandom } from '../../../shared/generators/seeded-random';
import { syntheticLoggerLog, syntheticProbeC } from '../../../shared/generators/synthetic-logger-log';

describe('seeded noise and synthetic logs for tests, the benchmark and demo data', () => {
  it('repeats the same numbers for the same seed and differs across seeds', () => {
    const first = seededRandom(42);
    const again = seededRandom(42);
    const other = seededRandom(43);
    const a = [first(), first(), first()];
    expect([again(), again(), again()]).toEqual(a);
    expect(other()).not.toBe(a[0]);
    expect(a.every((value) => value >= 0 && value < 1)).toBe(true);
  });

  it('draws standard normal noise (mean ≈ 0, σ ≈ 1 over 20,000 draws)', () => {
    const gaussian = seededGaussian(5);
    const draws = Array.from({ length: 20_000 }, gaussian);
    const mean = draws.reduce((sum, value) => sum + value, 0) / draws.length;
    const variance = draws.reduce((sum, value) => sum + (value - mean) ** 2, 0) / (draws.length - 1);
    expect(Math.abs(mean)).toBeLessThan(0.03);
    expect(Math.abs(Math.sqrt(variance) - 1)).toBeLessThan(0.03);
  });

  it('follows the first-order rise from the load start (first principles: 63.2 % of the rise after one τ)', () => {
    const probe = { name: 'VRM 1', startC: 30, riseC: 50, tauS: 300 };
    expect(syntheticProbeC(probe, 60, 120)).toBe(30);
    expect(syntheticProbeC(probe, 420, 120)).toBeCloseTo(30 + 50 * 0.632121, 4);
  });

  it('writes the header, the preamble and one row per sample', () => {
    const text = syntheticLoggerLog({
      durationS: 3,
      sampleHz: 1,
      preamble: ['Benchwire'],
      probes: [{ name: 'VRM 1', startC: 40, riseC: 0, tauS: 1 }],
    });
    expect(text).toBe('Benchwire\nTime [s],VRM 1 [°C]\n0,40.00\n1,40.00\n2,40.00\n');
  });

  it('prints durations and temperatures the Benchwire way (one duration format for every analysis screen and line)', () => {
    expect(formatDuration(59.6)).toBe('1\u2009min');
    expect(formatDuration(1000)).toBe('16\u2009min 40\u2009s');
    expect(formatDuration(3600)).toBe('60\u2009min');
    expect(formatDuration(3725)).toBe('62\u2009min 5\u2009s');
    expect(formatDuration(45)).toBe('45\u2009s');
    expect(formatDuration(0.05)).toBe('0.050\u2009s');
    expect(formatDuration(2.5)).toBe('2.5\u2009s');
    expect(formatCelsius(79.04)).toBe('79.0\u2009°C');
  });
});
