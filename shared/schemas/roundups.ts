import { z } from 'zod';
import { instantSchema, pathIdsSchema } from './common';
import { priceSchema, productBriefSchema, productCategorySchema } from './catalog';
import { benchProfileSchema } from './bench-profiles';
import { loadConfigurationSchema } from './load-configurations';
import { matrixProgressSchema } from './matrix';
import { sampleSchema } from './samples';
import {
  amountMinorSchema,
  calendarDateSchema,
  currencySchema,
  idSchema,
  personRefSchema,
  regionSchema,
  requiredTextSchema,
  timeZoneSchema,
  timestampFields,
} from './planning-fields';
import { roundupStateSchema } from './roundup-state';
import { bandFits } from '../domain/planning/price-band';
import { planningDateSchema, todayIn } from './dates';
import { whenValid } from './checks';
import { isValidTimeZone } from '../domain/planning/loan-overdue';

/** Inclusive price bounds in minor units of one currency, for one region. */
export const priceBandSchema = z
  .strictObject({
    minMinor: amountMinorSchema,
    maxMinor: amountMinorSchema,
    currency: currencySchema,
    region: regionSchema,
  })
  .refine((band) => band.minMinor <= band.maxMinor, {
    path: ['maxMinor'],
    message: 'The upper bound must not be below the lower bound.',
    when: whenValid('minMinor', 'maxMinor'),
  });
export type PriceBandInput = z.input<typeof priceBandSchema>;

const uniqueIds = z
  .array(idSchema)
  .max(20)
  .refine((ids) => new Set(ids).size === ids.length, 'List each configuration once.');

/**
 * A new roundup's target publish date cannot already be past: it is compared with today in the roundup's time
 * zone (UTC when the zone is not valid yet). Later edits may keep a past date (a late roundup stays late).
 */
export const createRoundupRequestSchema = z
  .strictObject({
    title: requiredTextSchema(200, 'Give the roundup a title.'),
    category: productCategorySchema.default('motherboard'),
    platform: requiredTextSchema(80, 'Enter the platform.'),
    priceBand: priceBandSchema,
    targetPublishDate: planningDateSchema.nullable().default(null),
    /** The outlet's time zone for this roundup: due dates and loan return-by dates end at its midnight. */
    timeZone: timeZoneSchema.default('UTC'),
    benchProfileId: idSchema.nullable().default(null),
    /** Load configurations in test order. */
    loadConfigurationIds: uniqueIds.default([]),
  })
  .superRefine(
    (roundup, ctx) => {
      if (!roundup.targetPublishDate) return;
      const today = todayIn(isValidTimeZone(roundup.timeZone) ? roundup.timeZone : 'UTC');
      if (roundup.targetPublishDate < today) {
        ctx.addIssue({
          code: 'custom',
          path: ['targetPublishDate'],
          message: `The target publish date has passed: choose today (${today}) or later.`,
        });
      }
    },
    { when: whenValid('targetPublishDate') },
  );
export type CreateRoundupRequest = z.input<typeof createRoundupRequestSchema>;
export type ParsedCreateRoundupRequest = z.output<typeof createRoundupRequestSchema>;

/** Partial update of the plan's header. The state changes through POST /api/roundups/:id/state. */
export const updateRoundupRequestSchema = z
  .strictObject({
    title: requiredTextSchema(200, 'Give the roundup a title.'),
    category: productCategorySchema,
    platform: requiredTextSchema(80, 'Enter the platform.'),
    priceBand: priceBandSchema,
    targetPublishDate: planningDateSchema.nullable(),
    timeZone: timeZoneSchema,
    benchProfileId: idSchema.nullable(),
  })
  .partial();
export type UpdateRoundupRequest = z.input<typeof updateRoundupRequestSchema>;
export type ParsedUpdateRoundupRequest = z.output<typeof updateRoundupRequestSchema>;

/** Replace the ordered list of load configurations (adds and removes matrix columns). */
export const setRoundupLoadConfigurationsRequestSchema = z.strictObject({ loadConfigurationIds: uniqueIds });
export type SetRoundupLoadConfigurationsRequest = z.input<typeof setRoundupLoadConfigurationsRequestSchema>;

export const roundupStateChangeRequestSchema = z.strictObject({ to: roundupStateSchema });

export const roundupListQuerySchema = z.object({
  state: z.preprocess((v) => (v === '' ? undefined : v), roundupStateSchema.optional()),
});
export type ParsedRoundupListQuery = z.output<typeof roundupListQuerySchema>;

export const priceBandOutSchema = z.object({
  minMinor: z.number().int(),
  maxMinor: z.number().int(),
  currency: z.string(),
  region: z.string(),
});

export const roundupSummarySchema = z.object({
  id: z.number().int(),
  title: z.string(),
  category: productCategorySchema,
  platform: z.string(),
  /** Stored code; label from roundupStateLabels. */
  state: roundupStateSchema,
  priceBand: priceBandOutSchema,
  targetPublishDate: calendarDateSchema.nullable(),
  timeZone: z.string(),
  benchProfileId: z.number().int().nullable(),
  testedEntryCount: z.number().int(),
  referenceEntryCount: z.number().int(),
  progress: matrixProgressSchema,
  overdueSampleCount: z.number().int(),
  createdBy: personRefSchema.nullable(),
  stateChangedAt: instantSchema,
  ...timestampFields,
});
export type RoundupSummary = z.infer<typeof roundupSummarySchema>;
export const roundupListSchema = z.object({ roundups: z.array(roundupSummarySchema) });

export const bandFitSchema = z.enum(bandFits);

/** How a product's latest price in the roundup's region compares with the band (no currency conversion). */
export const priceCheckSchema = z.object({
  fit: bandFitSchema,
  latestPrice: priceSchema.nullable(),
  /** No price, or the latest is older than PRICE_STALE_AFTER_DAYS. */
  stale: z.boolean(),
  /** A sentence for the editor, or null when in the band with a current price. */
  warning: z.string().nullable(),
});
export type PriceCheck = z.infer<typeof priceCheckSchema>;

export const entryKinds = ['tested', 'reference'] as const;
export const entryKindSchema = z.enum(entryKinds);
export const entryKindLabels: Record<(typeof entryKinds)[number], string> = {
  tested: 'Tested in this roundup',
  reference: 'Reference (earlier results, not re-tested)',
};

export const roundupEntrySchema = z.object({
  id: z.number().int(),
  kind: entryKindSchema,
  position: z.number().int(),
  product: productBriefSchema,
  /** The latest regional price against the band; reference entries get no warning (the band does not apply). */
  priceCheck: priceCheckSchema,
  /** For reference entries: the earlier roundup whose results are shown. */
  referenceRoundup: z.object({ id: z.number().int(), title: z.string() }).nullable(),
  /** Tested entries have a sample; reference entries do not. */
  sample: sampleSchema.nullable(),
  addedBy: personRefSchema.nullable(),
  addedAt: instantSchema,
});
export type RoundupEntry = z.infer<typeof roundupEntrySchema>;
export const roundupEntryListSchema = z.object({ entries: z.array(roundupEntrySchema) });

export const roundupTransitionOptionSchema = z.object({
  to: roundupStateSchema,
  allowed: z.boolean(),
  /** What blocks the move; empty when allowed. */
  problems: z.array(z.string()),
});

export const roundupDetailSchema = roundupSummarySchema.extend({
  benchProfile: benchProfileSchema.nullable(),
  /** In test order (matrix column order). */
  loadConfigurations: z.array(loadConfigurationSchema),
  entries: z.array(roundupEntrySchema),
  /** Things in the plan worth a second look (e.g. a configuration soaking shorter than the profile requires). */
  planWarnings: z.array(z.string()),
  /** The next forward state and whether the roundup may move there now. */
  nextState: roundupTransitionOptionSchema.nullable(),
  /** The plan may change (entries, configurations, profile, band) only in these states. */
  planEditable: z.boolean(),
});
export type RoundupDetail = z.infer<typeof roundupDetailSchema>;

/** Add a catalog product. A reference entry needs the product to have accepted results in an earlier roundup. */
export const addRoundupEntryRequestSchema = z.strictObject({
  productId: idSchema,
  kind: entryKindSchema.default('tested'),
  /** Reference entries: which earlier roundup's results to show; defaults to the latest one that tested it. */
  referenceRoundupId: idSchema.nullable().default(null),
});
export type AddRoundupEntryRequest = z.input<typeof addRoundupEntryRequestSchema>;
export type ParsedAddRoundupEntryRequest = z.output<typeof addRoundupEntryRequestSchema>;

export const addRoundupEntryResponseSchema = z.object({
  entry: roundupEntrySchema,
  /** Price-band warnings for the added product (empty when its current price is inside the band). */
  warnings: z.array(z.string()),
});

export const entryParamsSchema = pathIdsSchema('id', 'entryId');

/**
 * Catalog products of the roundup's category and platform, not archived and not yet in the roundup, whose
 * latest price in the band's region is in the band's currency and within its inclusive bounds.
 */
export const roundupSuggestionsSchema = z.object({
  priceBand: priceBandOutSchema,
  suggestions: z.array(z.object({ product: productBriefSchema, priceCheck: priceCheckSchema })),
});
export type RoundupSuggestions = z.infer<typeof roundupSuggestionsSchema>;

/** Products with accepted results in earlier roundups, which this roundup can show as reference entries. */
export const referenceCandidateSchema = z.object({
  product: productBriefSchema,
  /** Earlier roundups with accepted results for the product, newest first. */
  testedIn: z.array(z.object({ roundupId: z.number().int(), title: z.string(), state: roundupStateSchema })),
});
export type ReferenceCandidate = z.infer<typeof referenceCandidateSchema>;
export const referenceCandidatesSchema = z.object({ candidates: z.array(referenceCandidateSchema) });

export const roundupHistoryEntrySchema = z.object({
  id: z.string(),
  action: z.string(),
  actor: personRefSchema.nullable(),
  at: instantSchema,
  details: z.record(z.string(), z.unknown()).nullable(),
});
export type RoundupHistoryEntry = z.infer<typeof roundupHistoryEntrySchema>;
/** Audit entries of the roundup (actions such as roundup.created, roundup.entry_added, roundup.cell_moved). */
export const roundupHistorySchema = z.object({ entries: z.array(roundupHistoryEntrySchema) });
