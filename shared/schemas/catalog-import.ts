import { z } from 'zod';
import { countsSchema } from './common';
import { catalogImportUploadLimit } from '../upload-limits';
import { archivedFilterSchema, calendarDateSchema } from './planning-fields';
import { multiLineText, queryText } from './text';

/**
 * The catalog CSV: one product per row, header row first, comma-separated, UTF-8. Export writes exactly these
 * columns, so an exported file imports back. A row whose maker + model already exist updates that product;
 * otherwise it creates one. The price columns are optional together: when filled, the row adds a price to the
 * product's history (skipped if the same price for the same date, region and currency is already there).
 */
export const catalogCsvColumns = [
  { name: 'maker', required: true, help: 'Maker name.' },
  { name: 'model', required: true, help: 'Model name.' },
  { name: 'platform', required: true, help: 'Platform, e.g. Helix-1700.' },
  { name: 'socket', required: true, help: 'Socket, e.g. HX4.' },
  { name: 'chipset', required: true, help: 'Chipset.' },
  { name: 'form_factor', required: true, help: 'e-atx, atx, micro-atx or mini-itx.' },
  { name: 'release_date', required: false, help: 'YYYY-MM-DD.' },
  { name: 'vrm_controller', required: false, help: 'V-core controller label.' },
  { name: 'controller_phases', required: false, help: 'Whole number.' },
  { name: 'phase_multiplication', required: false, help: 'direct, doubled or teamed.' },
  { name: 'stages_per_phase', required: false, help: '1 for direct/doubled, 2+ for teamed.' },
  { name: 'vcore_stage_type', required: false, help: 'integrated-power-stage or discrete-mosfets.' },
  { name: 'vcore_stage_part', required: false, help: 'Part label of the V-core stage.' },
  { name: 'vcore_stage_current_a', required: false, help: 'Continuous rating in A, e.g. 60 or 62.5.' },
  { name: 'soc_rail_stages', required: false, help: 'Whole number.' },
  { name: 'other_rails', required: false, help: 'Free text.' },
  { name: 'heatsink_notes', required: false, help: 'Free text.' },
  { name: 'rear_usb2', required: false, help: 'Rear USB 2.0 ports.' },
  { name: 'rear_usb_5g', required: false, help: 'Rear 5 Gbit/s USB ports.' },
  { name: 'rear_usb_10g', required: false, help: 'Rear 10 Gbit/s USB ports.' },
  { name: 'rear_usb_20g', required: false, help: 'Rear 20 Gbit/s USB ports.' },
  { name: 'rear_usb_40g', required: false, help: 'Rear 40 Gbit/s USB ports.' },
  { name: 'front_usb_c_header', required: false, help: 'none, usb-5g, usb-10g or usb-20g.' },
  { name: 'lan_speed_mbps', required: false, help: 'Fastest wired port in Mbit/s, 0 for none.' },
  { name: 'wifi', required: false, help: 'none, wifi-5, wifi-6, wifi-6e or wifi-7.' },
  { name: 'm2_slots', required: false, help: 'Whole number.' },
  { name: 'sata_ports', required: false, help: 'Whole number.' },
  { name: 'audio', required: false, help: 'Free text.' },
  { name: 'io_shield_prefitted', required: false, help: 'yes or no.' },
  { name: 'price_region', required: false, help: 'Region code, e.g. DE (price columns go together).' },
  { name: 'price_currency', required: false, help: 'ISO 4217 code, e.g. EUR.' },
  { name: 'price_amount', required: false, help: 'Major units with a dot, e.g. 189.99 (no grouping).' },
  { name: 'price_observed_on', required: false, help: 'YYYY-MM-DD.' },
  { name: 'price_source', required: false, help: 'Where the price was seen.' },
] as const;
export type CatalogCsvColumn = (typeof catalogCsvColumns)[number]['name'];

/** Most rows one import takes; larger files are refused before parsing. */
export const CATALOG_IMPORT_MAX_ROWS = 2000;
export const CATALOG_IMPORT_MAX_BYTES = catalogImportUploadLimit.maxFileBytes;

/**
 * Preview or commit a CSV. JSON body `{ csv }`, or multipart/form-data with the file in field `file` (and, for
 * commit, `checksum` as a text field).
 */
const csvTextSchema = multiLineText(CATALOG_IMPORT_MAX_BYTES).optional();

export const catalogImportPreviewRequestSchema = z.strictObject({
  csv: csvTextSchema,
});

export const catalogImportCommitRequestSchema = z.strictObject({
  csv: csvTextSchema,
  /** The checksum the preview returned: commit refuses a file that differs from the one previewed. */
  checksum: z.string().regex(/^[0-9a-f]{64}$/, 'Preview the file first; send the checksum it returned.'),
});

/** One problem in one cell (or the whole row when column is null). Row 1 is the header row. */
export const importRowErrorSchema = z.object({
  rowNumber: z.number().int(),
  column: z.string().nullable(),
  message: z.string(),
});
export type ImportRowError = z.infer<typeof importRowErrorSchema>;

export const importRowPreviewSchema = z.object({
  rowNumber: z.number().int(),
  maker: z.string(),
  model: z.string(),
  /** create: a new product; update: changes the existing product with this maker + model. */
  action: z.enum(['create', 'update']),
  productId: z.number().int().nullable(),
  /** Field names (e.g. chipset, powerDesign.controllerPhases) whose value the update changes. */
  changedFields: z.array(z.string()),
  price: z
    .object({
      region: z.string(),
      currency: z.string(),
      amountMinor: z.number().int(),
      observedOn: calendarDateSchema,
      source: z.string(),
      /** add: a new history entry; duplicate: the same price is already recorded, so it is skipped. */
      action: z.enum(['add', 'duplicate']),
    })
    .nullable(),
  errors: z.array(importRowErrorSchema),
});
export type ImportRowPreview = z.infer<typeof importRowPreviewSchema>;

export const catalogImportPreviewSchema = z.object({
  /** SHA-256 of the CSV text: send it back with the same text to commit. */
  checksum: z.string(),
  rowCount: z.number().int(),
  validRowCount: z.number().int(),
  /** Every problem found, in row order. The import commits only when this is empty. */
  errors: z.array(importRowErrorSchema),
  /** Header cells that are not catalog columns; they are ignored. */
  ignoredColumns: z.array(z.string()),
  rows: z.array(importRowPreviewSchema),
  canCommit: z.boolean(),
});
export type CatalogImportPreview = z.infer<typeof catalogImportPreviewSchema>;

export const catalogImportResultSchema = countsSchema('created', 'updated', 'unchanged', 'pricesAdded').extend({
  productIds: z.array(z.number().int()),
});
export type CatalogImportResult = z.infer<typeof catalogImportResultSchema>;

/** Export query: the same filters as the list; `priceRegion` picks which latest price fills the price columns. */
export const catalogExportQuerySchema = z.object({
  priceRegion: z.preprocess((v) => (v === '' ? undefined : v), queryText(8).toUpperCase().optional()),
  archived: archivedFilterSchema,
  platform: z.preprocess((v) => (v === '' ? undefined : v), queryText(80).optional()),
});
