import { medianOfSeries } from './series-statistics';

/** Samples whose median stands for the idle level at the start of a log. */
const idleSamples = 5;
/** Package power at least doubles from idle to an all-core load; a smaller step is not read as a load start. */
const loadStepRatio = 2;

/**
 * Index of the sample where the load started, read from package power: the first sample above halfway between the
 * idle level (the first samples) and the loaded level (the median of the second half of the log). 0 when power is not
 * logged or the log starts under load.
 */
export function detectLoadStartIndex(powerW: Float64Array | null): number {
  if (!powerW || powerW.length < idleSamples * 2) return 0;
  let idleEnd = 0;
  for (let valid = 0; idleEnd < powerW.length && valid < idleSamples; idleEnd++) {
    if (powerW[idleEnd] === powerW[idleEnd]) valid++;
  }
  const idle = medianOfSeries(powerW, 0, idleEnd);
  const loaded = medianOfSeries(powerW, powerW.length >> 1);
  if (!(loaded > idle * loadStepRatio)) return 0;
  const halfway = (idle + loaded) / 2;
  for (let i = 0; i < powerW.length; i++) if (powerW[i] >= halfway) return i;
  return 0;
}
