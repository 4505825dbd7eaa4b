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
