import type { Verdict, VerdictRubric } from '../../schemas/analysis';
import { formatCelsius, formatRunTime } from './run-time-format';

export interface VerdictFacts {
  peakC: number;
  normalizedPeakC: number | null;
  referenceRoomC: number;
  useNormalizedPeak: boolean;
  throttled: boolean;
  throttleSource: 'clock' | 'power' | 'manual' | 'none';
  firstThrottleAtS: number | null;
  unstable: boolean;
}

function throttleEvidence(source: VerdictFacts['throttleSource'], when: string): string {
  if (source === 'manual') return `The tester recorded a throttle${when}`;
  if (source === 'power') return `Package power fell and stayed down${when} (no clock was logged)`;
  return `The CPU clock fell and stayed down${when}`;
}

/**
 * Maps a run to its verdict with the roundup's rubric and says which rule decided, for the UI to show. Throttling or
 * instability fails first; otherwise the judged peak (absolute, or normalised to the reference room when the bench
 * profile says so and ambient was logged) falls into Comfortable, Warm (from the comfortable limit up to the warm
 * limit, inclusive) or Hot but held.
 */
export function judgeRun(facts: VerdictFacts, rubric: VerdictRubric): Verdict {
  const normalized = facts.useNormalizedPeak && facts.normalizedPeakC !== null;
  const judgedC = normalized ? (facts.normalizedPeakC as number) : facts.peakC;
  const basis = normalized ? 'normalized' : 'absolute';
  const peakText = normalized
    ? `The peak normalised to a ${formatCelsius(facts.referenceRoomC)} room, ${formatCelsius(judgedC)},`
    : `The peak, ${formatCelsius(judgedC)}${facts.useNormalizedPeak ? ' (absolute: no ambient was logged)' : ''},`;
  const verdict = (code: Verdict['code'], rule: string): Verdict => ({
    code,
    label: rubric.labels[code],
    rule,
    basis,
    judgedC,
  });

  if (facts.throttled) {
    const when = facts.firstThrottleAtS === null ? '' : ` from ${formatRunTime(facts.firstThrottleAtS)}`;
    return verdict('throttled', `${throttleEvidence(facts.throttleSource, when)}. A run that throttles fails.`);
  }
  if (facts.unstable) {
    return verdict('throttled', 'The tester marked the system unstable during the soak. An unstable run fails.');
  }
  if (judgedC < rubric.comfortableBelowC) {
    return verdict('comfortable', `${peakText} is below ${formatCelsius(rubric.comfortableBelowC)}.`);
  }
  if (judgedC <= rubric.warmUpToC) {
    return verdict(
      'warm',
      `${peakText} is from ${formatCelsius(rubric.comfortableBelowC)} up to ${formatCelsius(rubric.warmUpToC)}: acceptable.`,
    );
  }
  return verdict(
    'hot-but-held',
    `${peakText} is above ${formatCelsius(rubric.warmUpToC)}, but the CPU did not throttle over the soak: it passes, hot.`,
  );
}
