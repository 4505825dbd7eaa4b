import { indexAtOrAfter, linearSlope, summarizeSeries } from './series-statistics';

export interface SteadyStateCheck {
  /** Mean over the final window. */
  meanC: number;
  /** Change over the final window from its least-squares trend (slope × window length), so noise does not decide. */
  changeC: number;
  reached: boolean;
  windowStartIndex: number;
}

/**
 * "Has the run settled?" — the temperature changes by no more than `limitC` over the final `windowS`. Benchwire's
 * default (1 °C over the last 10 minutes) is the rate of IEC 62368-1 B.1.6 (≤ 3 K in 30 min) over our 10-minute window.
 * A log shorter than the window cannot show a settled window and is not steady.
 */
export function checkSteadyState(
  timeS: Float64Array,
  valuesC: Float64Array,
  windowS: number,
  limitC: number,
  intervalS: number,
): SteadyStateCheck {
  const endS = timeS[timeS.length - 1];
  const windowStartIndex = indexAtOrAfter(timeS, endS + intervalS - windowS);
  const summary = summarizeSeries(valuesC, windowStartIndex);
  const slope = linearSlope(timeS, valuesC, windowStartIndex);
  const changeC = slope * windowS;
  const covered = endS + intervalS >= windowS;
  return {
    meanC: summary.mean,
    changeC,
    reached: covered && Number.isFinite(changeC) && Math.abs(changeC) <= limitC,
    windowStartIndex,
  };
}
