import { z } from 'zod';
import { archivableQuerySchema, archivableRecordSchema, decimalSchema, requiredTextSchema } from './planning-fields';
import { optionalMultiLineText } from './text';

/**
 * A bench profile: the test system a roundup is measured on. Reusable across roundups; a roundup refers to
 * one. Editing a profile that roundups use is recorded in each of those roundups' history.
 */
const benchProfileFields = {
  name: requiredTextSchema(120, 'Name the profile.'),
  /** Case (or open bench) and fans, with fan speeds. */
  caseAndFans: requiredTextSchema(300),
  cooler: requiredTextSchema(200),
  psu: requiredTextSchema(200),
  /** Memory kit and its settings (speed, timings, voltage). */
  memory: requiredTextSchema(300),
  /** Room temperature the bench is run at, °C, one decimal. */
  roomTempTargetC: decimalSchema(10, 40, 1, '°C'),
  /** Allowed deviation from the target, ± °C, one decimal. */
  roomTempToleranceC: decimalSchema(0, 10, 1, '°C'),
  /** Probe type, e.g. "type K thermocouple, 0.1 mm bead". */
  probeType: requiredTextSchema(120),
  /** Where the probes go, e.g. "board rear under the V-core stages, taped". */
  probePlacement: requiredTextSchema(300),
  /** Minimum soak before a reading counts, minutes. */
  requiredSoakMinutes: z.number().int().min(0).max(1440),
  notes: optionalMultiLineText(2000),
};

export const createBenchProfileRequestSchema = z.strictObject(benchProfileFields);
export type CreateBenchProfileRequest = z.input<typeof createBenchProfileRequestSchema>;
export type ParsedCreateBenchProfileRequest = z.output<typeof createBenchProfileRequestSchema>;

/** Partial update; `archived: true` hides the profile from pickers (roundups that use it keep it). */
export const updateBenchProfileRequestSchema = z
  .strictObject({ ...benchProfileFields, archived: z.boolean() })
  .partial();
export type UpdateBenchProfileRequest = z.input<typeof updateBenchProfileRequestSchema>;
export type ParsedUpdateBenchProfileRequest = z.output<typeof updateBenchProfileRequestSchema>;

export const benchProfileSchema = archivableRecordSchema({
  caseAndFans: z.string(),
  cooler: z.string(),
  psu: z.string(),
  memory: z.string(),
  roomTempTargetC: z.number(),
  roomTempToleranceC: z.number(),
  probeType: z.string(),
  probePlacement: z.string(),
  requiredSoakMinutes: z.number().int(),
  notes: z.string().nullable(),
});
export type BenchProfile = z.infer<typeof benchProfileSchema>;
export const benchProfileListSchema = z.object({ benchProfiles: z.array(benchProfileSchema) });

export const benchProfileListQuerySchema = archivableQuerySchema;
