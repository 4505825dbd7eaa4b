import {
  analysisOptionsSchema,
  type AnalysisOptions,
  type AnalysisOptionsInput,
  type AnalysisResult,
  type ChannelFigures,
  type RiseFit,
  type Throttle,
} from '../../schemas/analysis';
import { fitFirstOrderRise } from './first-order-rise-fit';
import { detectLoadEndIndex } from './load-end';
import { detectLoadStartIndex } from './load-onset';
import { movingMedian } from './moving-median';
import { collectQaFlags } from './qa-flags';
import type { MappedLog, MappedSeries, MappedTemperatureChannel } from './read-mapped-log';
import { judgeRiseFit, minimumFittedRiseC, riseFitQualityRule } from './rise-fit-quality';
import { formatDuration } from './run-time-format';
import { findDropouts, findTimeGaps, nominalSampleInterval, type Dropout } from './sample-gaps';
import { indexAtOrAfter, linearSlope, summarizeSeries } from './series-statistics';
import { checkSteadyState } from './steady-state';
import { thermocoupleToleranceC, thermocoupleToleranceClasses } from './thermocouple-tolerance';
import { detectThrottle } from './throttle-detection';
import { judgeRun, type PredictedSteadyState } from './verdict-rubric';

export interface AnalysisContext {
  /** The mapping came from the header guess, not from the tester. */
  mappingGuessed: boolean;
}

/** Longest list of gaps, dropouts or spikes returned; the flags give the totals. */
export const analysisListLimit = 100;
/** τ beyond this multiple of the fitted span means the curve has not bent toward a plateau: no prediction. */
const maximumTauOverSpan = 3;

interface ChannelWork {
  figures: ChannelFigures;
  prediction: RiseFit | null;
  predictionNote: string | null;
  filtered: Float64Array;
  dropouts: Dropout[];
  spikeTimes: number[];
  spikes: AnalysisResult['spikes'];
}

function analyseChannel(
  log: MappedLog,
  channel: MappedTemperatureChannel,
  window: number,
  spikeThresholdC: number,
  steadyWindowS: number,
  steadyLimitC: number,
  intervalS: number,
): ChannelWork {
  const { timeS } = log;
  const raw = channel.valuesC;
  const filtered = movingMedian(raw, window);
  let peakIndex = -1;
  let minC = Number.POSITIVE_INFINITY;
  let gapSamples = 0;
  const spikeTimes: number[] = [];
  const spikes: AnalysisResult['spikes'] = [];
  for (let i = 0; i < filtered.length; i++) {
    const value = filtered[i];
    if (raw[i] !== raw[i]) gapSamples++;
    else if (Math.abs(raw[i] - value) > spikeThresholdC) {
      spikeTimes.push(timeS[i]);
      if (spikes.length < analysisListLimit) {
        spikes.push({ channel: channel.column, atS: timeS[i], rawC: raw[i], medianC: value });
      }
    }
    if (value !== value) continue;
    if (peakIndex < 0 || value > filtered[peakIndex]) peakIndex = i;
    if (value < minC) minC = value;
  }
  const steady = checkSteadyState(timeS, filtered, steadyWindowS, steadyLimitC, intervalS);
  const finite = (value: number) => (Number.isFinite(value) ? value : null);
  return {
    figures: {
      column: channel.column,
      unit: channel.unit,
      peakC: peakIndex < 0 ? null : filtered[peakIndex],
      peakAtS: peakIndex < 0 ? null : timeS[peakIndex],
      minC: finite(minC),
      steadyStateMeanC: finite(steady.meanC),
      steadyStateChangeC: finite(steady.changeC),
      reachedSteadyState: steady.reached,
      dead: peakIndex < 0,
      predictedSteadyC: null,
      gapSamples,
      spikeCount: spikeTimes.length,
    },
    prediction: null,
    predictionNote: null,
    filtered,
    // A probe with no reading at all is a dead probe, flagged as such rather than as one long dropout.
    dropouts: peakIndex < 0 ? [] : findDropouts(channel.column, timeS, raw),
    spikeTimes,
    spikes,
  };
}

function predictRise(
  log: MappedLog,
  channel: ChannelWork,
  loadStartIndex: number,
  soakS: number,
): { prediction: RiseFit | null; note: string | null } {
  const { timeS } = log;
  const loadStartS = timeS[loadStartIndex];
  const loadedTime = new Float64Array(timeS.length - loadStartIndex);
  for (let i = 0; i < loadedTime.length; i++) loadedTime[i] = timeS[loadStartIndex + i] - loadStartS;
  const fit = fitFirstOrderRise(loadedTime, channel.filtered.subarray(loadStartIndex));
  if (!fit) return { prediction: null, note: 'Too few loaded samples to fit a first-order rise.' };
  if (!Number.isFinite(fit.tauS) || !Number.isFinite(fit.riseC)) {
    return { prediction: null, note: 'The first-order fit did not converge on this log.' };
  }
  if (Math.abs(fit.riseC) < minimumFittedRiseC) {
    return { prediction: null, note: 'The loaded part shows no rise to fit: the temperature was already flat.' };
  }
  const spanS = loadedTime[loadedTime.length - 1];
  const quality = judgeRiseFit(fit, spanS);
  if (fit.tauS > maximumTauOverSpan * spanS) {
    return {
      prediction: null,
      note: 'The rise has not yet bent toward a plateau, so its steady state cannot be predicted from this log.',
    };
  }
  return {
    prediction: {
      channel: channel.figures.column,
      loadStartS,
      startC: fit.startC,
      riseC: fit.riseC,
      tauS: fit.tauS,
      predictedSteadyC: fit.startC + fit.riseC,
      rmsResidualC: fit.rmsResidualC,
      loadedS: soakS,
      soakAtLeastFiveTau: soakS >= 5 * fit.tauS,
      goodFit: quality.good,
      fitRule: riseFitQualityRule,
    },
    note: quality.reason === null ? null : `Not good enough to judge by: ${quality.reason}.`,
  };
}

/** The tester's "throttled at minute X": the onset is known, its length is not. */
function manualThrottle(minute: number): Throttle {
  return {
    detected: true,
    source: 'manual',
    firstAtS: minute * 60,
    shareThrottled: null,
    loadedMedian: null,
    threshold: null,
    episodes: [],
  };
}

/** The log up to (not including) sample `end`: the loaded window, without a cool-down tail. */
function logUpTo(log: MappedLog, end: number): MappedLog {
  if (end >= log.timeS.length) return log;
  const series = (mapped: MappedSeries | null) => mapped && { ...mapped, values: mapped.values.subarray(0, end) };
  const channel = (mapped: MappedTemperatureChannel) => ({ ...mapped, valuesC: mapped.valuesC.subarray(0, end) });
  return {
    ...log,
    timeS: log.timeS.subarray(0, end),
    rowNumbers: log.rowNumbers.subarray(0, end),
    vrm: log.vrm.map(channel),
    ambient: log.ambient && channel(log.ambient),
    clockMHz: series(log.clockMHz),
    powerW: series(log.powerW),
  };
}

/** Fewest samples a loaded window keeps, whatever load end the tester sets. */
const minimumLoadedSamples = 2;

interface LoadWindow {
  loadStartIndex: number;
  /** First sample after the load; the sample count when the load ran to the end. */
  endIndex: number;
  loadEndS: number | null;
  source: AnalysisResult['loadEndSource'];
}

function findLoadWindow(log: MappedLog, options: AnalysisOptions, intervalS: number): LoadWindow {
  const { timeS } = log;
  const count = timeS.length;
  const loadStartIndex =
    options.loadStartS === null
      ? detectLoadStartIndex(log.powerW?.values ?? null)
      : Math.min(count - 1, indexAtOrAfter(timeS, options.loadStartS));
  const fewest = Math.min(count, loadStartIndex + minimumLoadedSamples);
  if (options.loadEndS !== null) {
    // Samples stamped up to the tester's load end are loaded; the first one after it starts the tail.
    const end = Math.max(fewest, indexAtOrAfter(timeS, options.loadEndS + 1e-9));
    return end < count
      ? { loadStartIndex, endIndex: end, loadEndS: Math.max(options.loadEndS, timeS[end - 1]), source: 'manual' }
      : { loadStartIndex, endIndex: count, loadEndS: null, source: 'none' };
  }
  const end = Math.max(
    fewest,
    detectLoadEndIndex({
      timeS,
      powerW: log.powerW?.values ?? null,
      clockMHz: log.clockMHz?.values ?? null,
      loadStartIndex,
      throttleFraction: options.throttleFraction,
      intervalS,
    }),
  );
  return end < count
    ? { loadStartIndex, endIndex: end, loadEndS: timeS[end], source: 'detected' }
    : { loadStartIndex, endIndex: count, loadEndS: null, source: 'none' };
}

function sentenceList(parts: readonly string[]): string {
  if (parts.length <= 1) return parts.join('');
  return `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}

/** The name in a dead-probe confirmation matches the column's header name, case and outer spaces aside. */
function isConfirmedDead(column: string, confirmed: readonly string[]): boolean {
  const wanted = column.trim().toLowerCase();
  return confirmed.some((name) => name.trim().toLowerCase() === wanted);
}

/**
 * The thermal analysis of one run: the loaded window (load start to load end, a cool-down tail left out), peaks after
 * spike rejection, steady state, first-order prediction, ambient, soak, gaps, throttling, QA flags, the peak's
 * thermocouple tolerance and the rubric's verdict (withheld or provisional for an unfinished soak).
 */
export function analyseRun(
  fullLog: MappedLog,
  optionsInput: AnalysisOptionsInput = {},
  context: AnalysisContext = { mappingGuessed: false },
): AnalysisResult {
  const options = analysisOptionsSchema.parse(optionsInput);
  const intervalS = nominalSampleInterval(fullLog.timeS);
  let window = findLoadWindow(fullLog, options, intervalS);
  let log = logUpTo(fullLog, window.endIndex);
  if (log.vrm.every((channel) => channel.valuesC.every((value) => value !== value))) {
    // No probe read anything before the load end: judge the whole log rather than nothing.
    window = { ...window, endIndex: fullLog.timeS.length, loadEndS: null, source: 'none' };
    log = fullLog;
  }
  const { loadStartIndex } = window;
  const { timeS } = log;
  const count = timeS.length;
  const endS = timeS[count - 1];
  const loadStartS = timeS[loadStartIndex];
  // From the load start to the last loaded sample: a 0–3600 s log soaked 60 min, not 60 min plus one interval.
  const soakS = endS - loadStartS;
  const requiredSoakS = options.soakMinutes * 60;
  // The last sample stands for the interval it closes, so a log one interval short of the requirement is complete
  // (360 samples every 10 s from 0 to 3590 s are a 60-minute soak).
  const soakComplete = soakS + intervalS >= requiredSoakS - 1e-9;
  const steadyWindowS = options.steadyWindowMinutes * 60;

  const channels = log.vrm.map((channel) =>
    analyseChannel(
      log,
      channel,
      options.spikeWindowSamples,
      options.spikeThresholdC,
      steadyWindowS,
      options.steadyRiseLimitC,
      intervalS,
    ),
  );
  const live = channels.filter((channel) => !channel.figures.dead);
  let hottest = live[0];
  for (const channel of live) {
    if ((channel.figures.peakC ?? -Infinity) > (hottest.figures.peakC ?? -Infinity)) hottest = channel;
  }
  const peakC = hottest.figures.peakC as number;
  const peakAtS = hottest.figures.peakAtS as number;
  const steadyMeans = live.flatMap((channel) =>
    channel.figures.steadyStateMeanC === null ? [] : [channel.figures.steadyStateMeanC],
  );
  const steadyStateMeanC = steadyMeans.length > 0 ? Math.max(...steadyMeans) : null;
  const reachedSteadyState = live.every((channel) => channel.figures.reachedSteadyState);

  let ambientMeanC: number | null = null;
  let ambientMinC: number | null = null;
  let ambientMaxC: number | null = null;
  let ambientDriftC: number | null = null;
  let ambientFinalWindowMeanC: number | null = null;
  if (log.ambient) {
    const ambient = movingMedian(log.ambient.valuesC, options.spikeWindowSamples);
    const summary = summarizeSeries(ambient);
    if (summary.count > 0) {
      ambientMeanC = summary.mean;
      ambientMinC = summary.min;
      ambientMaxC = summary.max;
      const slope = linearSlope(timeS, ambient);
      ambientDriftC = Number.isFinite(slope) ? slope * (endS + intervalS) : 0;
      const windowStart = indexAtOrAfter(timeS, endS + intervalS - steadyWindowS);
      const finalWindow = summarizeSeries(ambient, windowStart);
      ambientFinalWindowMeanC = finalWindow.count > 0 ? finalWindow.mean : summary.mean;
    }
  }
  const deltaOverAmbientC = ambientFinalWindowMeanC === null ? null : peakC - ambientFinalWindowMeanC;
  const normalizedPeakC = deltaOverAmbientC === null ? null : options.referenceRoomC + deltaOverAmbientC;

  for (const channel of live) {
    const { prediction, note } = predictRise(log, channel, loadStartIndex, soakS);
    channel.prediction = prediction;
    channel.predictionNote = note;
    channel.figures.predictedSteadyC = prediction?.goodFit ? prediction.predictedSteadyC : null;
  }
  const prediction = hottest.prediction;
  const predictionNote = hottest.predictionNote;

  const throttleSignal = log.clockMHz ?? log.powerW;
  let throttle: Throttle;
  if (!log.clockMHz && options.manualThrottleMinute !== null) {
    throttle = manualThrottle(options.manualThrottleMinute);
  } else if (throttleSignal) {
    const detection = detectThrottle(timeS, throttleSignal.values, loadStartIndex, {
      fraction: options.throttleFraction,
      minSeconds: options.throttleMinSeconds,
      intervalS,
    });
    throttle = {
      detected: detection.detected,
      source: log.clockMHz ? 'clock' : 'power',
      firstAtS: detection.firstAtS,
      shareThrottled: detection.shareThrottled,
      loadedMedian: Number.isFinite(detection.loadedMedian) ? detection.loadedMedian : null,
      threshold: Number.isFinite(detection.threshold) ? detection.threshold : null,
      episodes: detection.episodes.slice(0, analysisListLimit),
    };
  } else {
    throttle = {
      detected: false,
      source: 'none',
      firstAtS: null,
      shareThrottled: null,
      loadedMedian: null,
      threshold: null,
      episodes: [],
    };
  }

  const gaps = findTimeGaps(timeS, intervalS);
  const dropouts = channels.flatMap((channel) => channel.dropouts);
  if (log.ambient) dropouts.push(...findDropouts(log.ambient.column, timeS, log.ambient.valuesC));

  const toleranceDefinition = thermocoupleToleranceClasses[options.toleranceClass];
  let peakToleranceC: number | null = null;
  let toleranceNote: string | null = null;
  try {
    peakToleranceC = thermocoupleToleranceC(peakC, options.toleranceClass);
  } catch (error) {
    toleranceNote = (error as Error).message;
  }

  const figures = channels.map((channel) => channel.figures);
  const deadProbes = figures
    .filter((channel) => channel.dead)
    .map((channel) => ({
      column: channel.column,
      confirmed: isConfirmedDead(channel.column, options.confirmedDeadProbes),
    }));
  const flags = collectQaFlags({
    options,
    mappingGuessed: context.mappingGuessed,
    channels: figures,
    ambientMeanC,
    ambientDriftC,
    soakS,
    soakComplete,
    deadProbes,
    prediction,
    gaps,
    dropouts,
    spikeTimes: new Map(channels.map((channel) => [channel.figures.column, channel.spikeTimes])),
    clockLogged: log.clockMHz !== null,
  });

  // An unfinished soak: what is missing, and whether first-order fits predict the steady state it did not reach.
  const unsettled = live.filter((channel) => !channel.figures.reachedSteadyState);
  const unfinished: string[] = [];
  if (!soakComplete) {
    unfinished.push(`the soak lasted ${formatDuration(soakS)} of the ${formatDuration(requiredSoakS)} required`);
  }
  if (unsettled.length > 0) {
    unfinished.push(
      `${sentenceList(unsettled.map((channel) => channel.figures.column))} had not settled over the final ${formatDuration(steadyWindowS)}`,
    );
  }
  let predicted: PredictedSteadyState | null = null;
  let noPredictionReason: string | null = null;
  if (unfinished.length > 0) {
    let hottestPredictedC = peakC;
    for (const channel of live) {
      const estimateC =
        channel.figures.predictedSteadyC ?? (channel.figures.reachedSteadyState ? channel.figures.peakC : null);
      if (estimateC === null) {
        const why =
          channel.prediction === null
            ? channel.predictionNote
            : channel.predictionNote?.replace(/^Not good enough to judge by: /, '');
        noPredictionReason = `No good first-order fit predicts where ${channel.figures.column} would settle${why ? `: ${why.replace(/\.$/, '')}` : ''}.`;
        break;
      }
      hottestPredictedC = Math.max(hottestPredictedC, estimateC);
    }
    if (noPredictionReason === null) {
      predicted = {
        peakC: hottestPredictedC,
        normalizedPeakC:
          ambientFinalWindowMeanC === null
            ? null
            : options.referenceRoomC + hottestPredictedC - ambientFinalWindowMeanC,
      };
    }
  }
  const concernCodes = [...new Set(flags.map((flag) => flag.code))].filter((code) => code !== 'probe-spike');
  const verdict = judgeRun(
    {
      peakC,
      normalizedPeakC,
      referenceRoomC: options.referenceRoomC,
      useNormalizedPeak: options.useNormalizedPeak,
      throttled: throttle.detected,
      throttleSource: throttle.source,
      firstThrottleAtS: throttle.firstAtS,
      unstable: options.testerMarkedUnstable,
      unfinished,
      predicted,
      noPredictionReason,
      blockers: deadProbes
        .filter((dead) => !dead.confirmed)
        .map((dead) => `${dead.column} has no reading at all; unmap it, or confirm it as a dead probe`),
      concerns: concernCodes.map((code) => ({
        code,
        label: flags.find((flag) => flag.code === code)?.label ?? code,
        effect: 'read-with',
      })),
    },
    options.rubric,
  );

  return {
    peakC,
    peakAtS,
    peakChannel: hottest.figures.column,
    steadyStateMeanC,
    reachedSteadyState,
    steadyStateRule: `Steady when each VRM probe changes by at most ${options.steadyRiseLimitC} °C over the final ${formatDuration(steadyWindowS)} (least-squares trend); default after the rate of IEC 62368-1 B.1.6, ≤ 3 K in 30 min.`,
    ambientMeanC,
    ambientMinC,
    ambientMaxC,
    ambientDriftC,
    ambientFinalWindowMeanC,
    deltaOverAmbientC,
    normalizedPeakC,
    referenceRoomC: options.referenceRoomC,
    prediction,
    predictionNote,
    startedAt: log.startedAt,
    soakS,
    requiredSoakS,
    loggedS: fullLog.timeS[fullLog.timeS.length - 1],
    loadStartS,
    loadEndS: window.loadEndS,
    loadEndSource: window.source,
    readNotes: fullLog.readNotes ?? [],
    sampleIntervalS: intervalS,
    sampleRateHz: 1 / intervalS,
    sampleCount: fullLog.timeS.length,
    gaps: gaps.slice(0, analysisListLimit),
    dropouts: dropouts.slice(0, analysisListLimit),
    spikes: channels.flatMap((channel) => channel.spikes).slice(0, analysisListLimit),
    throttle,
    uncertainty: {
      toleranceClass: options.toleranceClass,
      standard: toleranceDefinition.standard,
      peakToleranceC,
      note: toleranceNote,
    },
    flags,
    verdict,
    channels: figures,
  };
}
