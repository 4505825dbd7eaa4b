/** Summaries of a sampled series in which NaN marks a gap; every function skips gaps. */

export interface SeriesSummary {
  count: number;
  mean: number;
  min: number;
  max: number;
}

export function summarizeSeries(values: ArrayLike<number>, from = 0, to = values.length): SeriesSummary {
  let count = 0;
  let sum = 0;
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let i = from; i < to; i++) {
    const value = values[i];
    if (value !== value) continue;
    count++;
    sum += value;
    if (value < min) min = value;
    if (value > max) max = value;
  }
  return count === 0
    ? { count, mean: Number.NaN, min: Number.NaN, max: Number.NaN }
    : { count, mean: sum / count, min, max };
}

export function medianOfSeries(values: ArrayLike<number>, from = 0, to = values.length): number {
  const valid = new Float64Array(Math.max(0, to - from));
  let count = 0;
  for (let i = from; i < to; i++) if (values[i] === values[i]) valid[count++] = values[i];
  if (count === 0) return Number.NaN;
  const sorted = valid.subarray(0, count).sort();
  const middle = count >> 1;
  return count % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

/** First index whose time is at or after `seconds` (binary search; times increase). */
export function indexAtOrAfter(timeS: ArrayLike<number>, seconds: number): number {
  let low = 0;
  let high = timeS.length;
  while (low < high) {
    const middle = (low + high) >> 1;
    if (timeS[middle] < seconds) low = middle + 1;
    else high = middle;
  }
  return low;
}

/** Least-squares slope (per second) of values against time over [from, to); NaN with fewer than two points. */
export function linearSlope(timeS: ArrayLike<number>, values: ArrayLike<number>, from = 0, to = values.length): number {
  let count = 0;
  let sumT = 0;
  let sumV = 0;
  for (let i = from; i < to; i++) {
    if (values[i] !== values[i]) continue;
    count++;
    sumT += timeS[i];
    sumV += values[i];
  }
  if (count < 2) return Number.NaN;
  const meanT = sumT / count;
  const meanV = sumV / count;
  let covariance = 0;
  let varianceT = 0;
  for (let i = from; i < to; i++) {
    if (values[i] !== values[i]) continue;
    const dt = timeS[i] - meanT;
    covariance += dt * (values[i] - meanV);
    varianceT += dt * dt;
  }
  return varianceT === 0 ? Number.NaN : covariance / varianceT;
}
