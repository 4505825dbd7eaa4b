import { z } from 'zod';
import { instantSchema, pathIdsSchema } from './common';
import { verdictCodeSchema, verdictReadingFields } from './analysis';
import { loadSettingsModeSchema } from './load-configurations';
import { amountMinorSchema, currencySchema, moneySchema, personRefSchema } from './planning-fields';
import { optionalMultiLineText, singleLineText } from './text';
import { editorialLabels } from '../domain/editorial/editorial-labels';

export const editorialLabelSchema = z.enum(editorialLabels, 'Choose a label from the list.');

/** An editor's verdict on a product: label, a one-line "best for" and the price at publication. */
export const setVerdictRequestSchema = z.strictObject({
  label: editorialLabelSchema,
  bestFor: singleLineText(160, 'Say in one line who this board is best for.'),
  price: z.strictObject({ amountMinor: amountMinorSchema, currency: currencySchema }),
  /** Required when the label goes against the rubric verdicts of the product's runs of record. */
  reason: optionalMultiLineText(2000),
});
export type SetVerdictRequest = z.input<typeof setVerdictRequestSchema>;
export type ParsedSetVerdictRequest = z.output<typeof setVerdictRequestSchema>;

export const verdictEntryParamsSchema = pathIdsSchema('id', 'entryId');

/** The rubric verdict of one run of record: the evidence shown beside the editor's label. */
export const verdictEvidenceSchema = z.object({
  loadConfigurationId: z.number().int(),
  loadConfigurationName: z.string(),
  settingsMode: loadSettingsModeSchema,
  hasRunOfRecord: z.boolean(),
  runId: z.number().int().nullable(),
  cellId: z.number().int(),
  verdictCode: verdictCodeSchema.nullable(),
  ...verdictReadingFields,
  throttled: z.boolean(),
  peakC: z.number().nullable(),
});
export type VerdictEvidenceDto = z.infer<typeof verdictEvidenceSchema>;

export const productVerdictSchema = z.object({
  entryId: z.number().int(),
  productId: z.number().int(),
  productName: z.string(),
  evidence: z.array(verdictEvidenceSchema),
  /** The newest catalog price in the roundup's region, to start the price at publication from. */
  catalogPrice: moneySchema.nullable(),
  verdict: z
    .object({
      label: editorialLabelSchema,
      bestFor: z.string(),
      price: moneySchema,
      reason: z.string().nullable(),
      updatedBy: personRefSchema.nullable(),
      updatedAt: instantSchema,
    })
    .nullable(),
  /** Where the current label goes against the evidence (empty: it agrees); a reason must answer these. */
  contradictions: z.array(z.string()),
});
export type ProductVerdict = z.infer<typeof productVerdictSchema>;

export const roundupVerdictsSchema = z.object({
  roundupId: z.number().int(),
  currency: z.string(),
  editable: z.boolean(),
  products: z.array(productVerdictSchema),
});
export type RoundupVerdicts = z.infer<typeof roundupVerdictsSchema>;
