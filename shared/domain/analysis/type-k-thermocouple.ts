/**
 * Type K thermocouple reference functions, ITS-90, as published in NIST SRD 60 (which reproduces NIST Monograph 175,
 * Burns et al. 1993). E in mV, t in °C, reference junction at 0 °C.
 */

const forwardBelowZero = [
  0, 3.9450128025e-2, 2.3622373598e-5, -3.2858906784e-7, -4.9904828777e-9, -6.7509059173e-11, -5.7410327428e-13,
  -3.1088872894e-15, -1.0451609365e-17, -1.9889266878e-20, -1.6322697486e-23,
];
const forwardAboveZero = [
  -1.7600413686e-2, 3.8921204975e-2, 1.8558770032e-5, -9.9457592874e-8, 3.1840945719e-10, -5.6072844889e-13,
  5.6075059059e-16, -3.2020720003e-19, 9.7151147152e-23, -1.2104721275e-26,
];
const exponentialA0 = 1.185976e-1;
const exponentialA1 = -1.183432e-4;
const exponentialA2 = 1.269686e2;

const inverseBelowZero = [
  0, 2.5173462e1, -1.1662878, -1.0833638, -8.977354e-1, -3.7342377e-1, -8.6632643e-2, -1.0450598e-2, -5.1920577e-4,
];
const inverseZeroTo500 = [
  0, 2.508355e1, 7.860106e-2, -2.503131e-1, 8.31527e-2, -1.228034e-2, 9.804036e-4, -4.41303e-5, 1.057734e-6,
  -1.052755e-8,
];
const inverse500To1372 = [-1.318058e2, 4.830222e1, -1.646031, 5.464731e-2, -9.650715e-4, 8.802193e-6, -3.11081e-8];

/** Range of the forward function E(t). */
export const typeKForwardRangeC = { min: -270, max: 1372 } as const;
/** Range of the inverse t(E): −200…1372 °C. The ends are the table's rounded values. */
export const typeKInverseRangeMv = { min: -5.891, max: 54.886 } as const;
/** NIST's table is rounded to 0.001 mV, so the inverse accepts half a digit beyond its rounded ends. */
const inverseEdgeAllowanceMv = 0.0005;
const inverseBreakAt500Mv = 20.644;

export class ThermocoupleRangeError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ThermocoupleRangeError';
  }
}

function polynomial(coefficients: readonly number[], x: number): number {
  let sum = 0;
  for (let i = coefficients.length - 1; i >= 0; i--) sum = sum * x + coefficients[i];
  return sum;
}

/** E(t): thermoelectric voltage in mV of a type K thermocouple at `celsius` with its reference junction at 0 °C. */
export function typeKMillivoltsFromCelsius(celsius: number): number {
  if (!Number.isFinite(celsius) || celsius < typeKForwardRangeC.min || celsius > typeKForwardRangeC.max) {
    throw new ThermocoupleRangeError(
      `${celsius} °C is outside the type K reference function (${typeKForwardRangeC.min}…${typeKForwardRangeC.max} °C).`,
    );
  }
  if (celsius < 0) return polynomial(forwardBelowZero, celsius);
  const offset = celsius - exponentialA2;
  return polynomial(forwardAboveZero, celsius) + exponentialA0 * Math.exp(exponentialA1 * offset * offset);
}

/** t(E): temperature in °C for a type K voltage in mV (reference junction at 0 °C), NIST's piecewise inverse. */
export function typeKCelsiusFromMillivolts(millivolts: number): number {
  if (
    !Number.isFinite(millivolts) ||
    millivolts < typeKInverseRangeMv.min - inverseEdgeAllowanceMv ||
    millivolts > typeKInverseRangeMv.max + inverseEdgeAllowanceMv
  ) {
    throw new ThermocoupleRangeError(
      `${millivolts} mV is outside the type K inverse function (${typeKInverseRangeMv.min}…${typeKInverseRangeMv.max} mV, −200…1372 °C).`,
    );
  }
  if (millivolts < 0) return polynomial(inverseBelowZero, millivolts);
  if (millivolts < inverseBreakAt500Mv) return polynomial(inverseZeroTo500, millivolts);
  return polynomial(inverse500To1372, millivolts);
}

/**
 * Cold-junction compensation, the standard method of thermocouple instrumentation: the logger measures the voltage
 * between the hot junction and its terminals at T_cj, so E_total = E_measured + E(T_cj) and T = t(E_total).
 */
export function typeKCelsiusWithColdJunction(measuredMillivolts: number, coldJunctionC: number): number {
  const totalMillivolts = measuredMillivolts + typeKMillivoltsFromCelsius(coldJunctionC);
  try {
    return typeKCelsiusFromMillivolts(totalMillivolts);
  } catch (error) {
    if (!(error instanceof ThermocoupleRangeError)) throw error;
    throw new ThermocoupleRangeError(
      `${measuredMillivolts} mV with the cold junction at ${coldJunctionC} °C is ${totalMillivolts.toFixed(3)} mV, outside the type K inverse function (${typeKInverseRangeMv.min}…${typeKInverseRangeMv.max} mV, −200…1372 °C).`,
    );
  }
}

/** The voltage a logger with its terminals at `coldJunctionC` reads for a hot junction at `celsius`. */
export function typeKMeasuredMillivolts(celsius: number, coldJunctionC: number): number {
  return typeKMillivoltsFromCelsius(celsius) - typeKMillivoltsFromCelsius(coldJunctionC);
}
