import { describe, expect, it } from 'vitest';
import { fitFirstOrderRise } from '../../../shared/domain/analysis/first-order-rise-fit';
import { seededGaussian } from '../../../shared/generators/seeded-random';

function rise(startC: number, riseC: number, tauS: number, durationS: number, sampleHz: number, noiseC = 0, seed = 1) {
  const gaussian = seededGaussian(seed);
  const count = durationS * sampleHz;
  const timeS = Float64Array.from({ length: count }, (_, i) => i / sampleHz);
  const valuesC = timeS.map((t) => startC + riseC * (1 - Math.exp(-t / tauS)) + noiseC * gaussian());
  return { timeS, valuesC };
}

describe('first-order rise T(t) = T₀ + ΔT∞·(1 − e^(−t/τ)) fitted by Levenberg–Marquardt', () => {
  it.each([
    [30, 45, 420, 3600, 1],
    [25, 60, 900, 3600, 10],
    [40, 35, 150, 1800, 2],
    [22, 50, 1500, 3600, 1],
  ])(
    'recovers T₀ = %s °C, ΔT∞ = %s °C, τ = %s s from a noise-free rise (first principles)',
    (startC, riseC, tauS, durationS, sampleHz) => {
      const { timeS, valuesC } = rise(startC, riseC, tauS, durationS, sampleHz);
      const fit = fitFirstOrderRise(timeS, valuesC);
      expect(fit).not.toBeNull();
      // The fit runs on equal-width bin means. The mean of an exponential over a bin is the same exponential scaled by a
      // constant, so τ and T₀ + ΔT∞ come out exact while T₀ and ΔT∞ trade a few hundredths of a degree.
      expect(fit!.tauS).toBeCloseTo(tauS, 3);
      expect(fit!.startC + fit!.riseC).toBeCloseTo(startC + riseC, 6);
      expect(Math.abs(fit!.startC - startC)).toBeLessThan(0.05);
      expect(fit!.rmsResidualC).toBeLessThan(1e-6);
    },
  );

  it.each([1, 2, 3, 4, 5])(
    'recovers a noisy rise (σ = 0.5 °C, seed %s) within 3 % of τ and 0.2 °C of the steady state (Benchwire tolerance)',
    (seed) => {
      const { timeS, valuesC } = rise(30, 45, 420, 3600, 10, 0.5, seed);
      const fit = fitFirstOrderRise(timeS, valuesC)!;
      expect(Math.abs(fit.tauS - 420) / 420).toBeLessThan(0.03);
      expect(Math.abs(fit.startC + fit.riseC - 75)).toBeLessThan(0.2);
      expect(fit.rmsResidualC).toBeLessThan(0.1);
    },
  );

  it('predicts the plateau from a soak cut short at 2 τ (σ = 0.3 °C, within 1 °C)', () => {
    const { timeS, valuesC } = rise(28, 50, 900, 1800, 1, 0.3, 9);
    const fit = fitFirstOrderRise(timeS, valuesC)!;
    expect(Math.abs(fit.startC + fit.riseC - 78)).toBeLessThan(1);
    expect(Math.abs(fit.tauS - 900) / 900).toBeLessThan(0.1);
  });

  it('skips gaps and needs at least eight points', () => {
    const { timeS, valuesC } = rise(30, 45, 420, 3600, 1);
    valuesC.fill(Number.NaN, 1000, 1200);
    expect(fitFirstOrderRise(timeS, valuesC)!.tauS).toBeCloseTo(420, 1);
    expect(fitFirstOrderRise(timeS.subarray(0, 5), valuesC.subarray(0, 5))).toBeNull();
  });
});
