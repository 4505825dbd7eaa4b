/**
 * Median of five values in six comparisons: drop the smaller of the two pairs' minima twice (it cannot be the median),
 * then the median is the smaller of what is left at the front of each pair.
 */
function medianOfFive(a: number, b: number, c: number, d: number, e: number): number {
  let swap: number;
  if (a > b) {
    swap = a;
    a = b;
    b = swap;
  }
  if (c > d) {
    swap = c;
    c = d;
    d = swap;
  }
  if (a > c) {
    swap = b;
    b = d;
    d = swap;
    c = a;
  }
  if (b > e) {
    swap = b;
    b = e;
    e = swap;
  }
  if (b > c) {
    c = b;
    e = d;
  }
  return c < e ? c : e;
}

/**
 * Centred moving median over `window` samples (odd), skipping gaps; the window shrinks at the ends. A median of 2k + 1
 * samples ignores any run of up to k outliers, so the default window of 5 (options.spikeWindowSamples) removes
 * single-sample spikes with a margin of one, while a thermal rise with a time constant of minutes passes unchanged.
 * A sample with no valid neighbour in its window stays a gap.
 */
export function movingMedian(values: Float64Array, window: number): Float64Array {
  const half = window >> 1;
  const length = values.length;
  const out = new Float64Array(length);
  const buffer = new Float64Array(window);
  for (let i = 0; i < length; i++) {
    if (window === 5 && i >= 2 && i < length - 2) {
      const a = values[i - 2];
      const b = values[i - 1];
      const c = values[i];
      const d = values[i + 1];
      const e = values[i + 2];
      // NaN fails every comparison, so a full window is one without gaps.
      if (a === a && b === b && c === c && d === d && e === e) {
        out[i] = medianOfFive(a, b, c, d, e);
        continue;
      }
    }
    const from = i - half < 0 ? 0 : i - half;
    const to = i + half >= length ? length - 1 : i + half;
    let count = 0;
    for (let j = from; j <= to; j++) {
      const value = values[j];
      if (value !== value) continue;
      let k = count++;
      while (k > 0 && buffer[k - 1] > value) {
        buffer[k] = buffer[k - 1];
        k--;
      }
      buffer[k] = value;
    }
    if (count === 0) out[i] = Number.NaN;
    else if (count & 1) out[i] = buffer[count >> 1];
    else out[i] = (buffer[(count >> 1) - 1] + buffer[count >> 1]) / 2;
  }
  return out;
}
