import { levenbergMarquardt } from 'ml-levenberg-marquardt';

export interface FirstOrderRise {
  /** T₀: temperature at the start of the load. */
  startC: number;
  /** ΔT∞: rise from T₀ to the steady state. */
  riseC: number;
  /** τ: time constant. */
  tauS: number;
  /** RMS of the residuals over the fitted points. */
  rmsResidualC: number;
  /** Points the fit used (bin means). */
  points: number;
}

/**
 * The fit runs on bin means rather than every sample: a 10 Hz hour is 36,000 samples, and a few hundred bin means
 * describe a rise with a time constant of minutes just as well while keeping the fit within the upload's time budget.
 */
export const riseFitMaxPoints = 240;
const minPoints = 8;
const fitRounds = 30;
const iterationsPerRound = 10;
const relativeStop = 1e-9;

function binMeans(timeS: ArrayLike<number>, valuesC: ArrayLike<number>, maxPoints: number) {
  const n = timeS.length;
  const start = timeS[0];
  const span = timeS[n - 1] - start;
  const bins = Math.min(maxPoints, n);
  const sumT = new Float64Array(bins);
  const sumV = new Float64Array(bins);
  const count = new Float64Array(bins);
  for (let i = 0; i < n; i++) {
    const value = valuesC[i];
    if (value !== value) continue;
    const bin = span > 0 ? Math.min(bins - 1, Math.floor(((timeS[i] - start) / span) * bins)) : 0;
    sumT[bin] += timeS[i];
    sumV[bin] += value;
    count[bin]++;
  }
  const x: number[] = [];
  const y: number[] = [];
  for (let bin = 0; bin < bins; bin++) {
    if (count[bin] === 0) continue;
    x.push(sumT[bin] / count[bin]);
    y.push(sumV[bin] / count[bin]);
  }
  return { x, y };
}

/** τ where the curve first passes 1 − 1/e of its overall rise: the textbook reading of a first-order step response. */
function initialTau(x: readonly number[], y: readonly number[], startC: number, riseC: number, span: number): number {
  const target = startC + riseC * (1 - Math.exp(-1));
  for (let i = 0; i < x.length; i++) {
    if ((riseC >= 0 && y[i] >= target) || (riseC < 0 && y[i] <= target)) return Math.max(x[i], span / 100);
  }
  return span / 2;
}

/**
 * Fits T(t) = T₀ + ΔT∞·(1 − e^(−t/τ)) by Levenberg–Marquardt, t in seconds from the load start. Time is scaled to the
 * span of the log inside the fit so that the three parameters have comparable sensitivities. Null with fewer than
 * eight usable points.
 */
export function fitFirstOrderRise(timeS: ArrayLike<number>, valuesC: ArrayLike<number>): FirstOrderRise | null {
  if (timeS.length < minPoints) return null;
  const { x, y } = binMeans(timeS, valuesC, riseFitMaxPoints);
  if (x.length < minPoints) return null;
  const span = x[x.length - 1];
  if (!(span > 0)) return null;
  const scaledX = x.map((value) => value / span);

  const tailCount = Math.max(1, Math.floor(y.length / 20));
  const startC = y[0];
  let tailSum = 0;
  for (let i = y.length - tailCount; i < y.length; i++) tailSum += y[i];
  const riseGuess = tailSum / tailCount - startC;
  const tauGuess = initialTau(x, y, startC, riseGuess, span) / span;

  const model =
    ([t0, rise, tau]: number[]) =>
    (t: number) =>
      t0 + rise * (1 - Math.exp(-t / tau));
  const jacobian =
    ([, rise, tau]: number[]) =>
    (t: number) => {
      const decay = Math.exp(-t / tau);
      return [1, 1 - decay, (-rise * t * decay) / (tau * tau)];
    };
  // The library stops only on an absolute error or an iteration count; short rounds with a relative stop end the fit
  // once it no longer improves, which is usually within a few rounds of a first-order step response.
  let parameters = [startC, riseGuess, tauGuess];
  let previousError = Number.POSITIVE_INFINITY;
  for (let round = 0; round < fitRounds; round++) {
    const result = levenbergMarquardt({ x: scaledX, y }, model, {
      initialValues: parameters,
      minValues: [-100, -300, 1e-4],
      maxValues: [400, 400, 100],
      jacobianFunction: jacobian,
      maxIterations: iterationsPerRound,
      errorTolerance: 1e-12,
    });
    parameters = result.parameterValues;
    const converged = previousError - result.parameterError <= relativeStop * Math.max(result.parameterError, 1e-9);
    previousError = result.parameterError;
    if (converged) break;
  }
  const [fitStart, fitRise, fitTau] = parameters;
  const fitted = model(parameters);
  let squares = 0;
  for (let i = 0; i < y.length; i++) squares += (y[i] - fitted(scaledX[i])) ** 2;
  return {
    startC: fitStart,
    riseC: fitRise,
    tauS: fitTau * span,
    rmsResidualC: Math.sqrt(squares / y.length),
    points: y.length,
  };
}
