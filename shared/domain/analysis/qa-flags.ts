import type { AnalysisOptions, ChannelFigures, QaFlag, QaFlagCode, RiseFit } from '../../schemas/analysis';
import { qaFlagLabels } from './qa-flag-labels';
import { formatCelsius, formatDuration } from './run-time-format';
import type { Dropout, TimeGap } from './sample-gaps';

export interface QaFacts {
  options: AnalysisOptions;
  mappingGuessed: boolean;
  channels: ChannelFigures[];
  ambientMeanC: number | null;
  ambientDriftC: number | null;
  soakS: number;
  /** The soak counts as complete (it reached the required length within one sample interval). */
  soakComplete: boolean;
  /** VRM columns with no reading at all, and whether the tester confirmed each as dead. */
  deadProbes: { column: string; confirmed: boolean }[];
  prediction: RiseFit | null;
  gaps: TimeGap[];
  dropouts: Dropout[];
  spikeTimes: Map<string, number[]>;
  clockLogged: boolean;
}

function signed(celsius: number): string {
  return `${celsius >= 0 ? '+' : '−'}${formatCelsius(Math.abs(celsius))}`;
}

/** Quality flags an editor reviews before accepting a run: each a machine code and a sentence for the tester. */
export function collectQaFlags(facts: QaFacts): QaFlag[] {
  const { options } = facts;
  const flags: QaFlag[] = [];
  const add = (
    code: QaFlagCode,
    severity: QaFlag['severity'],
    message: string,
    channel: string | null = null,
    atS: number | null = null,
  ) => flags.push({ code, label: qaFlagLabels[code], severity, message, channel, atS });

  if (facts.mappingGuessed) {
    add(
      'mapping-guessed',
      'warning',
      'The column mapping was guessed from the header names: confirm it before saving.',
    );
  }
  if (facts.ambientMeanC === null) {
    add(
      'ambient-missing',
      'warning',
      'No ambient readings (no probe mapped, or its column is empty): no delta over ambient and no normalised peak.',
    );
  } else {
    const offTarget = Math.abs(facts.ambientMeanC - options.ambientTargetC);
    if (offTarget > options.ambientToleranceC) {
      add(
        'ambient-out-of-range',
        'warning',
        `Ambient averaged ${formatCelsius(facts.ambientMeanC)}; the target is ${formatCelsius(options.ambientTargetC)} ± ${formatCelsius(options.ambientToleranceC)}.`,
      );
    }
    if (facts.ambientDriftC !== null && Math.abs(facts.ambientDriftC) > options.ambientDriftLimitC) {
      add(
        'ambient-drift',
        'warning',
        `Ambient drifted ${signed(facts.ambientDriftC)} over the run (limit ${formatCelsius(options.ambientDriftLimitC)}).`,
      );
    }
  }
  for (const dead of facts.deadProbes) {
    add(
      'probe-dead',
      dead.confirmed ? 'info' : 'warning',
      dead.confirmed
        ? `${dead.column} has no reading at all; you confirmed it as a dead probe, so the run is judged without it.`
        : `${dead.column} has no reading at all: a dead or unplugged probe. Unmap it, or confirm it as dead to judge the run without it.`,
      dead.column,
    );
  }
  if (!facts.soakComplete) {
    add(
      'soak-too-short',
      'warning',
      `The loaded soak lasted ${formatDuration(facts.soakS)}; this load configuration requires ${formatDuration(options.soakMinutes * 60)}.`,
    );
  }
  for (const channel of facts.channels) {
    if (channel.reachedSteadyState || channel.dead) continue;
    const change =
      channel.steadyStateChangeC === null || !Number.isFinite(channel.steadyStateChangeC)
        ? 'could not be judged'
        : `changed ${signed(channel.steadyStateChangeC)}`;
    add(
      'not-steady',
      'warning',
      `${channel.column} ${change} over the final ${formatDuration(options.steadyWindowMinutes * 60)}; steady means within ${formatCelsius(options.steadyRiseLimitC)} (the rate of IEC 62368-1 B.1.6).`,
      channel.column,
    );
  }
  if (facts.prediction && !facts.prediction.soakAtLeastFiveTau) {
    const { tauS, loadedS, predictedSteadyC } = facts.prediction;
    add(
      'short-of-five-tau',
      'info',
      `The loaded soak lasted ${(loadedS / tauS).toFixed(1)} τ (τ = ${formatDuration(tauS)}); a first-order rise needs 5 τ to come within 1 % of its steady state, predicted at ${formatCelsius(predictedSteadyC)}.`,
    );
  }
  if (facts.gaps.length > 0) {
    const missing = facts.gaps.reduce((sum, gap) => sum + gap.missingSamples, 0);
    add(
      'gaps',
      'warning',
      `${missing} missing sample(s) in ${facts.gaps.length} gap(s) of the time column, first at ${formatDuration(facts.gaps[0].startS)}.`,
      null,
      facts.gaps[0].startS,
    );
  }
  const dropoutsByChannel = new Map<string, Dropout[]>();
  for (const dropout of facts.dropouts) {
    dropoutsByChannel.set(dropout.channel, [...(dropoutsByChannel.get(dropout.channel) ?? []), dropout]);
  }
  for (const [channel, dropouts] of dropoutsByChannel) {
    const samples = dropouts.reduce((sum, dropout) => sum + dropout.samples, 0);
    add(
      'probe-dropout',
      'warning',
      `${channel} had no reading for ${samples} sample(s) in ${dropouts.length} dropout(s), first at ${formatDuration(dropouts[0].startS)}.`,
      channel,
      dropouts[0].startS,
    );
  }
  for (const [channel, times] of facts.spikeTimes) {
    if (times.length === 0) continue;
    add(
      'probe-spike',
      'info',
      `${channel}: ${times.length} spike(s) of more than ${formatCelsius(options.spikeThresholdC)} ignored by the ${options.spikeWindowSamples}-sample moving median, first at ${formatDuration(times[0])}.`,
      channel,
      times[0],
    );
  }
  if (options.manualThrottleMinute !== null) {
    add(
      'manual-entry',
      'info',
      facts.clockLogged
        ? `A throttle at minute ${options.manualThrottleMinute} was entered by hand, but the clock was logged: the logged clock decides.`
        : `Throttle at minute ${options.manualThrottleMinute} entered by the tester, not measured.`,
      null,
      options.manualThrottleMinute * 60,
    );
  }
  if (options.testerMarkedUnstable) {
    add('manual-entry', 'info', 'The tester marked the system unstable during the soak.');
  }
  return flags;
}
