/**
 * Payloads of the measurement engine (issue 3): logger upload request, preview, analysis result, parse errors.
 *
 * POST /api/log-check/analyse (multipart: `file` + `request` as a JSON string) runs analyseLog
 * (shared/domain/analysis/analyse-log) in a worker and answers
 *   200 { preview, analysis }                                              (analysisPreviewResponseSchema)
 *   422 { error: { code: 'log_parse_failed', message, details: { preview, errors } } }
 *                                  (details: analysisPreviewFailureSchema; each error { row, column, code, message }).
 * analyseLog is pure and returns bad input as errors instead of throwing. When request.mapping is omitted the
 * engine analyses with the mapping guessed from the header and adds the 'mapping-guessed' flag: the UI should show
 * preview.guessedMapping and ask the tester to confirm it, never store the guess silently.
 */
import { z } from 'zod';
import { singleLineText } from './text';

export const temperatureUnits = ['C', 'F', 'K', 'mV'] as const;
export const temperatureUnitSchema = z.enum(temperatureUnits);
export type TemperatureUnit = z.infer<typeof temperatureUnitSchema>;

export const columnRoles = ['time', 'vrm', 'ambient', 'clock', 'power', 'cold-junction', 'other'] as const;
export const columnRoleSchema = z.enum(columnRoles);
export type ColumnRole = z.infer<typeof columnRoleSchema>;

/** How the time column is written: elapsed numbers (unit from the header), mm:ss / hh:mm:ss, or date-time stamps. */
export const timeFormats = ['seconds', 'milliseconds', 'minutes', 'clock', 'date-time'] as const;
export const timeFormatSchema = z.enum(timeFormats);
export type TimeFormat = z.infer<typeof timeFormatSchema>;

const columnReference = singleLineText(200, 'Name the column.');

/** Columns are named by their header text (case-insensitive) or by 1-based position ("3"). */
export const columnMappingSchema = z.object({
  time: columnReference.optional(),
  vrm: z.array(columnReference).min(1, 'Map at least one VRM probe column.'),
  ambient: columnReference.nullable().optional(),
  clock: columnReference.nullable().optional(),
  power: columnReference.nullable().optional(),
  /** Unit per column, for columns whose header does not say it. */
  units: z.record(z.string(), temperatureUnitSchema).optional(),
});
export type ColumnMapping = z.infer<typeof columnMappingSchema>;

/** Cold junction for raw millivolt channels: a fixed temperature or a logged channel (read in °C unless its header says otherwise). */
export const coldJunctionSchema = z.union([
  z.object({ fixedC: z.number().min(-50).max(150) }),
  z.object({ column: columnReference }),
]);
export type ColdJunction = z.infer<typeof coldJunctionSchema>;

export const toleranceClasses = [
  'iec-60584-1-class-1',
  'iec-60584-1-class-2',
  'astm-e230-standard',
  'astm-e230-special',
] as const;
export const toleranceClassSchema = z.enum(toleranceClasses);
export type ToleranceClass = z.infer<typeof toleranceClassSchema>;

export const verdictCodes = ['comfortable', 'warm', 'hot-but-held', 'throttled'] as const;
export const verdictCodeSchema = z.enum(verdictCodes);
export type VerdictCode = z.infer<typeof verdictCodeSchema>;

/**
 * A roundup's verdict rubric. Defaults follow common practice in VRM thermal reviews (REFERENCES.md, "Physics and trade
 * practice", no published source): a run that throttles fails; below ~80 °C is comfortable; ~80 °C is acceptable (warm,
 * 80 up to 100 °C); past 100 °C without throttling passes but is hot. The labels are Benchwire's own.
 */
export const verdictRubricSchema = z
  .object({
    comfortableBelowC: z.number().min(0).max(200).default(80),
    warmUpToC: z.number().min(0).max(250).default(100),
    labels: z
      .object({
        comfortable: singleLineText(40).default('Comfortable'),
        warm: singleLineText(40).default('Warm'),
        'hot-but-held': singleLineText(40).default('Hot but held'),
        throttled: singleLineText(40).default('Throttled'),
      })
      .prefault({}),
  })
  .refine((rubric) => rubric.comfortableBelowC <= rubric.warmUpToC, {
    message: 'The comfortable limit must not be above the warm limit.',
    path: ['warmUpToC'],
  });
export type VerdictRubric = z.infer<typeof verdictRubricSchema>;
export type VerdictRubricInput = z.input<typeof verdictRubricSchema>;
export const defaultVerdictRubric: VerdictRubric = verdictRubricSchema.parse({});

/**
 * Bench-profile and per-upload options. Each default says where it comes from; "Benchwire default" means our own
 * choice with no published source.
 */
export const analysisOptionsSchema = z
  .object({
    /** Unit of temperature columns whose header and mapping name none. Unset: °C. */
    unit: temperatureUnitSchema.optional(),
    /** Required for raw millivolt channels: a thermocouple reads the difference to its cold junction. */
    coldJunction: coldJunctionSchema.optional(),
    /** The load configuration's required soak; an hour per load is common practice (REFERENCES.md, no source). */
    soakMinutes: z.number().positive().max(1440).default(60),
    /** Final window for the steady-state mean and the rise criterion (issue 3 default: last 10 minutes). */
    steadyWindowMinutes: z.number().positive().max(240).default(10),
    /**
     * Largest change over the final window that still counts as steady. Default 1 °C in 10 min: the rate of
     * IEC 62368-1 B.1.6 (≤ 3 K in 30 min) applied to the 10-minute window.
     */
    steadyRiseLimitC: z.number().positive().max(50).default(1),
    /** Centred moving-median window in samples; 5 removes any run of up to 2 outlying samples. Benchwire default. */
    spikeWindowSamples: z
      .number()
      .int()
      .min(3)
      .max(51)
      .refine((n) => n % 2 === 1, 'Use an odd number of samples.')
      .default(5),
    /** A raw sample this far from its moving median counts as a spike. Benchwire default. */
    spikeThresholdC: z.number().positive().default(5),
    /** Controlled room near 21 °C: common practice (REFERENCES.md, no source); ±2 °C is a Benchwire default. */
    ambientTargetC: z.number().min(-20).max(60).default(21),
    ambientToleranceC: z.number().nonnegative().max(20).default(2),
    /** Largest ambient change over the run (least-squares trend). Benchwire default. */
    ambientDriftLimitC: z.number().nonnegative().max(20).default(2),
    /** Normalised peak = reference + delta over ambient. 21 °C as above. */
    referenceRoomC: z.number().min(-20).max(60).default(21),
    /** Throttled when the clock (or package power) stays below this share of its loaded median. Benchwire default. */
    throttleFraction: z.number().gt(0).lt(1).default(0.85),
    /** … for at least this long. Benchwire default. */
    throttleMinSeconds: z.number().positive().max(3600).default(10),
    /** A tester's "throttled at minute X", used when no clock is logged. */
    manualThrottleMinute: z.number().nonnegative().nullable().default(null),
    /** A tester's mark that the system was unstable (crash, reset) during the soak: the run fails. */
    testerMarkedUnstable: z.boolean().default(false),
    /** Seconds into the log when the load started; unset: detected from package power, else the first sample. */
    loadStartS: z.number().nonnegative().nullable().default(null),
    /**
     * Seconds into the log when the load ended: samples after it are a cool-down tail, left out of the analysis. Unset:
     * detected where package power (and the clock, when logged) fall to idle together, else the log's last sample.
     */
    loadEndS: z.number().positive().nullable().default(null),
    /**
     * VRM columns (header names) the tester confirms as dead probes: a mapped probe with no reading at all withholds the
     * verdict until it is unmapped or confirmed here; a confirmed one is left out of the judgement.
     */
    confirmedDeadProbes: z.array(columnReference).max(64).default([]),
    /** Thermocouple class of the bench's probes; Class 2 is the general-purpose class, the wider (safer) band. */
    toleranceClass: toleranceClassSchema.default('iec-60584-1-class-2'),
    /** Judge the normalised peak (reference room + delta) instead of the absolute peak. */
    useNormalizedPeak: z.boolean().default(false),
    rubric: verdictRubricSchema.prefault({}),
  })
  .refine(
    (options) => options.loadEndS === null || options.loadStartS === null || options.loadEndS > options.loadStartS,
    {
      message: 'The load must end after it starts.',
      path: ['loadEndS'],
    },
  );
export type AnalysisOptions = z.infer<typeof analysisOptionsSchema>;
export type AnalysisOptionsInput = z.input<typeof analysisOptionsSchema>;

export const analysisRequestSchema = z.object({
  mapping: columnMappingSchema.optional(),
  options: analysisOptionsSchema.prefault({}),
});
export type AnalysisRequest = z.infer<typeof analysisRequestSchema>;
export type AnalysisRequestInput = z.input<typeof analysisRequestSchema>;

export const parseErrorCodes = [
  'empty-file',
  'no-header',
  'no-numeric-data',
  'too-few-rows',
  'malformed-row',
  'extra-cells',
  'no-time-column',
  'unparseable-time',
  'non-monotonic-time',
  'not-a-number',
  'mixed-units',
  'absurd-value',
  'unknown-column',
  'mapping-incomplete',
  'cold-junction-missing',
  'too-many-errors',
  /** Refused before reading (shared/upload-limits logAnalysisLimits): a file of this shape would hold a worker long. */
  'line-too-long',
  'too-many-columns',
  'too-many-cells',
] as const;
export const parseErrorCodeSchema = z.enum(parseErrorCodes);
export type ParseErrorCode = z.infer<typeof parseErrorCodeSchema>;

/** row: 1-based line in the uploaded file; column: the header name. Either is null when the error is not tied to one. */
export const parseErrorSchema = z.object({
  row: z.number().int().positive().nullable(),
  column: z.string().nullable(),
  code: parseErrorCodeSchema,
  message: z.string(),
});
export type ParseError = z.infer<typeof parseErrorSchema>;

export const previewColumnSchema = z.object({
  index: z.number().int().nonnegative(),
  name: z.string(),
  guessedRole: columnRoleSchema,
  guessedUnit: temperatureUnitSchema.nullable(),
});
export type PreviewColumn = z.infer<typeof previewColumnSchema>;

export const logPreviewSchema = z.object({
  delimiter: z.enum([',', ';', '\t']),
  decimalSeparator: z.enum(['.', ',']),
  preambleLines: z.array(z.string()),
  headerRow: z.number().int().positive(),
  columns: z.array(previewColumnSchema),
  timeColumn: z.string().nullable(),
  timeFormat: timeFormatSchema.nullable(),
  /** The first data rows as written in the file. */
  rows: z.array(z.array(z.string())),
  /** Lines after the header, blank lines within the data included; the analysis counts the samples exactly. */
  dataRowCount: z.number().int().nonnegative(),
  /** How the time column reads in the first rows when that needs saying (stamps repeating at a steady rate), else null. */
  timeNote: z.string().nullable(),
  /** Best guess from header names, null when no VRM column could be guessed. Always needs the tester's confirmation. */
  guessedMapping: columnMappingSchema.nullable(),
});
export type LogPreview = z.infer<typeof logPreviewSchema>;

export const qaFlagCodes = [
  'ambient-out-of-range',
  'ambient-drift',
  'ambient-missing',
  'soak-too-short',
  'not-steady',
  'short-of-five-tau',
  'gaps',
  'probe-dropout',
  'probe-dead',
  'probe-spike',
  'manual-entry',
  'mapping-guessed',
  'calibration-overdue',
] as const;
export const qaFlagCodeSchema = z.enum(qaFlagCodes);
export type QaFlagCode = z.infer<typeof qaFlagCodeSchema>;

export const qaFlagSchema = z.object({
  code: qaFlagCodeSchema,
  /** The flag in words for people (qaFlagLabels); the code is for programs. */
  label: z.string(),
  severity: z.enum(['warning', 'info']),
  message: z.string(),
  channel: z.string().nullable(),
  atS: z.number().nullable(),
});
export type QaFlag = z.infer<typeof qaFlagSchema>;

export const channelFiguresSchema = z.object({
  column: z.string(),
  unit: temperatureUnitSchema,
  peakC: z.number().nullable(),
  peakAtS: z.number().nullable(),
  minC: z.number().nullable(),
  steadyStateMeanC: z.number().nullable(),
  steadyStateChangeC: z.number().nullable(),
  reachedSteadyState: z.boolean(),
  /** The probe has no reading at all in the analysed window (a dead or unplugged probe). */
  dead: z.boolean(),
  /** Steady state a good first-order fit predicts for this probe (see riseFitSchema.goodFit); null without one. */
  predictedSteadyC: z.number().nullable(),
  gapSamples: z.number().int().nonnegative(),
  spikeCount: z.number().int().nonnegative(),
});
export type ChannelFigures = z.infer<typeof channelFiguresSchema>;

export const riseFitSchema = z.object({
  channel: z.string(),
  loadStartS: z.number(),
  startC: z.number(),
  riseC: z.number(),
  tauS: z.number(),
  predictedSteadyC: z.number(),
  rmsResidualC: z.number(),
  loadedS: z.number(),
  soakAtLeastFiveTau: z.boolean(),
  /** The fit is good enough to predict the plateau (the criterion is `fitRule`); only then may a verdict use it. */
  goodFit: z.boolean(),
  fitRule: z.string(),
});
export type RiseFit = z.infer<typeof riseFitSchema>;

export const timeGapSchema = z.object({
  startS: z.number(),
  endS: z.number(),
  missingSamples: z.number().int().nonnegative(),
});
export const dropoutSchema = z.object({
  channel: z.string(),
  startS: z.number(),
  endS: z.number(),
  samples: z.number().int().positive(),
});
export const spikeSchema = z.object({ channel: z.string(), atS: z.number(), rawC: z.number(), medianC: z.number() });

export const throttleSchema = z.object({
  detected: z.boolean(),
  source: z.enum(['clock', 'power', 'manual', 'none']),
  firstAtS: z.number().nullable(),
  shareThrottled: z.number().min(0).max(1).nullable(),
  /** Loaded level drops are measured against: the loaded median, or the first five loaded minutes' when higher. */
  loadedMedian: z.number().nullable(),
  threshold: z.number().nullable(),
  episodes: z.array(z.object({ startS: z.number(), endS: z.number() })),
});
export type Throttle = z.infer<typeof throttleSchema>;

/**
 * final: judged on the measured peak of a complete, settled soak (or a throttle, which more soak cannot undo);
 * provisional: the soak is unfinished, judged on the steady state a good first-order fit predicts;
 * withheld: no verdict yet, `rule` says why.
 */
export const verdictStatuses = ['final', 'provisional', 'withheld'] as const;
export const verdictStatusSchema = z.enum(verdictStatuses);
export type VerdictStatus = z.infer<typeof verdictStatusSchema>;

/** A stored verdict as lists show it: its status, and its label in words with the status; null before any verdict. */
export const verdictReadingFields = {
  verdictStatus: verdictStatusSchema.nullable(),
  verdictLabel: z.string().nullable(),
};

/** How a QA flag bears on the verdict: it withholds it, makes it provisional, or is to be read with it. */
export const verdictConcernSchema = z.object({
  code: qaFlagCodeSchema,
  label: z.string(),
  effect: z.enum(['withholds', 'makes-provisional', 'read-with']),
});
export type VerdictConcern = z.infer<typeof verdictConcernSchema>;

export const verdictSchema = z.object({
  status: verdictStatusSchema,
  /** The rubric's verdict; null when withheld. */
  code: verdictCodeSchema.nullable(),
  /** In words, the status included: "Warm", "Provisional: Warm", "No verdict yet". */
  label: z.string(),
  rule: z.string(),
  /** What was judged: the measured peak, the predicted steady state, absolute or normalised; null when withheld. */
  basis: z.enum(['absolute', 'normalized']).nullable(),
  judgedFrom: z.enum(['measured-peak', 'predicted-steady-state']).nullable(),
  judgedC: z.number().nullable(),
  /** The QA flags that bear on this verdict, in words, those that withhold it or make it provisional first. */
  concerns: z.array(verdictConcernSchema),
});
export type Verdict = z.infer<typeof verdictSchema>;

export const analysisResultSchema = z.object({
  peakC: z.number(),
  peakAtS: z.number(),
  peakChannel: z.string(),
  /** Highest final-window mean over the VRM probes; null when no probe has a reading in the final window. */
  steadyStateMeanC: z.number().nullable(),
  reachedSteadyState: z.boolean(),
  steadyStateRule: z.string(),
  ambientMeanC: z.number().nullable(),
  ambientMinC: z.number().nullable(),
  ambientMaxC: z.number().nullable(),
  ambientDriftC: z.number().nullable(),
  ambientFinalWindowMeanC: z.number().nullable(),
  deltaOverAmbientC: z.number().nullable(),
  normalizedPeakC: z.number().nullable(),
  referenceRoomC: z.number(),
  prediction: riseFitSchema.nullable(),
  predictionNote: z.string().nullable(),
  startedAt: z.string().nullable(),
  /** From the load start to the last loaded sample. */
  soakS: z.number(),
  requiredSoakS: z.number(),
  /** From the first to the last sample of the file. */
  loggedS: z.number(),
  loadStartS: z.number(),
  /** First sample after the load (the cool-down tail is left out from here); null when the load ran to the end. */
  loadEndS: z.number().nullable(),
  loadEndSource: z.enum(['detected', 'manual', 'none']),
  /** How the time column was read when it needed explaining (repeated stamps spread evenly, …). */
  readNotes: z.array(z.string()),
  sampleIntervalS: z.number(),
  sampleRateHz: z.number(),
  sampleCount: z.number().int(),
  gaps: z.array(timeGapSchema),
  dropouts: z.array(dropoutSchema),
  spikes: z.array(spikeSchema),
  throttle: throttleSchema,
  uncertainty: z.object({
    toleranceClass: toleranceClassSchema,
    standard: z.string(),
    peakToleranceC: z.number().nullable(),
    note: z.string().nullable(),
  }),
  flags: z.array(qaFlagSchema),
  verdict: verdictSchema,
  channels: z.array(channelFiguresSchema),
});
export type AnalysisResult = z.infer<typeof analysisResultSchema>;

/** 200 response of POST /api/log-check/analyse. */
export const analysisPreviewResponseSchema = z.object({ preview: logPreviewSchema, analysis: analysisResultSchema });
export type AnalysisPreviewResponse = z.infer<typeof analysisPreviewResponseSchema>;

/**
 * `error.details` of the 422 log_parse_failed of POST /api/log-check/analyse: the preview when the table itself could be
 * read (else null), and every parse error.
 */
export const analysisPreviewFailureSchema = z.object({
  preview: logPreviewSchema.nullable(),
  errors: z.array(parseErrorSchema).min(1),
});
export type AnalysisPreviewFailure = z.infer<typeof analysisPreviewFailureSchema>;
