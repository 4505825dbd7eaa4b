import { medianInPlace } from './series-statistics';
import { ParseErrorList, cellLabel } from './parse-error-list';
import { formatDuration } from './run-time-format';

export interface RepeatedStamps {
  /** Rows that share one stamp, typically (2 for a 2 Hz logger stamping whole seconds). */
  perStamp: number;
  /** The step between distinct stamps (1 s for whole-second stamps). */
  stampStepS: number;
}

function median(values: number[]): number {
  return medianInPlace(Float64Array.from(values), values.length);
}

/**
 * A logger that samples faster than its clock stamps writes each stamp several times: "12:00:00, 12:00:00, 12:00:01,
 * 12:00:01 …" at 2 Hz with whole-second stamps. When the stamps repeat at a steady rate — every group between the first
 * and the last holds the typical count (at least two) give or take one — the rows of each group are spread evenly over
 * the step to the next stamp, in place; a first group that is short (the logger started mid-second) is placed at the
 * end of its step, a last one at its start. Scattered repeats in a log that does not otherwise repeat are no sub-second
 * rate but duplicated rows: each is refused with its row, as before. Times have already been checked not to go back.
 */
export function spreadRepeatedStamps(
  timeS: Float64Array,
  rowNumbers: Int32Array,
  column: string,
  errors: ParseErrorList,
): RepeatedStamps | null {
  const starts: number[] = [];
  for (let i = 0; i < timeS.length; i++) if (i === 0 || timeS[i] !== timeS[i - 1]) starts.push(i);
  if (starts.length === timeS.length) return null;
  const sizes = starts.map((start, g) => (starts[g + 1] ?? timeS.length) - start);
  const interior = sizes.slice(1, -1);
  const perStamp = interior.length > 0 ? median(interior) : sizes.every((size) => size === sizes[0]) ? sizes[0] : 1;
  const steady =
    perStamp >= 2 &&
    interior.every((size) => Math.abs(size - perStamp) <= 1) &&
    sizes[0] <= perStamp + 1 &&
    sizes[sizes.length - 1] <= perStamp + 1;
  if (!steady) {
    for (let i = 1; i < timeS.length; i++) {
      if (timeS[i] !== timeS[i - 1]) continue;
      errors.add(
        rowNumbers[i],
        column,
        'non-monotonic-time',
        `${cellLabel(rowNumbers[i], column)}: repeats the time of the row before (row ${rowNumbers[i - 1]}); times must increase from row to row, or repeat at a steady rate (a logger writing several rows per stamp).`,
      );
    }
    return null;
  }
  const steps: number[] = [];
  for (let g = 1; g < starts.length; g++) steps.push(timeS[starts[g]] - timeS[starts[g - 1]]);
  const stampStepS = steps.length > 0 ? median(steps) : 1;
  const last = starts.length - 1;
  for (let g = 0; g <= last; g++) {
    const start = starts[g];
    const size = sizes[g];
    const stamp = timeS[start];
    const step = g < last ? Math.min(timeS[starts[g + 1]] - stamp, stampStepS) : stampStepS;
    const slots = Math.max(size, g === 0 || g === last ? perStamp : size);
    const offset = g === 0 ? slots - size : 0;
    for (let j = 0; j < size; j++) timeS[start + j] = stamp + ((offset + j) * step) / slots;
  }
  return { perStamp, stampStepS };
}

/**
 * The read summary's sentence for spread stamps; `{ ahead: true }` says it before the analysis, from the first rows
 * (the preview), when nothing has been spread yet.
 */
export function repeatedStampsNote({ perStamp, stampStepS }: RepeatedStamps, { ahead = false } = {}): string {
  const step = formatDuration(stampStepS);
  const spread = ahead ? 'the analysis spreads them' : 'Benchwire spread them';
  return `The time stamps repeat: about ${perStamp} rows share each stamp ${step} apart, so ${spread} evenly within each ${step} step (every ${formatDuration(stampStepS / perStamp)}).`;
}
