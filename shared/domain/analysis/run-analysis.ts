import {
  analysisOptionsSchema,
  type AnalysisOptionsInput,
  type AnalysisResult,
  type ChannelFigures,
  type RiseFit,
  type Throttle,
} from '../../schemas/analysis';
import { fitFirstOrderRise } from './first-order-rise-fit';
import { detectLoadStartIndex } from './load-onset';
import { movingMedian } from './moving-median';
import { collectQaFlags } from './qa-flags';
import type { MappedLog, MappedTemperatureChannel } from './read-mapped-log';
import { findDropouts, findTimeGaps, nominalSampleInterval, type Dropout } from './sample-gaps';
import { indexAtOrAfter, linearSlope, summarizeSeries } from './series-statistics';
import { checkSteadyState } from './steady-state';
import { thermocoupleToleranceC, thermocoupleToleranceClasses } from './thermocouple-tolerance';
import { detectThrottle } from './throttle-detection';
import { judgeRun } from './verdict-rubric';

export interface AnalysisContext {
  /** The mapping came from the header guess, not from the tester. */
  mappingGuessed: boolean;
}

/** Longest list of gaps, dropouts or spikes returned; the flags give the totals. */
export const analysisListLimit = 100;
/** A first-order prediction needs a rise to fit; below this the log shows no heating to extrapolate. */
const minimumFittedRiseC = 1;
/** τ beyond this multiple of the fitted span means the curve has not bent toward a plateau: no prediction. */
const maximumTauOverSpan = 3;

interface ChannelWork {
  figures: ChannelFigures;
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
      gapSamples,
      spikeCount: spikeTimes.length,
    },
    filtered,
    dropouts: findDropouts(channel.column, timeS, raw),
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
  if (Math.abs(fit.riseC) < minimumFittedRiseC) {
    return { prediction: null, note: 'The loaded part shows no rise to fit: the temperature was already flat.' };
  }
  const spanS = loadedTime[loadedTime.length - 1];
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
    },
    note: null,
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

/**
 * The thermal analysis of one run: peaks after spike rejection, steady state, first-order prediction, ambient,
 * soak, gaps, throttling, QA flags, the peak's thermocouple tolerance and the rubric's verdict.
 */
export function analyseRun(
  log: MappedLog,
  optionsInput: AnalysisOptionsInput = {},
  context: AnalysisContext = { mappingGuessed: false },
): AnalysisResult {
  const options = analysisOptionsSchema.parse(optionsInput);
  const { timeS } = log;
  const count = timeS.length;
  const endS = timeS[count - 1];
  const intervalS = nominalSampleInterval(timeS);
  const loadStartIndex =
    options.loadStartS === null
      ? detectLoadStartIndex(log.powerW?.values ?? null)
      : Math.min(count - 1, indexAtOrAfter(timeS, options.loadStartS));
  const loadStartS = timeS[loadStartIndex];
  const soakS = endS - loadStartS + intervalS;
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
  let hottest = channels[0];
  for (const channel of channels) {
    if ((channel.figures.peakC ?? -Infinity) > (hottest.figures.peakC ?? -Infinity)) hottest = channel;
  }
  const peakC = hottest.figures.peakC as number;
  const peakAtS = hottest.figures.peakAtS as number;
  const steadyMeans = channels.flatMap((channel) =>
    channel.figures.steadyStateMeanC === null ? [] : [channel.figures.steadyStateMeanC],
  );
  const steadyStateMeanC = steadyMeans.length > 0 ? Math.max(...steadyMeans) : null;

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

  const { prediction, note: predictionNote } = predictRise(log, hottest, loadStartIndex, soakS);

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
  const flags = collectQaFlags({
    options,
    mappingGuessed: context.mappingGuessed,
    channels: figures,
    ambientMeanC,
    ambientDriftC,
    soakS,
    prediction,
    gaps,
    dropouts,
    spikeTimes: new Map(channels.map((channel) => [channel.figures.column, channel.spikeTimes])),
    clockLogged: log.clockMHz !== null,
  });

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
    },
    options.rubric,
  );

  return {
    peakC,
    peakAtS,
    peakChannel: hottest.figures.column,
    steadyStateMeanC,
    reachedSteadyState: figures.every((channel) => channel.reachedSteadyState),
    steadyStateRule: `Steady when each VRM probe changes by at most ${options.steadyRiseLimitC} °C over the final ${options.steadyWindowMinutes} min (least-squares trend); default after the rate of IEC 62368-1 B.1.6, ≤ 3 K in 30 min.`,
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
    requiredSoakS: options.soakMinutes * 60,
    loggedS: endS + intervalS,
    loadStartS,
    sampleIntervalS: intervalS,
    sampleRateHz: 1 / intervalS,
    sampleCount: count,
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
