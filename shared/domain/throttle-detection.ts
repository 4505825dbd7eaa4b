import { medianOfSeries } from './series-statistics';

export interface ThrottleSettings {
  /** Throttled while the signal stays below this share of its loaded median. */
  fraction: number;
  /** A drop counts only when it lasts at least this long. */
  minSeconds: number;
  intervalS: number;
}

export interface ThrottleEpisode {
  startS: number;
  endS: number;
}

export interface ThrottleDetection {
  detected: boolean;
  firstAtS: number | null;
  shareThrottled: number;
  loadedMedian: number;
  threshold: number;
  episodes: ThrottleEpisode[];
}

/**
 * Sustained drops of the CPU clock (or package power) below `fraction` × its median over the loaded part of the log
 * (from `fromIndex`). A drop lasts from its first low sample to its last, plus one sample interval; gaps in the signal
 * neither start nor end a drop. The share is the throttled time over the loaded time.
 */
export function detectThrottle(
  timeS: Float64Array,
  signal: Float64Array,
  fromIndex: number,
  settings: ThrottleSettings,
): ThrottleDetection {
  const loadedMedian = medianOfSeries(signal, fromIndex);
  const threshold = loadedMedian * settings.fraction;
  const episodes: ThrottleEpisode[] = [];
  let throttledS = 0;
  let start = -1;
  let last = -1;
  const close = () => {
    const durationS = timeS[last] - timeS[start] + settings.intervalS;
    if (durationS >= settings.minSeconds) {
      episodes.push({ startS: timeS[start], endS: timeS[last] + settings.intervalS });
      throttledS += durationS;
    }
    start = -1;
  };
  for (let i = fromIndex; i < signal.length; i++) {
    const value = signal[i];
    if (value !== value) continue;
    if (value < threshold) {
      if (start < 0) start = i;
      last = i;
    } else if (start >= 0) {
      close();
    }
  }
  if (start >= 0) close();
  const loadedS = timeS[timeS.length - 1] - timeS[fromIndex] + settings.intervalS;
  return {
    detected: episodes.length > 0,
    firstAtS: episodes.length > 0 ? episodes[0].startS : null,
    shareThrottled: loadedS > 0 ? Math.min(1, throttledS / loadedS) : 0,
    loadedMedian,
    threshold,
    episodes,
  };
}
