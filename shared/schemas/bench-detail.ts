import { z } from 'zod';
import { instantSchema, pathIdsSchema } from './common';
import { benchProfileSchema } from './bench-profiles';
import { benchSchema } from './benches';
import { calendarDateSchema, optionalTextSchema, personRefSchema, requiredTextSchema } from './planning-fields';
import { planningDateSchema } from './dates';
import { multiLineText } from './text';

export const instrumentKinds = ['probe', 'logger'] as const;
export const instrumentKindLabels: Record<(typeof instrumentKinds)[number], string> = {
  probe: 'Probe',
  logger: 'Logger',
};

/** A probe or logger that belongs to a bench, with its calibration. */
export const createInstrumentRequestSchema = z.strictObject({
  kind: z.enum(instrumentKinds, { error: 'Choose probe or logger.' }),
  label: requiredTextSchema(120, 'Name it, e.g. “Probe 1, V-core rear”.'),
  model: optionalTextSchema(120),
  serialNumber: optionalTextSchema(80),
  calibratedOn: planningDateSchema.nullable().default(null),
  /** Months between calibrations; a year is common practice for thermocouples and loggers (no source). */
  calibrationIntervalMonths: z
    .number({ error: 'Enter the months between calibrations.' })
    .int('Enter whole months.')
    .min(1, 'At least one month.')
    .max(60, 'At most 60 months.'),
});
export type CreateInstrumentRequest = z.input<typeof createInstrumentRequestSchema>;
export type ParsedCreateInstrumentRequest = z.output<typeof createInstrumentRequestSchema>;

export const updateInstrumentRequestSchema = createInstrumentRequestSchema.partial();
export type UpdateInstrumentRequest = z.input<typeof updateInstrumentRequestSchema>;
export type ParsedUpdateInstrumentRequest = z.output<typeof updateInstrumentRequestSchema>;

export const instrumentSchema = z.object({
  id: z.number().int(),
  kind: z.enum(instrumentKinds),
  label: z.string(),
  model: z.string().nullable(),
  serialNumber: z.string().nullable(),
  calibratedOn: calendarDateSchema.nullable(),
  calibrationIntervalMonths: z.number().int(),
  /** Null when it has never been calibrated. */
  nextCalibrationDue: calendarDateSchema.nullable(),
  /** Never calibrated, or its next calibration date has passed. */
  calibrationOverdue: z.boolean(),
});
export type Instrument = z.infer<typeof instrumentSchema>;

export const createMaintenanceRequestSchema = z.strictObject({
  doneOn: planningDateSchema,
  description: multiLineText(500, 'Say what was done.'),
});
export type CreateMaintenanceRequest = z.input<typeof createMaintenanceRequestSchema>;
export type ParsedCreateMaintenanceRequest = z.output<typeof createMaintenanceRequestSchema>;

export const maintenanceEntrySchema = z.object({
  id: z.number().int(),
  doneOn: calendarDateSchema,
  description: z.string(),
  recordedBy: personRefSchema.nullable(),
  createdAt: instantSchema,
});
export type MaintenanceEntry = z.infer<typeof maintenanceEntrySchema>;

/** One bench's page: the bench, the set-up it is built to, its probes and logger, and what was done to it. */
export const benchDetailSchema = z.object({
  bench: benchSchema,
  setUp: benchProfileSchema.nullable(),
  instruments: z.array(instrumentSchema),
  maintenance: z.array(maintenanceEntrySchema),
});
export type BenchDetail = z.infer<typeof benchDetailSchema>;

export const instrumentParamsSchema = pathIdsSchema('id', 'instrumentId');
