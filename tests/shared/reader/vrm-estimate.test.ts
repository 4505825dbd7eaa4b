import { linearRegression } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { estimateVrmPeak, type EstimatePoint } from '../../../shared/domain/reader/vrm-estimate';

const point = (packagePowerW: number, deltaOverAmbientC: number, toleranceC: number | null = 2.5): EstimatePoint => ({
  packagePowerW,
  deltaOverAmbientC,
  toleranceC,
});

describe('reader estimate: will it cope?', () => {
  it('three points: least-squares line, prediction band and tolerance, worked by hand', () => {
    // Points (200 W, 40 °C), (250 W, 50 °C), (300 W, 62 °C), worked by hand:
    //   P̄ = 250, ΔT̄ = 152/3 = 50.6667; Sxx = 50² + 0 + 50² = 5000;
    //   Sxy = (−50)(−10.6667) + 0 + (50)(11.3333) = 1100; b = 1100/5000 = 0.22 °C/W; a = 50.6667 − 0.22·250 = −4.3333 °C.
    //   Fitted 39.6667, 50.6667, 61.6667; residuals 0.3333, −0.6667, 0.3333; SSE = 0.6667; s = √(0.6667/1) = 0.8165.
    //   At P₀ = 260 W: ΔT = −4.3333 + 57.2 = 52.8667 °C; with a 25 °C room the estimate is 77.8667 °C.
    //   SE(pred) = 0.8165·√(1 + 1/3 + 10²/5000) = 0.8165·1.16333 = 0.94985;
    //   t(0.975, ν=1) = 12.706 (NIST/SEMATECH e-Handbook §1.3.6.7.2) → 12.069 °C; plus the 2.5 °C tolerance → 14.569 °C.
    const estimate = estimateVrmPeak([point(200, 40), point(250, 50), point(300, 62)], {
      packagePowerW: 260,
      roomC: 25,
    });
    if (estimate.status !== 'estimated') throw new Error('expected an estimate');
    expect(estimate.slopeCPerW).toBeCloseTo(0.22, 10);
    expect(estimate.interceptC).toBeCloseTo(-4.3333, 4);
    expect(estimate.predictedDeltaC).toBeCloseTo(52.8667, 4);
    expect(estimate.estimateC).toBeCloseTo(77.8667, 4);
    expect(estimate.degreesOfFreedom).toBe(1);
    expect(estimate.tCritical).toBeCloseTo(12.706, 3);
    expect(estimate.statisticalBandC).toBeCloseTo(12.069, 2);
    expect(estimate.toleranceC).toBe(2.5);
    expect(estimate.bandC).toBeCloseTo(14.569, 2);
    expect(estimate.lowC).toBeCloseTo(77.8667 - 14.569, 2);
    expect(estimate.extrapolated).toBeNull();
    expect(estimate.testedRangeW).toEqual({ min: 200, max: 300 });
  });

  it('agrees with simple-statistics linearRegression on the line', () => {
    const points = [point(180, 37.1), point(232, 51.9), point(268.5, 60.0), point(312, 71.4)];
    const reference = linearRegression(points.map((p) => [p.packagePowerW, p.deltaOverAmbientC]));
    const estimate = estimateVrmPeak(points, { packagePowerW: 240, roomC: 21 });
    if (estimate.status !== 'estimated') throw new Error('expected an estimate');
    expect(estimate.slopeCPerW).toBeCloseTo(reference.m, 10);
    expect(estimate.interceptC).toBeCloseTo(reference.b, 10);
    // Four points: ν = 2, t(0.975, 2) = 4.303 (NIST/SEMATECH §1.3.6.7.2).
    expect(estimate.tCritical).toBeCloseTo(4.303, 3);
  });

  it('two points: the line passes through both, the band is the tolerance alone', () => {
    // (232 W, 51.92 °C) and (268.5 W, 60.02 °C): b = 8.10/36.5 = 0.221918 °C/W, a = 51.92 − 0.221918·232 = 0.43507 °C;
    // at 250 W: 0.43507 + 55.47945 = 55.91452 °C over the room (worked by hand).
    const estimate = estimateVrmPeak([point(232, 51.92, 2.5), point(268.5, 60.02, 2.2)], {
      packagePowerW: 250,
      roomC: 21,
    });
    if (estimate.status !== 'estimated') throw new Error('expected an estimate');
    expect(estimate.slopeCPerW).toBeCloseTo(0.221918, 6);
    expect(estimate.predictedDeltaC).toBeCloseTo(55.91452, 4);
    expect(estimate.estimateC).toBeCloseTo(76.91452, 4);
    expect(estimate.statisticalBandC).toBeNull();
    expect(estimate.bandC).toBe(2.5);
  });

  it('says when the asked power lies outside the tested range instead of quietly extrapolating', () => {
    const points = [point(200, 40), point(250, 50), point(300, 62)];
    const above = estimateVrmPeak(points, { packagePowerW: 350, roomC: 21 });
    const below = estimateVrmPeak(points, { packagePowerW: 120, roomC: 21 });
    expect(above.status === 'estimated' && above.extrapolated).toBe('above');
    expect(below.status === 'estimated' && below.extrapolated).toBe('below');
    // The band widens away from the tested centre: (350 − 250)² / 5000 = 2 adds under the root (by hand: √(1+1/3+2) = 1.826).
    if (above.status !== 'estimated') throw new Error('expected an estimate');
    expect(above.statisticalBandC).toBeCloseTo(12.706 * 0.8165 * Math.sqrt(1 + 1 / 3 + 2), 1);
  });

  it('gives no line from one point or from points at one power', () => {
    expect(estimateVrmPeak([point(232, 50)], { packagePowerW: 232, roomC: 21 })).toMatchObject({
      status: 'not-enough-points',
      pointCount: 1,
    });
    expect(estimateVrmPeak([point(232, 50), point(232, 52)], { packagePowerW: 232, roomC: 21 })).toMatchObject({
      status: 'not-enough-points',
      reason: expect.stringMatching(/same package power/),
    });
    expect(estimateVrmPeak([], { packagePowerW: 100, roomC: 21 }).status).toBe('not-enough-points');
  });
});
