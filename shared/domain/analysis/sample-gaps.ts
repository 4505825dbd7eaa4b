import { medianInPlace } from './series-statistics';

export interface TimeGap {
  startS: number;
  endS: number;
  missingSamples: number;
}

export interface Dropout {
  channel: string;
  startS: number;
  endS: number;
  samples: number;
}

/** A step longer than this many nominal intervals means samples are missing; loggers' own timing jitter stays below. */
export const gapIntervalFactor = 1.5;

/** The nominal sample interval: the median step, so a few gaps or jittery steps do not move it. */
export function nominalSampleInterval(timeS: Float64Array): number {
  if (timeS.length < 2) return Number.NaN;
  const steps = new Float64Array(timeS.length - 1);
  for (let i = 1; i < timeS.length; i++) steps[i - 1] = timeS[i] - timeS[i - 1];
  return medianInPlace(steps, steps.length);
}

/** Missing samples: steps longer than 1.5 nominal intervals, with the number of samples that should have been there. */
export function findTimeGaps(timeS: Float64Array, intervalS: number): TimeGap[] {
  const gaps: TimeGap[] = [];
  const limit = intervalS * gapIntervalFactor;
  for (let i = 1; i < timeS.length; i++) {
    const step = timeS[i] - timeS[i - 1];
    if (step <= limit) continue;
    gaps.push({ startS: timeS[i - 1], endS: timeS[i], missingSamples: Math.max(1, Math.round(step / intervalS) - 1) });
  }
  return gaps;
}

/** Runs of gap samples (blank cells, error markers) in one channel: a probe that dropped out. */
export function findDropouts(channel: string, timeS: Float64Array, values: Float64Array): Dropout[] {
  const dropouts: Dropout[] = [];
  let start = -1;
  for (let i = 0; i <= values.length; i++) {
    const missing = i < values.length && values[i] !== values[i];
    if (missing && start < 0) start = i;
    if (!missing && start >= 0) {
      dropouts.push({ channel, startS: timeS[start], endS: timeS[i - 1], samples: i - start });
      start = -1;
    }
  }
  return dropouts;
}
