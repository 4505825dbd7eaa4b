import { z } from 'zod';
import { instantSchema, pathIdsSchema } from './common';
import {
  analysisOptionsSchema,
  columnMappingSchema,
  qaFlagSchema,
  verdictCodeSchema,
  verdictReadingFields,
  verdictRubricSchema,
} from './analysis';
import { decimalSchema, idSchema, namedRefSchema, personRefSchema, requiredTextSchema } from './planning-fields';
import { dateRanges, zonedInstant } from './dates';
import { optionalMultiLineText } from './text';

export const runSources = ['logger', 'manual'] as const;
export const runSourceSchema = z.enum(runSources);
export const runReviewStates = ['pending', 'accepted', 'sent-back'] as const;
export const runReviewStateSchema = z.enum(runReviewStates);
export const runReviewStateLabels: Record<(typeof runReviewStates)[number], string> = {
  pending: 'Waiting for review',
  accepted: 'Accepted',
  'sent-back': 'Sent back for retest',
};

/** What every run records besides its data. */
const runFacts = {
  firmwareVersion: requiredTextSchema(100, 'Enter the firmware (BIOS) version the board ran.'),
  benchId: idSchema.nullable().optional(),
  /** When the soak started, as an instant (the client converts the tester's local time and names the zone). */
  startedAt: zonedInstant(dateRanges.booking),
  notes: optionalMultiLineText(4000),
  /** Required when the run starts outside every booking of the cell; kept with the run. */
  outsideBookingReason: optionalMultiLineText(500),
};

/** The JSON part of a logger-file run (multipart field `request`, beside the `file`). */
export const loggerRunRequestSchema = z.strictObject({
  ...runFacts,
  mapping: columnMappingSchema,
  options: analysisOptionsSchema.optional(),
  /** Remember this mapping for the cell's bench profile (the next upload starts from it). */
  rememberMapping: z.boolean().default(true),
});
export type LoggerRunRequest = z.input<typeof loggerRunRequestSchema>;
export type ParsedLoggerRunRequest = z.output<typeof loggerRunRequestSchema>;

/** A run entered by hand when no log exists: peak and ambient. Marked "manual" everywhere it is shown. */
export const manualRunRequestSchema = z.strictObject({
  ...runFacts,
  manualPeakC: decimalSchema(-20, 200, 1, '°C'),
  manualAmbientC: decimalSchema(-20, 60, 1, '°C'),
  throttled: z.boolean().default(false),
});
export type ManualRunRequest = z.input<typeof manualRunRequestSchema>;
export type ParsedManualRunRequest = z.output<typeof manualRunRequestSchema>;

export const vrmLoadSchema = z.object({
  packagePowerW: z.number(),
  coreVoltageV: z.number(),
  coreCurrentA: z.number(),
  effectivePhases: z.number().int(),
  totalStages: z.number().int(),
  currentPerPhaseA: z.number(),
  currentPerStageA: z.number(),
  stageRatingA: z.number(),
  stageLoadPercent: z.number(),
  /** The assumption behind the figures, in words. */
  assumption: z.string(),
});
export type VrmLoadFigures = z.infer<typeof vrmLoadSchema>;

export const storedFileSchema = z.object({
  id: z.number().int(),
  originalName: z.string(),
  byteSize: z.number().int(),
  sha256: z.string(),
  downloadUrl: z.string(),
});

export const runAnalysisSummarySchema = z.object({
  id: z.number().int(),
  engineVersion: z.string(),
  createdAt: instantSchema,
  createdBy: personRefSchema,
  verdict: verdictCodeSchema.nullable(),
  /** Final, provisional (judged on the predicted steady state) or withheld (verdict null): never shown as final. */
  ...verdictReadingFields,
  verdictRule: z.string().nullable(),
  peakC: z.number().nullable(),
  ambientC: z.number().nullable(),
  deltaOverAmbientC: z.number().nullable(),
  normalisedPeakC: z.number().nullable(),
  throttledS: z.number().nullable(),
  flags: z.array(qaFlagSchema),
  /** Mapping, options and rubric the engine was given. */
  parameters: z.record(z.string(), z.unknown()),
});
export type RunAnalysisSummary = z.infer<typeof runAnalysisSummarySchema>;

export const testRunSchema = z.object({
  id: z.number().int(),
  cellId: z.number().int(),
  roundupId: z.number().int(),
  tester: personRefSchema,
  bench: namedRefSchema.nullable(),
  bookingId: z.number().int().nullable(),
  firmwareVersion: z.string(),
  startedAt: instantSchema,
  notes: z.string().nullable(),
  source: runSourceSchema,
  loggerFile: storedFileSchema.nullable(),
  outsideBookingReason: z.string().nullable(),
  reviewState: runReviewStateSchema,
  reviewReason: z.string().nullable(),
  reviewedBy: personRefSchema.nullable(),
  reviewedAt: instantSchema.nullable(),
  submittedAt: instantSchema,
  isRunOfRecord: z.boolean(),
  /** The newest analysis: the one that counts. Earlier ones stay, unchanged, in `analyses`. */
  analysis: runAnalysisSummarySchema,
  /** Every analysis of the run, oldest first, each with the mapping, options and rubric it was given. */
  analyses: z.array(runAnalysisSummarySchema),
  vrmLoad: vrmLoadSchema.nullable(),
  /** What the signed-in user may do with this run now. */
  actions: z.array(z.enum(['accept', 'send-back', 'mark-of-record', 'reanalyse'])),
});
export type TestRun = z.infer<typeof testRunSchema>;

export const firmwareGroupSchema = z.object({
  firmwareVersion: z.string(),
  runs: z.number().int(),
  meanPeakC: z.number(),
  /** Student-t 95 % interval of the mean peak; null with fewer than two runs. */
  ciLowC: z.number().nullable(),
  ciHighC: z.number().nullable(),
  /** Mean peak minus the first firmware's mean peak (null for the first group). */
  differenceFromFirstC: z.number().nullable(),
});

export const cellRunsSchema = z.object({
  cellId: z.number().int(),
  roundupId: z.number().int(),
  productName: z.string(),
  loadConfigurationName: z.string(),
  runOfRecordId: z.number().int().nullable(),
  runs: z.array(testRunSchema),
  byFirmware: z.array(firmwareGroupSchema),
  /** The mapping remembered for this roundup's bench profile, to start the next upload from. */
  rememberedMapping: columnMappingSchema.nullable(),
});
export type CellRuns = z.infer<typeof cellRunsSchema>;

export const createRunResponseSchema = z.object({
  run: testRunSchema,
  /** Set when the same file (by SHA-256) was already uploaded to this cell: the earlier run's id. */
  sameFileAsRunId: z.number().int().nullable(),
});

export const runParamsSchema = pathIdsSchema('runId');
export const cellRunsParamsSchema = pathIdsSchema('cellId');

export const reviewRunRequestSchema = z.strictObject({
  decision: z.enum(['accept', 'send-back']),
  /** Required to accept a flagged run and to send a run back. */
  reason: optionalMultiLineText(2000),
});
export type ReviewRunRequest = z.input<typeof reviewRunRequestSchema>;
export type ParsedReviewRunRequest = z.output<typeof reviewRunRequestSchema>;

export const reanalyseRunRequestSchema = z.strictObject({
  mapping: columnMappingSchema.optional(),
  options: analysisOptionsSchema.optional(),
});
export type ParsedReanalyseRunRequest = z.output<typeof reanalyseRunRequestSchema>;

export type ReanalyseRunRequest = z.input<typeof reanalyseRunRequestSchema>;

export const roundupRubricRequestSchema = z.strictObject({ rubric: verdictRubricSchema.nullable() });

/** One cell of the results matrix: the run of record's figures (or the newest run's when none is chosen). */
export const resultCellSchema = z.object({
  cellId: z.number().int(),
  entryId: z.number().int(),
  loadConfigurationId: z.number().int(),
  runId: z.number().int().nullable(),
  runCount: z.number().int(),
  isRunOfRecord: z.boolean(),
  source: runSourceSchema.nullable(),
  peakC: z.number().nullable(),
  deltaOverAmbientC: z.number().nullable(),
  verdict: verdictCodeSchema.nullable(),
  ...verdictReadingFields,
  throttled: z.boolean(),
  flagCount: z.number().int(),
  reviewState: runReviewStateSchema.nullable(),
});
export type ResultCell = z.infer<typeof resultCellSchema>;

export const roundupResultsSchema = z.object({
  roundupId: z.number().int(),
  rubric: verdictRubricSchema,
  rubricIsDefault: z.boolean(),
  cells: z.array(resultCellSchema),
});
export type RoundupResults = z.infer<typeof roundupResultsSchema>;
