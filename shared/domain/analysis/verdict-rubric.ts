import type { Verdict, VerdictConcern, VerdictRubric } from '../../schemas/analysis';
import { formatCelsius, formatDuration } from './run-time-format';

/** The steady state predicted for an unfinished soak, from first-order fits that pass the fit-quality rule. */
export interface PredictedSteadyState {
  /** Hottest predicted steady state over the probes (never below the peak already measured). */
  peakC: number;
  /** The same, normalised to the reference room; null without ambient. */
  normalizedPeakC: number | null;
}

export interface VerdictFacts {
  peakC: number;
  normalizedPeakC: number | null;
  referenceRoomC: number;
  useNormalizedPeak: boolean;
  throttled: boolean;
  throttleSource: 'clock' | 'power' | 'manual' | 'none';
  firstThrottleAtS: number | null;
  unstable: boolean;
  /** Why the soak is unfinished ("the soak lasted 10 min of the 60 min required", "VRM 1 had not settled"); empty: finished. */
  unfinished?: string[];
  /** The predicted steady state when every unsettled probe has a good first-order fit; else null. */
  predicted?: PredictedSteadyState | null;
  /** Why no prediction stands in for the unfinished soak, for the withheld verdict's text. */
  noPredictionReason?: string | null;
  /** What blocks any verdict until the tester acts (a dead probe not yet unmapped or confirmed). */
  blockers?: string[];
  /** The QA flags that bear on the verdict; their effect is set here. */
  concerns?: VerdictConcern[];
}

/** The words Benchwire puts on a verdict that is not final, so that no screen, export or API answer can drop them. */
export const provisionalPrefix = 'Provisional: ';
export const withheldLabel = 'No verdict yet';

function throttleEvidence(source: VerdictFacts['throttleSource'], when: string): string {
  if (source === 'manual') return `The tester recorded a throttle${when}`;
  if (source === 'power') return `Package power fell and stayed down${when} (no clock was logged)`;
  return `The CPU clock fell and stayed down${when}`;
}

function sentenceList(parts: readonly string[]): string {
  if (parts.length <= 1) return parts.join('');
  return `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}

/**
 * Maps a run to its verdict with the roundup's rubric and says which rule decided, for the UI to show.
 *
 * 1. A dead probe the tester has not unmapped or confirmed withholds every verdict: the hottest probe may be the one
 *    that read nothing.
 * 2. Throttling or instability fails the run, finished or not: more soak cannot undo a throttle.
 * 3. An unfinished soak (shorter than the load configuration asks, or not settled) gets no verdict from its measured
 *    peak: the temperature was still on its way up. When first-order fits predict the plateau with a good fit, the
 *    verdict is provisional and judged on the predicted steady state; otherwise it is withheld.
 * 4. Otherwise the judged peak (absolute, or normalised to the reference room when the bench profile says so and
 *    ambient was logged) falls into Comfortable, Warm (from the comfortable limit up to the warm limit, inclusive) or
 *    Hot but held.
 */
export function judgeRun(facts: VerdictFacts, rubric: VerdictRubric): Verdict {
  const unfinished = facts.unfinished ?? [];
  const blockers = facts.blockers ?? [];
  const predicted = unfinished.length > 0 ? (facts.predicted ?? null) : null;
  const concernsWith = (effectOf: (concern: VerdictConcern) => VerdictConcern['effect']): VerdictConcern[] => {
    const concerns = (facts.concerns ?? []).map((concern) => ({ ...concern, effect: effectOf(concern) }));
    const rank = { withholds: 0, 'makes-provisional': 1, 'read-with': 2 } as const;
    return concerns.sort((a, b) => rank[a.effect] - rank[b.effect]);
  };
  const soakConcern = (code: VerdictConcern['code']) => code === 'soak-too-short' || code === 'not-steady';

  if (blockers.length > 0) {
    return {
      status: 'withheld',
      code: null,
      label: withheldLabel,
      rule: `No verdict until the dead probe is dealt with: ${sentenceList(blockers)}.`,
      basis: null,
      judgedFrom: null,
      judgedC: null,
      concerns: concernsWith((concern) => (concern.code === 'probe-dead' ? 'withholds' : 'read-with')),
    };
  }

  if (facts.throttled || facts.unstable) {
    const rule = facts.throttled
      ? `${throttleEvidence(facts.throttleSource, facts.firstThrottleAtS === null ? '' : ` from ${formatDuration(facts.firstThrottleAtS)}`)}. A run that throttles fails.`
      : 'The tester marked the system unstable during the soak. An unstable run fails.';
    return {
      status: 'final',
      code: 'throttled',
      label: rubric.labels.throttled,
      rule: unfinished.length > 0 ? `${rule} It fails however long the soak had lasted.` : rule,
      basis: 'absolute',
      judgedFrom: 'measured-peak',
      judgedC: facts.peakC,
      concerns: concernsWith(() => 'read-with'),
    };
  }

  if (unfinished.length > 0 && predicted === null) {
    return {
      status: 'withheld',
      code: null,
      label: withheldLabel,
      rule:
        `No verdict from an unfinished soak: ${sentenceList(unfinished)}. ` +
        (facts.noPredictionReason ?? 'No first-order fit predicts the steady state well enough to stand in for it.') +
        ' Log the full soak, or set the load end if the log runs on after it.',
      basis: null,
      judgedFrom: null,
      judgedC: null,
      concerns: concernsWith((concern) => (soakConcern(concern.code) ? 'withholds' : 'read-with')),
    };
  }

  const peakC = predicted ? predicted.peakC : facts.peakC;
  const normalizedPeakC = predicted ? predicted.normalizedPeakC : facts.normalizedPeakC;
  const normalized = facts.useNormalizedPeak && normalizedPeakC !== null;
  const judgedC = normalized ? (normalizedPeakC as number) : peakC;
  const basis = normalized ? 'normalized' : 'absolute';
  const what = predicted ? 'The predicted steady state' : 'The peak';
  const peakText = normalized
    ? `${what} normalised to a ${formatCelsius(facts.referenceRoomC)} room, ${formatCelsius(judgedC)},`
    : `${what}, ${formatCelsius(judgedC)}${facts.useNormalizedPeak ? ' (absolute: no ambient was logged)' : ''},`;
  let code: Verdict['code'];
  let rule: string;
  if (judgedC < rubric.comfortableBelowC) {
    code = 'comfortable';
    rule = `${peakText} is below ${formatCelsius(rubric.comfortableBelowC)}.`;
  } else if (judgedC <= rubric.warmUpToC) {
    code = 'warm';
    rule = `${peakText} is from ${formatCelsius(rubric.comfortableBelowC)} up to ${formatCelsius(rubric.warmUpToC)}: acceptable.`;
  } else {
    code = 'hot-but-held';
    rule = predicted
      ? `${peakText} is above ${formatCelsius(rubric.warmUpToC)}; the CPU did not throttle in the part that was logged.`
      : `${peakText} is above ${formatCelsius(rubric.warmUpToC)}, but the CPU did not throttle over the soak: it passes, hot.`;
  }
  if (predicted) {
    return {
      status: 'provisional',
      code,
      label: `${provisionalPrefix}${rubric.labels[code]}`,
      rule: `Provisional, because ${sentenceList(unfinished)}: judged on the steady state predicted by a first-order fit, not on a measured one. ${rule}`,
      basis,
      judgedFrom: 'predicted-steady-state',
      judgedC,
      concerns: concernsWith((concern) => (soakConcern(concern.code) ? 'makes-provisional' : 'read-with')),
    };
  }
  return {
    status: 'final',
    code,
    label: rubric.labels[code],
    rule,
    basis,
    judgedFrom: 'measured-peak',
    judgedC,
    concerns: concernsWith(() => 'read-with'),
  };
}
