import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  ThermocoupleRangeError,
  typeKCelsiusFromMillivolts,
  typeKCelsiusWithColdJunction,
  typeKMeasuredMillivolts,
  typeKMillivoltsFromCelsius,
} from '../../../shared/domain/analysis/type-k-thermocouple';

// NIST SRD 60 / NIST Monograph 175, ITS-90 type K table (°C → mV, 3 decimals), as listed in REFERENCES.md.
const nistTypeKTable: [celsius: number, millivolts: number][] = [
  [-200, -5.891],
  [-100, -3.554],
  [0, 0.0],
  [20, 0.798],
  [50, 2.023],
  [100, 4.096],
  [150, 6.138],
  [200, 8.138],
  [300, 12.209],
  [400, 16.397],
  [500, 20.644],
  [600, 24.905],
  [800, 33.275],
  [1000, 41.276],
  [1200, 48.838],
  [1372, 54.886],
];
/** The table is rounded to 0.001 mV. */
const tableRoundingMv = 0.0005;

/**
 * NIST SRD 60 / Monograph 175 stated error of each inverse polynomial against the reference function, °C. The
 * figures are given to 0.01 °C, so half that digit is allowed on top (at −200 °C the inverse is off by 0.041 °C,
 * which NIST rounds to its stated +0.04).
 */
const inverseBands = [
  { fromC: -200, toC: 0, lowC: -0.02, highC: 0.04 },
  { fromC: 0, toC: 500, lowC: -0.05, highC: 0.04 },
  { fromC: 500, toC: 1372, lowC: -0.05, highC: 0.06 },
];
const statedFigureRoundingC = 0.005;

function inverseBandFor(celsius: number) {
  // The inverse branch is chosen by voltage; E(500 °C) = 20.644 mV is the break (NIST SRD 60).
  const millivolts = typeKMillivoltsFromCelsius(celsius);
  if (millivolts < 0) return inverseBands[0];
  return millivolts < 20.644 ? inverseBands[1] : inverseBands[2];
}

describe('type K reference function E(t), NIST SRD 60 / Monograph 175', () => {
  it.each(nistTypeKTable)('gives the NIST table value at %s °C within the table rounding', (celsius, millivolts) => {
    expect(Math.abs(typeKMillivoltsFromCelsius(celsius) - millivolts)).toBeLessThanOrEqual(tableRoundingMv);
  });

  it('is about 2×10⁻⁹ mV at 0 °C on the upper branch, not exactly 0 (REFERENCES.md note on NIST SRD 60)', () => {
    expect(Math.abs(typeKMillivoltsFromCelsius(0))).toBeLessThan(1e-8);
  });

  it('refuses temperatures outside −270…1372 °C with a clear error', () => {
    expect(() => typeKMillivoltsFromCelsius(1400)).toThrow(ThermocoupleRangeError);
    expect(() => typeKMillivoltsFromCelsius(-280)).toThrow(/outside the type K reference function/);
    expect(() => typeKMillivoltsFromCelsius(Number.NaN)).toThrow(ThermocoupleRangeError);
  });
});

describe('type K inverse t(E), NIST SRD 60 / Monograph 175 piecewise polynomials', () => {
  it.each(nistTypeKTable)(
    'reads the NIST table voltage for %s °C back within the stated error plus the table rounding',
    (celsius, millivolts) => {
      const band = inverseBandFor(celsius);
      // 0.0005 mV of table rounding is worth 0.0005 / (dE/dt) °C; dE/dt from the forward function.
      const seebeckMvPerC =
        (typeKMillivoltsFromCelsius(Math.min(celsius + 0.5, 1372)) -
          typeKMillivoltsFromCelsius(Math.max(celsius - 0.5, -200))) /
        (Math.min(celsius + 0.5, 1372) - Math.max(celsius - 0.5, -200));
      const allowance = tableRoundingMv / seebeckMvPerC + statedFigureRoundingC;
      const error = typeKCelsiusFromMillivolts(millivolts) - celsius;
      expect(error).toBeGreaterThanOrEqual(band.lowC - allowance);
      expect(error).toBeLessThanOrEqual(band.highC + allowance);
    },
  );

  it('returns t from E(t) within NIST’s stated inverse error anywhere in −200…1372 °C (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -200, max: 1372, noNaN: true }), (celsius) => {
        const band = inverseBandFor(celsius);
        const error = typeKCelsiusFromMillivolts(typeKMillivoltsFromCelsius(celsius)) - celsius;
        return error >= band.lowC - statedFigureRoundingC && error <= band.highC + statedFigureRoundingC;
      }),
      { numRuns: 5000 },
    );
  });

  it('accepts the rounded range ends −5.891 and 54.886 mV (NIST SRD 60)', () => {
    expect(typeKCelsiusFromMillivolts(-5.891)).toBeCloseTo(-200, 0);
    expect(typeKCelsiusFromMillivolts(54.886)).toBeCloseTo(1372, 0);
  });

  it('refuses voltages beyond the type K range with a clear error', () => {
    expect(() => typeKCelsiusFromMillivolts(60)).toThrow(ThermocoupleRangeError);
    expect(() => typeKCelsiusFromMillivolts(-6.2)).toThrow(/outside the type K inverse function/);
  });
});

describe('cold-junction compensation (E_total = E_measured + E(T_cj), the standard method)', () => {
  it('reads E(100) − E(25) with the junction at 25 °C as 100 °C (first principles, from the NIST table values)', () => {
    // NIST SRD 60 table: E(100 °C) = 4.096 mV, E(25 °C) = 1.000 mV (computed from the NIST coefficients: 1.0002 mV).
    const measured = typeKMillivoltsFromCelsius(100) - typeKMillivoltsFromCelsius(25);
    expect(measured).toBeCloseTo(3.096, 3);
    expect(typeKCelsiusWithColdJunction(measured, 25)).toBeCloseTo(100, 1);
  });

  it('reads the same 3.096 mV as about 75.9 °C when the junction is wrongly taken as 0 °C (first principles)', () => {
    // Computed from the NIST SRD 60 inverse: t(3.096 mV) = 75.88 °C.
    expect(typeKCelsiusWithColdJunction(3.096, 0)).toBeCloseTo(75.9, 1);
  });

  it('builds the logger reading for a hot junction and a cold junction (first principles)', () => {
    expect(typeKMeasuredMillivolts(80, 80)).toBeCloseTo(0, 12);
    expect(typeKCelsiusWithColdJunction(typeKMeasuredMillivolts(92.5, 23.4), 23.4)).toBeCloseTo(92.5, 1);
  });
});
