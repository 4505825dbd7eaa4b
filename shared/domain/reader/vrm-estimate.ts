import { studentTCritical } from '../analysis/student-t';

/**
 * The reader's "will it cope?" estimate: a board's VRM peak in the reader's room at the reader's CPU package power,
 * from the board's published runs.
 *
 * Model: the rise of the VRM over the room is close to proportional to the power the VRM delivers (a first-order
 * thermal resistance; first principles, and what the invented demo data assume too). We fit an ordinary
 * least-squares line ΔT = a + b·P through the board's measured points (P: the load configuration's package power,
 * ΔT: peak over ambient), and estimate peak = room + a + b·P₀.
 *
 * Uncertainty, added together on purpose (a conservative band rather than a root-sum-square):
 * - the 95 % prediction interval of a new observation from the regression, t(0.975, n − 2) · s · √(1 + 1/n +
 *   (P₀ − P̄)² / Sxx), with s² = SSE / (n − 2) (the standard simple-regression prediction interval; t from the
 *   NIST/SEMATECH e-Handbook table, §1.3.6.7.2). It needs three points or more: through two points the line is exact
 *   and says nothing about its own spread.
 * - the thermocouple tolerance of the measured points (the largest one stated), since every point carries it.
 *
 * Outside the tested power range the line is not known to hold: the estimate is still computed and marked
 * `extrapolated`, and the page says so.
 */
export interface EstimatePoint {
  packagePowerW: number;
  deltaOverAmbientC: number;
  /** ± °C of the thermocouple at this point's peak; null when not known. */
  toleranceC: number | null;
}

export interface EstimateRequest {
  packagePowerW: number;
  roomC: number;
}

export type VrmEstimate =
  | {
      status: 'estimated';
      pointCount: number;
      slopeCPerW: number;
      interceptC: number;
      predictedDeltaC: number;
      estimateC: number;
      /** Half-width of the band around the estimate: statistical part + tolerance. */
      bandC: number;
      /** t · standard error of prediction; null with two points. */
      statisticalBandC: number | null;
      degreesOfFreedom: number | null;
      tCritical: number | null;
      toleranceC: number | null;
      lowC: number;
      highC: number;
      testedRangeW: { min: number; max: number };
      /** The asked power lies outside the tested range: below or above it. */
      extrapolated: 'below' | 'above' | null;
    }
  | {
      status: 'not-enough-points';
      pointCount: number;
      /** Why there is no line: fewer than two points, or every point at the same power. */
      reason: string;
    };

export const estimateConfidence = 0.95;

export function estimateVrmPeak(points: readonly EstimatePoint[], request: EstimateRequest): VrmEstimate {
  const n = points.length;
  if (n < 2) {
    return {
      status: 'not-enough-points',
      pointCount: n,
      reason:
        n === 0
          ? 'This board has no published measurement to estimate from.'
          : 'This board was measured at one load only: one point does not give a line to estimate from.',
    };
  }
  const meanW = points.reduce((sum, p) => sum + p.packagePowerW, 0) / n;
  const meanDeltaC = points.reduce((sum, p) => sum + p.deltaOverAmbientC, 0) / n;
  let sxx = 0;
  let sxy = 0;
  for (const p of points) {
    sxx += (p.packagePowerW - meanW) ** 2;
    sxy += (p.packagePowerW - meanW) * (p.deltaOverAmbientC - meanDeltaC);
  }
  if (sxx === 0) {
    return {
      status: 'not-enough-points',
      pointCount: n,
      reason: 'Every measurement of this board is at the same package power: they give no line to estimate from.',
    };
  }
  const slope = sxy / sxx;
  const intercept = meanDeltaC - slope * meanW;
  const predictedDeltaC = intercept + slope * request.packagePowerW;

  let statisticalBandC: number | null = null;
  let degreesOfFreedom: number | null = null;
  let tCritical: number | null = null;
  if (n >= 3) {
    degreesOfFreedom = n - 2;
    const sse = points.reduce((sum, p) => sum + (p.deltaOverAmbientC - (intercept + slope * p.packagePowerW)) ** 2, 0);
    const s = Math.sqrt(sse / degreesOfFreedom);
    const standardErrorC = s * Math.sqrt(1 + 1 / n + (request.packagePowerW - meanW) ** 2 / sxx);
    tCritical = studentTCritical(estimateConfidence, degreesOfFreedom);
    statisticalBandC = tCritical * standardErrorC;
  }
  const tolerances = points.map((p) => p.toleranceC).filter((t): t is number => t !== null);
  const toleranceC = tolerances.length ? Math.max(...tolerances) : null;
  const bandC = (statisticalBandC ?? 0) + (toleranceC ?? 0);
  const estimateC = request.roomC + predictedDeltaC;
  const powers = points.map((p) => p.packagePowerW);
  const min = Math.min(...powers);
  const max = Math.max(...powers);
  return {
    status: 'estimated',
    pointCount: n,
    slopeCPerW: slope,
    interceptC: intercept,
    predictedDeltaC,
    estimateC,
    bandC,
    statisticalBandC,
    degreesOfFreedom,
    tCritical,
    toleranceC,
    lowC: estimateC - bandC,
    highC: estimateC + bandC,
    testedRangeW: { min, max },
    extrapolated: request.packagePowerW < min ? 'below' : request.packagePowerW > max ? 'above' : null,
  };
}
