import { z } from 'zod';
import { instantSchema, pathIdsSchema } from './common';
import {
  amountMinorSchema,
  calendarDateSchema,
  currencySchema,
  decimalSchema,
  optionalTextSchema,
  personRefSchema,
  regionSchema,
  requiredTextSchema,
  archivedFilterSchema,
  timestampFields,
} from './planning-fields';
import { phaseMultiplications, stagesPerPhaseProblem } from '../domain/planning/power-design';
import { roundupStateSchema } from './roundup-state';
import { priceObservedDateSchema, releaseDateSchema } from './dates';
import { optionalMultiLineText, queryText } from './text';
import { whenValid } from './checks';

// ---------------------------------------------------------------------------------------------------------------
// Codes and their labels

export const productCategories = ['motherboard'] as const;
export const productCategorySchema = z.enum(productCategories);
export type ProductCategory = z.infer<typeof productCategorySchema>;
export const productCategoryLabels: Record<ProductCategory, string> = { motherboard: 'Motherboards' };

export const formFactors = ['e-atx', 'atx', 'micro-atx', 'mini-itx'] as const;
export const formFactorSchema = z.enum(formFactors);
export type FormFactor = z.infer<typeof formFactorSchema>;
export const formFactorLabels: Record<FormFactor, string> = {
  'e-atx': 'E-ATX',
  atx: 'ATX',
  'micro-atx': 'Micro-ATX',
  'mini-itx': 'Mini-ITX',
};

/** Labels: phaseMultiplicationLabels in shared/domain/planning/power-design.ts. */
export const phaseMultiplicationSchema = z.enum(phaseMultiplications);

export const vcoreStageTypes = ['integrated-power-stage', 'discrete-mosfets'] as const;
export const vcoreStageTypeSchema = z.enum(vcoreStageTypes);
export type VcoreStageType = z.infer<typeof vcoreStageTypeSchema>;
export const vcoreStageTypeLabels: Record<VcoreStageType, string> = {
  'integrated-power-stage': 'Integrated power stage',
  'discrete-mosfets': 'Discrete high/low-side MOSFETs',
};

export const frontUsbCHeaders = ['none', 'usb-5g', 'usb-10g', 'usb-20g'] as const;
export const frontUsbCHeaderSchema = z.enum(frontUsbCHeaders);
export type FrontUsbCHeader = z.infer<typeof frontUsbCHeaderSchema>;
export const frontUsbCHeaderLabels: Record<FrontUsbCHeader, string> = {
  none: 'None',
  'usb-5g': 'USB-C 5 Gbit/s',
  'usb-10g': 'USB-C 10 Gbit/s',
  'usb-20g': 'USB-C 20 Gbit/s',
};

export const wifiGenerations = ['none', 'wifi-5', 'wifi-6', 'wifi-6e', 'wifi-7'] as const;
export const wifiGenerationSchema = z.enum(wifiGenerations);
export type WifiGeneration = z.infer<typeof wifiGenerationSchema>;
export const wifiGenerationLabels: Record<WifiGeneration, string> = {
  none: 'None',
  'wifi-5': 'Wi-Fi 5',
  'wifi-6': 'Wi-Fi 6',
  'wifi-6e': 'Wi-Fi 6E',
  'wifi-7': 'Wi-Fi 7',
};

/** LAN speeds offered in forms; the field takes any whole Mbit/s value (0 = no wired LAN). */
export const commonLanSpeedsMbps = [0, 1000, 2500, 5000, 10000] as const;

// ---------------------------------------------------------------------------------------------------------------
// Product input (create, update, CSV import)

const count = (max: number) =>
  z.number().int('Enter a whole number.').min(0, 'Cannot be negative.').max(max).nullable();

/**
 * The V-core power design. Every field may be null while unknown. `effectivePhases` is not sent: the server
 * computes it from controller phases and multiplication (shared/domain/planning/power-design.ts).
 */
export const powerDesignInputSchema = z
  .strictObject({
    controller: optionalTextSchema(80),
    controllerPhases: z.number().int().min(1).max(32).nullable().default(null),
    phaseMultiplication: phaseMultiplicationSchema.nullable().default(null),
    stagesPerPhase: z.number().int().min(1).max(4).nullable().default(null),
    vcoreStageType: vcoreStageTypeSchema.nullable().default(null),
    /** Marking or part label of the V-core stage, as printed on the part. */
    vcoreStagePart: optionalTextSchema(80),
    /** Continuous current rating of one V-core stage, in A, one decimal. */
    vcoreStageCurrentA: decimalSchema(1, 300, 1, 'A').nullable().default(null),
    /** Stages on the SoC rail. */
    socRailStages: z.number().int().min(0).max(16).nullable().default(null),
    /** Other rails in words, e.g. "1 stage graphics, 1 stage auxiliary". */
    otherRails: optionalMultiLineText(200),
    heatsinkNotes: optionalMultiLineText(500),
  })
  .superRefine(
    (design, ctx) => {
      if (design.phaseMultiplication && design.stagesPerPhase) {
        const problem = stagesPerPhaseProblem(design.phaseMultiplication, design.stagesPerPhase);
        if (problem) ctx.addIssue({ code: 'custom', path: ['stagesPerPhase'], message: problem });
      }
      if (design.phaseMultiplication && !design.controllerPhases) {
        ctx.addIssue({ code: 'custom', path: ['controllerPhases'], message: 'Enter the controller phases too.' });
      }
    },
    { when: whenValid('phaseMultiplication', 'stagesPerPhase', 'controllerPhases') },
  );
export type PowerDesignInput = z.input<typeof powerDesignInputSchema>;

/** Rear USB ports by speed (counts; null while unknown). */
export const rearUsbSchema = z.strictObject({
  usb2: count(20).default(null),
  usb5g: count(20).default(null),
  usb10g: count(20).default(null),
  usb20g: count(20).default(null),
  usb40g: count(20).default(null),
});
export type RearUsb = z.infer<typeof rearUsbSchema>;

export const featuresInputSchema = z.strictObject({
  rearUsb: rearUsbSchema.default({ usb2: null, usb5g: null, usb10g: null, usb20g: null, usb40g: null }),
  frontUsbCHeader: frontUsbCHeaderSchema.nullable().default(null),
  /** Fastest wired LAN port in Mbit/s; 0 = none. */
  lanSpeedMbps: z.number().int().min(0).max(100000).nullable().default(null),
  wifi: wifiGenerationSchema.nullable().default(null),
  m2Slots: count(12).default(null),
  sataPorts: count(16).default(null),
  /** Audio in words, e.g. "7.1 HD audio, optical out". */
  audio: optionalTextSchema(120),
  ioShieldPrefitted: z.boolean().nullable().default(null),
});
export type FeaturesInput = z.input<typeof featuresInputSchema>;

const productFields = {
  maker: requiredTextSchema(80, 'Enter the maker.'),
  model: requiredTextSchema(120, 'Enter the model.'),
  category: productCategorySchema.default('motherboard'),
  platform: requiredTextSchema(80, 'Enter the platform.'),
  socket: requiredTextSchema(40, 'Enter the socket.'),
  chipset: requiredTextSchema(40, 'Enter the chipset.'),
  formFactor: formFactorSchema,
  releaseDate: releaseDateSchema.nullable().default(null),
  powerDesign: powerDesignInputSchema.default(() => powerDesignInputSchema.parse({})),
  features: featuresInputSchema.default(() => featuresInputSchema.parse({})),
};

export const createProductRequestSchema = z.strictObject(productFields);
export type CreateProductRequest = z.input<typeof createProductRequestSchema>;
export type ProductInput = z.output<typeof createProductRequestSchema>;

/**
 * Partial update. `powerDesign` and `features` are replaced as a whole when sent (send the full group).
 * `archived: true` archives the product (hidden from suggestions and the default list); false restores it.
 */
export const updateProductRequestSchema = z
  .strictObject({
    maker: productFields.maker,
    model: productFields.model,
    category: productCategorySchema,
    platform: productFields.platform,
    socket: productFields.socket,
    chipset: productFields.chipset,
    formFactor: formFactorSchema,
    releaseDate: releaseDateSchema.nullable(),
    powerDesign: powerDesignInputSchema,
    features: featuresInputSchema,
    archived: z.boolean(),
  })
  .partial();
export type UpdateProductRequest = z.input<typeof updateProductRequestSchema>;

// ---------------------------------------------------------------------------------------------------------------
// Prices

export const createPriceRequestSchema = z.strictObject({
  region: regionSchema,
  currency: currencySchema,
  amountMinor: amountMinorSchema,
  observedOn: priceObservedDateSchema,
  /** Where the price was seen: shop name, or a note such as "maker's list price". */
  source: requiredTextSchema(200, 'Say where the price was seen.'),
});
export type CreatePriceRequest = z.input<typeof createPriceRequestSchema>;
export type ParsedCreatePriceRequest = z.output<typeof createPriceRequestSchema>;

export const priceSchema = z.object({
  id: z.number().int(),
  productId: z.number().int(),
  region: z.string(),
  currency: z.string(),
  amountMinor: z.number().int(),
  observedOn: calendarDateSchema,
  source: z.string(),
  recordedBy: personRefSchema.nullable(),
  recordedAt: instantSchema,
});
export type Price = z.infer<typeof priceSchema>;
export const priceListSchema = z.object({ prices: z.array(priceSchema) });
/** Price history query: optionally one region. */
export const priceListQuerySchema = z.object({
  region: z.preprocess((v) => (v === '' ? undefined : v), regionSchema.optional()),
});

// ---------------------------------------------------------------------------------------------------------------
// Product output

export const powerDesignSchema = z.object({
  controller: z.string().nullable(),
  controllerPhases: z.number().int().nullable(),
  phaseMultiplication: phaseMultiplicationSchema.nullable(),
  stagesPerPhase: z.number().int().nullable(),
  /** Computed: controller phases, doubled when the design uses doublers. */
  effectivePhases: z.number().int().nullable(),
  /** Computed: effective phases × stages per phase. */
  vcoreStageCount: z.number().int().nullable(),
  vcoreStageType: vcoreStageTypeSchema.nullable(),
  vcoreStagePart: z.string().nullable(),
  vcoreStageCurrentA: z.number().nullable(),
  /** Computed: stage count × stage rating, in A (a rating sum, not a cooling claim). */
  vcoreRatedCurrentA: z.number().nullable(),
  socRailStages: z.number().int().nullable(),
  otherRails: z.string().nullable(),
  heatsinkNotes: z.string().nullable(),
});
export type PowerDesign = z.infer<typeof powerDesignSchema>;

export const featuresSchema = z.object({
  rearUsb: z.object({
    usb2: z.number().int().nullable(),
    usb5g: z.number().int().nullable(),
    usb10g: z.number().int().nullable(),
    usb20g: z.number().int().nullable(),
    usb40g: z.number().int().nullable(),
  }),
  frontUsbCHeader: frontUsbCHeaderSchema.nullable(),
  lanSpeedMbps: z.number().int().nullable(),
  wifi: wifiGenerationSchema.nullable(),
  m2Slots: z.number().int().nullable(),
  sataPorts: z.number().int().nullable(),
  audio: z.string().nullable(),
  ioShieldPrefitted: z.boolean().nullable(),
});
export type Features = z.infer<typeof featuresSchema>;

/** A catalog row: everything the table can show, with the latest price in each region. */
export const productSchema = z.object({
  id: z.number().int(),
  maker: z.string(),
  model: z.string(),
  category: productCategorySchema,
  platform: z.string(),
  socket: z.string(),
  chipset: z.string(),
  formFactor: formFactorSchema,
  releaseDate: calendarDateSchema.nullable(),
  powerDesign: powerDesignSchema,
  features: featuresSchema,
  archived: z.boolean(),
  archivedAt: instantSchema.nullable(),
  /** The latest price per region (latest observation date, then latest record), one per region. */
  latestPrices: z.array(priceSchema),
  ...timestampFields,
});
export type Product = z.infer<typeof productSchema>;

/** A product as other records mention it. */
export const productBriefSchema = productSchema.pick({
  id: true,
  maker: true,
  model: true,
  chipset: true,
  formFactor: true,
  archived: true,
});
export type ProductBrief = z.infer<typeof productBriefSchema>;

export const productRoundupUseSchema = z.object({
  roundupId: z.number().int(),
  title: z.string(),
  state: roundupStateSchema,
  kind: z.enum(['tested', 'reference']),
});

/** One product with its full price history (newest first) and the roundups it appears in. */
export const productDetailSchema = productSchema.extend({
  prices: z.array(priceSchema),
  roundups: z.array(productRoundupUseSchema),
  /** False when the product is in a roundup (or has results): archive it instead. */
  deletable: z.boolean(),
});
export type ProductDetail = z.infer<typeof productDetailSchema>;

// ---------------------------------------------------------------------------------------------------------------
// Listing

export const productSortKeys = [
  'maker',
  'model',
  'platform',
  'chipset',
  'formFactor',
  'releaseDate',
  'effectivePhases',
  'vcoreStageCurrentA',
  'lanSpeedMbps',
  'm2Slots',
  'sataPorts',
  'updatedAt',
  'price',
] as const;
export const productSortKeySchema = z.enum(productSortKeys);

const emptyToUndefined = (value: unknown) => (value === '' ? undefined : value);

/**
 * Catalog list query (all optional). `search` matches maker, model, chipset, controller and stage part.
 * `sort=price` needs `priceRegion` (sorts by the latest price in that region; products without one last).
 */
export const productListQuerySchema = z.object({
  search: z.preprocess(emptyToUndefined, queryText(100).optional()),
  maker: z.preprocess(emptyToUndefined, queryText(80).optional()),
  platform: z.preprocess(emptyToUndefined, queryText(80).optional()),
  socket: z.preprocess(emptyToUndefined, queryText(40).optional()),
  chipset: z.preprocess(emptyToUndefined, queryText(40).optional()),
  formFactor: z.preprocess(emptyToUndefined, formFactorSchema.optional()),
  vcoreStageType: z.preprocess(emptyToUndefined, vcoreStageTypeSchema.optional()),
  minEffectivePhases: z.preprocess(emptyToUndefined, z.coerce.number().int().min(0).optional()),
  priceRegion: z.preprocess(emptyToUndefined, regionSchema.optional()),
  archived: archivedFilterSchema,
  sort: productSortKeySchema.default('maker'),
  direction: z.enum(['asc', 'desc']).default('asc'),
  limit: z.coerce.number().int().min(1).max(500).default(200),
  offset: z.coerce.number().int().min(0).default(0),
});
export type ProductListQuery = z.input<typeof productListQuerySchema>;
export type ParsedProductListQuery = z.output<typeof productListQuerySchema>;

export const productListSchema = z.object({
  products: z.array(productSchema),
  /** Matching products before limit/offset. */
  total: z.number().int(),
  /** Distinct values present in the catalog, for filter menus. */
  facets: z.object({
    makers: z.array(z.string()),
    platforms: z.array(z.string()),
    sockets: z.array(z.string()),
    chipsets: z.array(z.string()),
    regions: z.array(z.string()),
  }),
});
export type ProductList = z.infer<typeof productListSchema>;

export const productPriceParamsSchema = pathIdsSchema('id', 'priceId');
