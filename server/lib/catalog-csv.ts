import Papa from 'papaparse';
import {
  catalogCsvColumns,
  CATALOG_IMPORT_MAX_ROWS,
  type CatalogCsvColumn,
  type ImportRowError,
} from '../../shared/schemas/catalog-import';
import {
  createPriceRequestSchema,
  createProductRequestSchema,
  type Price,
  type Product,
  type ProductInput,
} from '../../shared/schemas/catalog';
import { minorToMajorString, parseMajorAmount } from '../../shared/domain/planning/money';

/** One data row turned into a product input (and maybe a price), or the reasons it could not be. */
export interface ParsedCatalogRow {
  rowNumber: number;
  maker: string;
  model: string;
  product: ProductInput | null;
  price: { region: string; currency: string; amountMinor: number; observedOn: string; source: string } | null;
  errors: ImportRowError[];
}

export interface ParsedCatalogCsv {
  rows: ParsedCatalogRow[];
  /** File-level problems (missing columns, unreadable file), reported on row 1, the header. */
  fileErrors: ImportRowError[];
  ignoredColumns: string[];
}

const columnNames = new Set<string>(catalogCsvColumns.map((c) => c.name));
const priceColumns: CatalogCsvColumn[] = [
  'price_region',
  'price_currency',
  'price_amount',
  'price_observed_on',
  'price_source',
];

/** Where each product field comes from, so schema errors point at the CSV column. */
const columnForPath: Record<string, CatalogCsvColumn> = {
  maker: 'maker',
  model: 'model',
  platform: 'platform',
  socket: 'socket',
  chipset: 'chipset',
  formFactor: 'form_factor',
  releaseDate: 'release_date',
  'powerDesign.controller': 'vrm_controller',
  'powerDesign.controllerPhases': 'controller_phases',
  'powerDesign.phaseMultiplication': 'phase_multiplication',
  'powerDesign.stagesPerPhase': 'stages_per_phase',
  'powerDesign.vcoreStageType': 'vcore_stage_type',
  'powerDesign.vcoreStagePart': 'vcore_stage_part',
  'powerDesign.vcoreStageCurrentA': 'vcore_stage_current_a',
  'powerDesign.socRailStages': 'soc_rail_stages',
  'powerDesign.otherRails': 'other_rails',
  'powerDesign.heatsinkNotes': 'heatsink_notes',
  'features.rearUsb.usb2': 'rear_usb2',
  'features.rearUsb.usb5g': 'rear_usb_5g',
  'features.rearUsb.usb10g': 'rear_usb_10g',
  'features.rearUsb.usb20g': 'rear_usb_20g',
  'features.rearUsb.usb40g': 'rear_usb_40g',
  'features.frontUsbCHeader': 'front_usb_c_header',
  'features.lanSpeedMbps': 'lan_speed_mbps',
  'features.wifi': 'wifi',
  'features.m2Slots': 'm2_slots',
  'features.sataPorts': 'sata_ports',
  'features.audio': 'audio',
  'features.ioShieldPrefitted': 'io_shield_prefitted',
};

// Spreadsheet programs run cells that start with these as formulas (OWASP "CSV injection"); export
// prefixes them with an apostrophe and import removes it again, so files round-trip.
const formulaStart = /^[=+\-@\t\r]/;

function cleanCell(value: unknown): string {
  const text = String(value ?? '').trim();
  return text.startsWith("'") && formulaStart.test(text.slice(1)) ? text.slice(1) : text;
}

function safeCell(value: string): string {
  return formulaStart.test(value) ? `'${value}` : value;
}

/**
 * A spreadsheet that splits on semicolons or tabs (common in locales with a decimal comma) starts a new cell after
 * each one, so "Codec;=1+1" would run a formula there. Such cells are written in quotes, which keep them one cell
 * whatever the separator (OWASP, CSV injection: wrap each cell in double quotes).
 */
const formulaAfterSeparator = /[;\t]\s*[=+\-@\t\r]/;

function needsQuotes(value: string): boolean {
  return formulaAfterSeparator.test(value) || /[;\t]/.test(value);
}

/** The first line (1-based) holding U+FFFD, or 0: where bytes were not valid UTF-8 when the file was decoded. */
function firstLineWithReplacement(text: string): number {
  const at = text.indexOf('\uFFFD');
  if (at < 0) return 0;
  let line = 1;
  for (let i = text.indexOf('\n'); i >= 0 && i < at; i = text.indexOf('\n', i + 1)) line++;
  return line;
}

export function parseCatalogCsv(text: string): ParsedCatalogCsv {
  const source = text.replace(/^\uFEFF/, '');
  // A file saved in another encoding (Latin-1, Windows-1252) decodes with replacement characters where its accented
  // letters were; committing them would store "Gr\uFFFDn" for "Grün". Refuse it and say how to save it instead.
  const undecodable = firstLineWithReplacement(source);
  if (undecodable > 0) {
    return {
      rows: [],
      fileErrors: [
        {
          rowNumber: undecodable,
          column: null,
          message: `Row ${undecodable} holds characters that are not UTF-8: the file seems to be saved in another encoding (such as Latin-1 or Windows-1252). Save it as “CSV UTF-8” and import it again.`,
        },
      ],
      ignoredColumns: [],
    };
  }
  const parsed = Papa.parse<Record<string, string>>(source, {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (header) => header.trim().toLowerCase(),
  });
  const headers = parsed.meta.fields ?? [];
  const fileErrors: ImportRowError[] = [];
  if (headers.length === 0 || source.trim() === '') {
    fileErrors.push({
      rowNumber: 1,
      column: null,
      message: 'The file is empty: start with a header row of column names.',
    });
    return { rows: [], fileErrors, ignoredColumns: [] };
  }
  for (const column of catalogCsvColumns) {
    if (column.required && !headers.includes(column.name)) {
      fileErrors.push({ rowNumber: 1, column: column.name, message: `The header has no “${column.name}” column.` });
    }
  }
  // Papa renames a repeated header ("model" again becomes "model_1") and reads on; which of the two holds the
  // model would be a guess, so a catalog column named twice is refused by name.
  const renamed = parsed.meta.renamedHeaders ?? {};
  for (const header of new Set(Object.values(renamed))) {
    if (columnNames.has(header)) {
      fileErrors.push({
        rowNumber: 1,
        column: header,
        message: `The column “${header}” appears twice in the header: keep one of them.`,
      });
    }
  }
  if (parsed.data.length > CATALOG_IMPORT_MAX_ROWS) {
    fileErrors.push({
      rowNumber: 1,
      column: null,
      message: `The file has ${parsed.data.length} rows; import at most ${CATALOG_IMPORT_MAX_ROWS} at a time.`,
    });
  }
  const ignoredColumns = headers.filter(
    (h) => h !== '' && !columnNames.has(h) && !h.startsWith('__') && !(h in renamed),
  );
  if (fileErrors.length > 0) return { rows: [], fileErrors, ignoredColumns };

  // Papa reports shape problems (too few or too many fields, bad quotes) by data-row index.
  const shapeErrors = new Map<number, string>();
  for (const error of parsed.errors) {
    if (error.row != null && !shapeErrors.has(error.row)) shapeErrors.set(error.row, error.message);
  }
  const rows = parsed.data.map((record, index) => {
    // Row 1 is the header, so the first data row is row 2, as a spreadsheet numbers it.
    const rowNumber = index + 2;
    const shape = shapeErrors.get(index);
    const row = parseRow(record, rowNumber);
    if (shape) row.errors.unshift({ rowNumber, column: null, message: `The row's layout is wrong: ${shape}.` });
    if (row.errors.length > 0) row.product = null;
    return row;
  });
  return { rows, fileErrors, ignoredColumns };
}

function parseRow(record: Record<string, string>, rowNumber: number): ParsedCatalogRow {
  const errors: ImportRowError[] = [];
  const cell = (column: CatalogCsvColumn) => cleanCell(record[column]);
  const fail = (column: CatalogCsvColumn | null, message: string) => errors.push({ rowNumber, column, message });

  const integer = (column: CatalogCsvColumn): number | null => {
    const text = cell(column);
    if (text === '') return null;
    if (!/^\d+$/.test(text)) {
      fail(column, `“${text}” is not a whole number.`);
      return null;
    }
    return Number(text);
  };
  const decimal = (column: CatalogCsvColumn): number | null => {
    const text = cell(column);
    if (text === '') return null;
    if (!/^\d+(\.\d+)?$/.test(text)) {
      fail(column, `“${text}” is not a number (use a dot for decimals).`);
      return null;
    }
    return Number(text);
  };
  const code = (column: CatalogCsvColumn): string | null => {
    const text = cell(column).toLowerCase();
    return text === '' ? null : text;
  };
  const yesNo = (column: CatalogCsvColumn): boolean | null => {
    const text = cell(column).toLowerCase();
    if (text === '') return null;
    if (['yes', 'y', 'true', '1'].includes(text)) return true;
    if (['no', 'n', 'false', '0'].includes(text)) return false;
    fail(column, `Write yes or no, not “${text}”.`);
    return null;
  };
  const text = (column: CatalogCsvColumn) => cell(column) || null;

  const candidate = {
    maker: cell('maker'),
    model: cell('model'),
    platform: cell('platform'),
    socket: cell('socket'),
    chipset: cell('chipset'),
    formFactor: code('form_factor') ?? '',
    releaseDate: text('release_date'),
    powerDesign: {
      controller: text('vrm_controller'),
      controllerPhases: integer('controller_phases'),
      phaseMultiplication: code('phase_multiplication'),
      stagesPerPhase: integer('stages_per_phase'),
      vcoreStageType: code('vcore_stage_type'),
      vcoreStagePart: text('vcore_stage_part'),
      vcoreStageCurrentA: decimal('vcore_stage_current_a'),
      socRailStages: integer('soc_rail_stages'),
      otherRails: text('other_rails'),
      heatsinkNotes: text('heatsink_notes'),
    },
    features: {
      rearUsb: {
        usb2: integer('rear_usb2'),
        usb5g: integer('rear_usb_5g'),
        usb10g: integer('rear_usb_10g'),
        usb20g: integer('rear_usb_20g'),
        usb40g: integer('rear_usb_40g'),
      },
      frontUsbCHeader: code('front_usb_c_header'),
      lanSpeedMbps: integer('lan_speed_mbps'),
      wifi: code('wifi'),
      m2Slots: integer('m2_slots'),
      sataPorts: integer('sata_ports'),
      audio: text('audio'),
      ioShieldPrefitted: yesNo('io_shield_prefitted'),
    },
  };
  const alreadyFailed = new Set(errors.map((e) => e.column));
  const result = createProductRequestSchema.safeParse(candidate);
  if (!result.success) {
    for (const issue of result.error.issues) {
      const column = columnForPath[issue.path.join('.')] ?? null;
      if (column && alreadyFailed.has(column)) continue;
      fail(column, issue.message);
    }
  }

  let price: ParsedCatalogRow['price'] = null;
  const filled = priceColumns.filter((column) => cell(column) !== '');
  if (filled.length > 0) {
    const missing = priceColumns.filter((column) => cell(column) === '');
    for (const column of missing) fail(column, 'A price needs region, currency, amount, date and source together.');
    if (missing.length === 0) {
      const currency = cell('price_currency').toUpperCase();
      const amount = parseMajorAmount(cell('price_amount'), currency);
      if (!amount.ok) fail('price_amount', amount.message);
      const priceResult = createPriceRequestSchema.safeParse({
        region: cell('price_region'),
        currency,
        amountMinor: amount.ok ? amount.amountMinor : 0,
        observedOn: cell('price_observed_on'),
        source: cell('price_source'),
      });
      if (!priceResult.success) {
        const priceColumnFor: Record<string, CatalogCsvColumn> = {
          region: 'price_region',
          currency: 'price_currency',
          amountMinor: 'price_amount',
          observedOn: 'price_observed_on',
          source: 'price_source',
        };
        for (const issue of priceResult.error.issues)
          fail(priceColumnFor[String(issue.path[0])] ?? null, issue.message);
      } else if (amount.ok) {
        price = priceResult.data;
      }
    }
  }
  errors.sort((a, b) => columnOrder(a.column) - columnOrder(b.column));
  return {
    rowNumber,
    maker: candidate.maker,
    model: candidate.model,
    product: result.success && errors.length === 0 ? result.data : null,
    price: errors.length === 0 ? price : null,
    errors,
  };
}

function columnOrder(column: string | null) {
  const index = catalogCsvColumns.findIndex((c) => c.name === column);
  return index === -1 ? -1 : index;
}

/** The catalog as CSV, one product per row, in import column order; the price columns hold `prices[product]`. */
export function formatCatalogCsv(products: Product[], priceFor: (product: Product) => Price | null): string {
  const yesNo = (value: boolean | null) => (value == null ? '' : value ? 'yes' : 'no');
  const n = (value: number | null) => (value == null ? '' : String(value));
  const rows = products.map((product) => {
    const design = product.powerDesign;
    const features = product.features;
    const price = priceFor(product);
    const values: Record<CatalogCsvColumn, string> = {
      maker: product.maker,
      model: product.model,
      platform: product.platform,
      socket: product.socket,
      chipset: product.chipset,
      form_factor: product.formFactor,
      release_date: product.releaseDate ?? '',
      vrm_controller: design.controller ?? '',
      controller_phases: n(design.controllerPhases),
      phase_multiplication: design.phaseMultiplication ?? '',
      stages_per_phase: n(design.stagesPerPhase),
      vcore_stage_type: design.vcoreStageType ?? '',
      vcore_stage_part: design.vcoreStagePart ?? '',
      vcore_stage_current_a: n(design.vcoreStageCurrentA),
      soc_rail_stages: n(design.socRailStages),
      other_rails: design.otherRails ?? '',
      heatsink_notes: design.heatsinkNotes ?? '',
      rear_usb2: n(features.rearUsb.usb2),
      rear_usb_5g: n(features.rearUsb.usb5g),
      rear_usb_10g: n(features.rearUsb.usb10g),
      rear_usb_20g: n(features.rearUsb.usb20g),
      rear_usb_40g: n(features.rearUsb.usb40g),
      front_usb_c_header: features.frontUsbCHeader ?? '',
      lan_speed_mbps: n(features.lanSpeedMbps),
      wifi: features.wifi ?? '',
      m2_slots: n(features.m2Slots),
      sata_ports: n(features.sataPorts),
      audio: features.audio ?? '',
      io_shield_prefitted: yesNo(features.ioShieldPrefitted),
      price_region: price?.region ?? '',
      price_currency: price?.currency ?? '',
      price_amount: price ? minorToMajorString(price.amountMinor, price.currency) : '',
      price_observed_on: price?.observedOn ?? '',
      price_source: price?.source ?? '',
    };
    return catalogCsvColumns.map((column) => safeCell(values[column.name]));
  });
  return Papa.unparse(
    { fields: catalogCsvColumns.map((c) => c.name), data: rows },
    { quotes: (value: unknown) => typeof value === 'string' && needsQuotes(value), newline: '\r\n' },
  );
}
