import type { z } from 'zod';
import type { CreateProductRequest, Product } from '../../../../shared/schemas/catalog';

/**
 * The product form keeps every field as the text the user typed, keyed by the same dotted path the API uses for
 * its field errors (e.g. "powerDesign.stagesPerPhase"), so a server error lands beside its field and nothing typed
 * is ever replaced by a parsed value.
 */
export const productFieldLabels = {
  maker: 'Maker',
  model: 'Model',
  platform: 'Platform',
  socket: 'Socket',
  chipset: 'Chipset',
  formFactor: 'Form factor',
  releaseDate: 'Release date',
  'powerDesign.controller': 'V-core controller',
  'powerDesign.controllerPhases': 'Controller phases',
  'powerDesign.phaseMultiplication': 'Phase multiplication',
  'powerDesign.stagesPerPhase': 'Stages per phase',
  'powerDesign.vcoreStageType': 'Stage type',
  'powerDesign.vcoreStagePart': 'Stage part label',
  'powerDesign.vcoreStageCurrentA': 'Continuous rating per stage (A)',
  'powerDesign.socRailStages': 'SoC rail stages',
  'powerDesign.otherRails': 'Other rails',
  'powerDesign.heatsinkNotes': 'Heatsink notes',
  'features.rearUsb.usb2': 'USB 2.0',
  'features.rearUsb.usb5g': '5 Gbit/s',
  'features.rearUsb.usb10g': '10 Gbit/s',
  'features.rearUsb.usb20g': '20 Gbit/s',
  'features.rearUsb.usb40g': '40 Gbit/s',
  'features.frontUsbCHeader': 'Front USB-C header',
  'features.lanSpeedMbps': 'Wired LAN',
  'features.wifi': 'Wi-Fi',
  'features.m2Slots': 'M.2 slots',
  'features.sataPorts': 'SATA ports',
  'features.audio': 'Audio',
  'features.ioShieldPrefitted': 'I/O shield',
} as const;

export type ProductField = keyof typeof productFieldLabels;
export type ProductFormValues = Record<ProductField, string>;
export const productFields = Object.keys(productFieldLabels) as ProductField[];

const integerFields = new Set<ProductField>([
  'powerDesign.controllerPhases',
  'powerDesign.stagesPerPhase',
  'powerDesign.socRailStages',
  'features.rearUsb.usb2',
  'features.rearUsb.usb5g',
  'features.rearUsb.usb10g',
  'features.rearUsb.usb20g',
  'features.rearUsb.usb40g',
  'features.lanSpeedMbps',
  'features.m2Slots',
  'features.sataPorts',
]);
const decimalFields = new Set<ProductField>(['powerDesign.vcoreStageCurrentA']);

export const emptyProductForm = Object.fromEntries(productFields.map((field) => [field, ''])) as ProductFormValues;

const text = (value: string | number | null | undefined) =>
  value === null || value === undefined ? '' : String(value);

export function productFormValuesFrom(product: Product): ProductFormValues {
  const { powerDesign: pd, features: f } = product;
  return {
    maker: product.maker,
    model: product.model,
    platform: product.platform,
    socket: product.socket,
    chipset: product.chipset,
    formFactor: product.formFactor,
    releaseDate: text(product.releaseDate),
    'powerDesign.controller': text(pd.controller),
    'powerDesign.controllerPhases': text(pd.controllerPhases),
    'powerDesign.phaseMultiplication': text(pd.phaseMultiplication),
    'powerDesign.stagesPerPhase': text(pd.stagesPerPhase),
    'powerDesign.vcoreStageType': text(pd.vcoreStageType),
    'powerDesign.vcoreStagePart': text(pd.vcoreStagePart),
    'powerDesign.vcoreStageCurrentA': text(pd.vcoreStageCurrentA),
    'powerDesign.socRailStages': text(pd.socRailStages),
    'powerDesign.otherRails': text(pd.otherRails),
    'powerDesign.heatsinkNotes': text(pd.heatsinkNotes),
    'features.rearUsb.usb2': text(f.rearUsb.usb2),
    'features.rearUsb.usb5g': text(f.rearUsb.usb5g),
    'features.rearUsb.usb10g': text(f.rearUsb.usb10g),
    'features.rearUsb.usb20g': text(f.rearUsb.usb20g),
    'features.rearUsb.usb40g': text(f.rearUsb.usb40g),
    'features.frontUsbCHeader': text(f.frontUsbCHeader),
    'features.lanSpeedMbps': text(f.lanSpeedMbps),
    'features.wifi': text(f.wifi),
    'features.m2Slots': text(f.m2Slots),
    'features.sataPorts': text(f.sataPorts),
    'features.audio': text(f.audio),
    'features.ioShieldPrefitted': f.ioShieldPrefitted === null ? '' : f.ioShieldPrefitted ? 'yes' : 'no',
  };
}

/** Reads a typed number; a decimal comma is accepted. Undefined means "not a number". */
export function readNumber(raw: string, integer: boolean): number | null | undefined {
  const trimmed = raw.trim().replace(',', '.');
  if (trimmed === '') return null;
  const pattern = integer ? /^-?\d+$/ : /^-?\d+(\.\d+)?$/;
  return pattern.test(trimmed) ? Number(trimmed) : undefined;
}

function setPath(target: Record<string, unknown>, path: string, value: unknown) {
  const keys = path.split('.');
  let node = target;
  for (const key of keys.slice(0, -1)) {
    node[key] ??= {};
    node = node[key] as Record<string, unknown>;
  }
  node[keys[keys.length - 1]] = value;
}

export interface ProductRequestDraft {
  /** The request as typed, ready for the shared schema (the same the server validates with). */
  request: CreateProductRequest;
  /** Fields whose text is not a number at all (the schema would only say "expected number"). */
  errors: Partial<Record<ProductField, string>>;
}

export function productRequestFrom(values: ProductFormValues): ProductRequestDraft {
  const draft: Record<string, unknown> = { category: 'motherboard' };
  const numberErrors: Partial<Record<ProductField, string>> = {};
  for (const field of productFields) {
    const raw = values[field];
    if (integerFields.has(field) || decimalFields.has(field)) {
      const number = readNumber(raw, integerFields.has(field));
      if (number === undefined) {
        numberErrors[field] = integerFields.has(field)
          ? 'Enter a whole number, e.g. 8.'
          : 'Enter a number, e.g. 60 or 62.5.';
      }
      setPath(draft, field, number ?? null);
    } else if (field === 'features.ioShieldPrefitted') {
      setPath(draft, field, raw === '' ? null : raw === 'yes');
    } else if (
      field === 'maker' ||
      field === 'model' ||
      field === 'platform' ||
      field === 'socket' ||
      field === 'chipset'
    ) {
      setPath(draft, field, raw);
    } else {
      // Choices and optional text: empty means not known (null). Form factor must be chosen: leave it empty.
      setPath(draft, field, raw.trim() === '' ? (field === 'formFactor' ? undefined : null) : raw);
    }
  }
  return { request: draft as CreateProductRequest, errors: numberErrors };
}

/** Zod's default wording reads technical ("Too big: expected number to be <=20"); say it in the form's words. */
export function productIssueMessage(issue: z.core.$ZodIssue): string {
  if (!/^(Too big|Too small|Invalid)/.test(issue.message)) return issue.message;
  switch (issue.code) {
    case 'too_big':
      return issue.origin === 'string' ? `Use at most ${issue.maximum} characters.` : `Use at most ${issue.maximum}.`;
    case 'too_small':
      return issue.origin === 'string' ? 'This cannot be empty.' : `Use at least ${issue.minimum}.`;
    case 'invalid_value':
      return 'Choose one of the options.';
    default:
      return 'Enter a valid value.';
  }
}
