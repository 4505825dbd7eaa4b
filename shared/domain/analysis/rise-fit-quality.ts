import type { FirstOrderRise } from './first-order-rise-fit';
import { formatCelsius } from './run-time-format';

/**
 * When may a first-order fit stand in for a steady state the log has not reached? A first-order step response is
 * T(t) = T₀ + ΔT∞·(1 − e^(−t/τ)) (K. Ogata, Modern Control Engineering, "first-order systems", unit-step response
 * 1 − e^(−t/T); computed from it: 63.2 % of the rise at τ, 86.5 % at 2 τ, 99.3 % at 5 τ). The fit is good when:
 *  - the loaded log covers at least 2 τ, so it shows 1 − e^(−2) ≈ 86.5 % of the rise and at most e^(−2) ≈ 13.5 % of
 *    it is extrapolated (Benchwire default);
 *  - the fitted rise is at least 1 °C: below that the log shows no curve to extrapolate (Benchwire default);
 *  - the RMS residual is at most 0.5 °C or 2 % of the fitted rise, whichever is larger, so the curve really is first
 *    order (Benchwire default).
 */
export const minimumSpanOverTau = 2;
export const minimumFittedRiseC = 1;
export const maximumRmsResidualC = 0.5;
export const maximumRmsShareOfRise = 0.02;

export const riseFitQualityRule =
  `A first-order fit predicts the steady state well enough to judge an unfinished soak when the loaded log covers at least ${minimumSpanOverTau} τ ` +
  `(it then shows 86.5 % of the rise, 1 − e^(−2)), the fitted rise is at least ${formatCelsius(minimumFittedRiseC)} and the RMS residual is at most ` +
  `${formatCelsius(maximumRmsResidualC)} or ${maximumRmsShareOfRise * 100} % of the rise, whichever is larger.`;

export interface RiseFitQuality {
  good: boolean;
  /** Why the fit is not good, as a clause ("the log covers 1.4 τ of the rise; …"); null when good. */
  reason: string | null;
}

/** Applies riseFitQualityRule to a fit over `spanS` seconds of loaded log. */
export function judgeRiseFit(fit: FirstOrderRise, spanS: number): RiseFitQuality {
  if (Math.abs(fit.riseC) < minimumFittedRiseC) {
    return { good: false, reason: 'the loaded part shows no rise to fit' };
  }
  const covered = spanS / fit.tauS;
  if (!(covered >= minimumSpanOverTau)) {
    return {
      good: false,
      reason: `the log covers ${covered.toFixed(1)} τ of the rise; a prediction needs at least ${minimumSpanOverTau} τ`,
    };
  }
  const limitC = Math.max(maximumRmsResidualC, maximumRmsShareOfRise * Math.abs(fit.riseC));
  if (!(fit.rmsResidualC <= limitC)) {
    return {
      good: false,
      reason: `the fit leaves an RMS residual of ${formatCelsius(fit.rmsResidualC)} (limit ${formatCelsius(limitC)}): the rise is not first order`,
    };
  }
  return { good: true, reason: null };
}
