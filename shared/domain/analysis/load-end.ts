import { throttleReferenceWindowS } from './throttle-detection';
import { indexAtOrAfter, medianOfSeries } from './series-statistics';

/** Samples whose median stands for the level at the end of a log. */
const tailSamples = 5;
/**
 * Package power counts as back at idle when it is within a quarter of the idle-to-load step above idle (without an idle
 * stretch before the load, within a quarter of the loaded level). A power-limit step down (a long-term limit about half
 * the short-term one) stays well above that, so it is never read as the end of the load. Benchwire default.
 */
const idleShareOfStep = 0.25;

export interface LoadEndSignals {
  timeS: Float64Array;
  powerW: Float64Array | null;
  clockMHz: Float64Array | null;
  loadStartIndex: number;
  /** The throttle rule's share of the loaded level (analysis option throttleFraction). */
  throttleFraction: number;
  intervalS: number;
}

function lastIndexAtOrAbove(values: Float64Array, level: number, from: number): number {
  for (let i = values.length - 1; i >= from; i--) if (values[i] >= level) return i;
  return -1;
}

/**
 * The end of the load, found the way its start is: package power falling back to idle and staying there to the end of
 * the log, with the CPU clock (when logged) falling at the same time. A clock that falls while package power stays up
 * is a throttle, not the end of the load, and a clock that fell well before the power did was throttling under load:
 * neither ends the load here, so the throttle rule sees it. Returns the index of the first sample after the load (the
 * start of the cool-down tail), or the sample count when the load ran to the end of the log. Without package power
 * the end cannot be told from a throttle, and the tester sets it by hand.
 */
export function detectLoadEndIndex(signals: LoadEndSignals): number {
  const { timeS, powerW, clockMHz, loadStartIndex, throttleFraction, intervalS } = signals;
  const count = timeS.length;
  if (!powerW || count - loadStartIndex < tailSamples * 2) return count;

  let tailStart = count;
  for (let valid = 0; tailStart > loadStartIndex && valid < tailSamples;) {
    tailStart--;
    if (powerW[tailStart] === powerW[tailStart]) valid++;
  }
  const tailLevel = medianOfSeries(powerW, tailStart);
  // The first loaded minutes, as for the throttle rule: a long tail would pull the whole log's median down to idle.
  const earlyEnd = indexAtOrAfter(timeS, timeS[loadStartIndex] + throttleReferenceWindowS);
  const loadedLevel = Math.max(
    medianOfSeries(powerW, loadStartIndex, earlyEnd),
    medianOfSeries(powerW, loadStartIndex, tailStart),
  );
  const idleLevel = loadStartIndex >= tailSamples ? medianOfSeries(powerW, 0, loadStartIndex) : 0;
  if (!(loadedLevel > idleLevel) || !(tailLevel <= idleLevel + idleShareOfStep * (loadedLevel - idleLevel))) {
    return count;
  }
  const halfway = (tailLevel + loadedLevel) / 2;
  const lastLoaded = lastIndexAtOrAbove(powerW, halfway, loadStartIndex);
  if (lastLoaded < 0 || lastLoaded >= count - 1) return count;
  const end = lastLoaded + 1;

  if (clockMHz) {
    const clockLevel = medianOfSeries(clockMHz, loadStartIndex, end);
    const lastClockUp = lastIndexAtOrAbove(clockMHz, clockLevel * throttleFraction, loadStartIndex);
    // "Together": the clock leaves its loaded level within a few samples (at least ten seconds) of the power.
    const togetherS = Math.max(10, 3 * intervalS);
    const clockFallS = lastClockUp < 0 ? timeS[loadStartIndex] : timeS[Math.min(count - 1, lastClockUp + 1)];
    if (Math.abs(clockFallS - timeS[end]) > togetherS) return count;
  }
  return end;
}
