import { indexAtOrAfter, medianOfSeries } from './series-statistics';

/**
 * The first minutes under load show the level the CPU holds before heat soak; a throttle that lasts most of the run
 * would otherwise pull the run's median down to itself and hide. Benchwire default.
 */
export const throttleReferenceWindowS = 300;

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
  /** The loaded level drops are measured against: the loaded median, or the median of the first five loaded minutes when
   *  that is higher. */
  loadedMedian: number;
  threshold: number;
  episodes: ThrottleEpisode[];
}

/**
 * Sustained drops of the CPU clock (or package power) below `fraction` × its loaded level (see loadedMedian), over the
 * loaded part of the log (from `fromIndex`). A drop lasts from its first low sample to its last, plus one sample interval; gaps in the signal
 * neither start nor end a drop. The share is the throttled time over the loaded time, counted from the first sample
 * at the loaded level.
 */
export function detectThrottle(
  timeS: Float64Array,
  signal: Float64Array,
  fromIndex: number,
  settings: ThrottleSettings,
): ThrottleDetection {
  const firstAtLevel = (level: number) => {
    let index = fromIndex;
    while (index < signal.length && !(signal[index] >= level)) index++;
    return index;
  };
  const runMedian = medianOfSeries(signal, fromIndex);
  // Until the signal first reaches its loaded level the load has not started (a log begun at idle), so a low
  // stretch at the very start is no throttle.
  const loadReached = firstAtLevel(runMedian * settings.fraction);
  const earlyEnd =
    loadReached < signal.length ? indexAtOrAfter(timeS, timeS[loadReached] + throttleReferenceWindowS) : 0;
  const earlyMedian = medianOfSeries(signal, loadReached, earlyEnd);
  const loadedMedian = earlyMedian > runMedian ? earlyMedian : runMedian;
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
  const firstLoaded = firstAtLevel(threshold);
  for (let i = firstLoaded; i < signal.length; i++) {
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
  const loadedS = firstLoaded < signal.length ? timeS[timeS.length - 1] - timeS[firstLoaded] + settings.intervalS : 0;
  return {
    detected: episodes.length > 0,
    firstAtS: episodes.length > 0 ? episodes[0].startS : null,
    shareThrottled: loadedS > 0 ? Math.min(1, throttledS / loadedS) : 0,
    loadedMedian,
    threshold,
    episodes,
  };
}
