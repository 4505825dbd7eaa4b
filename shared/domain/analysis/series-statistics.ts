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

/** k-th smallest of values[0..count) in place (Hoare's selection): linear time, where a sort would be n log n. */
function selectInPlace(values: Float64Array, count: number, k: number): number {
  let left = 0;
  let right = count - 1;
  while (left < right) {
    const pivot = values[(left + right) >> 1];
    let i = left;
    let j = right;
    while (i <= j) {
      while (values[i] < pivot) i++;
      while (values[j] > pivot) j--;
      if (i <= j) {
        const swap = values[i];
        values[i] = values[j];
        values[j] = swap;
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else return values[k];
  }
  return values[k];
}

/** Median of values[0..count), reordering them; for scratch arrays the caller owns. No gaps allowed. */
export function medianInPlace(values: Float64Array, count: number): number {
  if (count === 0) return Number.NaN;
  const middle = count >> 1;
  const upper = selectInPlace(values, count, middle);
  if (count % 2 === 1) return upper;
  let lower = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < middle; i++) if (values[i] > lower) lower = values[i];
  return (lower + upper) / 2;
}

export function medianOfSeries(values: ArrayLike<number>, from = 0, to = values.length): number {
  const valid = new Float64Array(Math.max(0, to - from));
  let count = 0;
  for (let i = from; i < to; i++) if (values[i] === values[i]) valid[count++] = values[i];
  return medianInPlace(valid, count);
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
