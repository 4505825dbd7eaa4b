import { z } from 'zod';
import { archivableQuerySchema, archivableRecordSchema, decimalSchema, requiredTextSchema } from './planning-fields';
import { optionalMultiLineText } from './text';
import { whenValid } from './checks';

export const loadSettingsModes = ['stock', 'fixed'] as const;
export const loadSettingsModeSchema = z.enum(loadSettingsModes);
export type LoadSettingsMode = z.infer<typeof loadSettingsModeSchema>;
export const loadSettingsModeLabels: Record<LoadSettingsMode, string> = {
  stock: 'Stock settings',
  fixed: 'Fixed clock and voltage',
};

/**
 * A load configuration: one CPU with one set of settings and the load it puts on the board. Reusable across
 * roundups; a roundup holds an ordered list of them, and each becomes a matrix column.
 */
const loadConfigurationFields = {
  name: requiredTextSchema(120, 'Name the configuration.'),
  /** The CPU used, in words (invented names only in demo data). */
  cpuDescription: requiredTextSchema(200),
  settingsMode: loadSettingsModeSchema,
  /** All-core clock in MHz; required when settingsMode is fixed, null for stock. */
  fixedClockMhz: z.number().int().min(100).max(10000).nullable().default(null),
  /** Further settings in words (power limits, load-line calibration, the load program). */
  settingsNotes: optionalMultiLineText(500),
  /** Expected package power under the load, W, one decimal. */
  expectedPackagePowerW: decimalSchema(1, 2000, 1, 'W'),
  /** Core voltage under the load (set for fixed, expected for stock), V, three decimals. */
  coreVoltageV: decimalSchema(0.5, 2, 3, 'V'),
  /** How long the load runs before readings count, minutes. */
  soakMinutes: z.number().int().min(1).max(1440),
};

/** A fixed configuration needs its clock (forms run the same rule beside their number fields). */
export function fixedNeedsClock(
  value: { settingsMode?: LoadSettingsMode; fixedClockMhz?: number | null },
  ctx: z.RefinementCtx,
) {
  if (value.settingsMode === 'fixed' && !value.fixedClockMhz) {
    ctx.addIssue({ code: 'custom', path: ['fixedClockMhz'], message: 'A fixed configuration needs its clock in MHz.' });
  }
}

export const createLoadConfigurationRequestSchema = z
  .strictObject(loadConfigurationFields)
  .superRefine(fixedNeedsClock, { when: whenValid('settingsMode', 'fixedClockMhz') });
export type CreateLoadConfigurationRequest = z.input<typeof createLoadConfigurationRequestSchema>;
export type ParsedCreateLoadConfigurationRequest = z.output<typeof createLoadConfigurationRequestSchema>;

/** Partial update; the server re-checks the fixed-needs-clock rule on the merged record. */
export const updateLoadConfigurationRequestSchema = z
  .strictObject({
    ...loadConfigurationFields,
    fixedClockMhz: z.number().int().min(100).max(10000).nullable(),
    archived: z.boolean(),
  })
  .partial();
export type UpdateLoadConfigurationRequest = z.input<typeof updateLoadConfigurationRequestSchema>;
export type ParsedUpdateLoadConfigurationRequest = z.output<typeof updateLoadConfigurationRequestSchema>;

export const loadConfigurationSchema = archivableRecordSchema({
  cpuDescription: z.string(),
  settingsMode: loadSettingsModeSchema,
  fixedClockMhz: z.number().int().nullable(),
  settingsNotes: z.string().nullable(),
  expectedPackagePowerW: z.number(),
  coreVoltageV: z.number(),
  soakMinutes: z.number().int(),
});
export type LoadConfiguration = z.infer<typeof loadConfigurationSchema>;
export const loadConfigurationListSchema = z.object({ loadConfigurations: z.array(loadConfigurationSchema) });

export const loadConfigurationListQuerySchema = archivableQuerySchema;
