import { z } from 'zod';
import { isKnownCurrency } from '../domain/planning/money';
import { isValidTimeZone } from '../domain/planning/loan-overdue';
import { optionalSingleLineText, singleLineText } from './text';
import { instantSchema } from './common';

/**
 * A calendar date without time or zone, YYYY-MM-DD, as responses carry it. Requests use the ranged schemas of
 * shared/schemas/dates.ts (releaseDateSchema, planningDateSchema, …).
 */
export const calendarDateSchema = z.iso.date('Enter a date as YYYY-MM-DD.');

/** ISO 4217 currency code, e.g. EUR. Upper-cased on input. */
export const currencySchema = z
  .string()
  .trim()
  .toUpperCase()
  .refine((code) => isKnownCurrency(code), 'Enter an ISO 4217 currency code such as EUR, GBP or USD.');

/** A sales region code, e.g. DE, GB, US or EU: 2–8 capital letters or digits. Upper-cased on input. */
export const regionSchema = z
  .string()
  .trim()
  .toUpperCase()
  .regex(/^[A-Z0-9]{2,8}$/, 'Enter a region code of 2–8 letters or digits, e.g. DE, GB, US or EU.');

/** IANA time zone name, e.g. Europe/Berlin. */
export const timeZoneSchema = z
  .string()
  .trim()
  .min(1)
  .max(64)
  .refine((zone) => isValidTimeZone(zone), 'Enter an IANA time zone such as Europe/Berlin or UTC.');

/** Integer amount in the currency's minor unit (cents for EUR). */
export const amountMinorSchema = z
  .number()
  .int('Amounts are whole minor units (e.g. cents).')
  .min(0, 'Amounts cannot be negative.')
  .max(2_000_000_000, 'The amount is too large.');

/** A money amount: integer minor units plus ISO 4217 currency. */
export const moneySchema = z.object({ amountMinor: amountMinorSchema, currency: currencySchema });
export type Money = z.infer<typeof moneySchema>;

/** A measurement with a fixed number of decimals (it is stored as DECIMAL with that scale). */
export function decimalSchema(min: number, max: number, scale: number, unit: string) {
  const factor = 10 ** scale;
  return z
    .number()
    .min(min, `Use at least ${min} ${unit}.`)
    .max(max, `Use at most ${max} ${unit}.`)
    .refine(
      (value) => Math.abs(Math.round(value * factor) - value * factor) < 1e-6,
      `Use at most ${scale} decimal place${scale === 1 ? '' : 's'}.`,
    );
}

/** Optional one-line text: trimmed, empty becomes null (the rules of shared/schemas/text.ts). */
export function optionalTextSchema(max: number) {
  return optionalSingleLineText(max);
}

/** Required one-line text (the rules of shared/schemas/text.ts). */
export function requiredTextSchema(max: number, emptyMessage = 'This cannot be empty.') {
  return singleLineText(max, emptyMessage);
}

export const idSchema = z.number().int().positive();

/** A record that people know by its name (a bench, a bench profile, a load configuration). */
export const namedRecordFields = { id: z.number().int(), name: z.string() };
/** Such a record as other records mention it. */
export const namedRefSchema = z.object(namedRecordFields);

/** When a record was created and last changed. */
export const timestampFields = { createdAt: instantSchema, updatedAt: instantSchema };

/** A record kept for one entry of a roundup (its matrix cells, its sample, its photos). */
export const entryRecordFields = { id: z.number().int(), roundupId: z.number().int(), entryId: z.number().int() };

/** A staff member as other records mention them. */
export const personRefSchema = z.object({ id: z.number().int(), displayName: z.string() });
export type PersonRef = z.infer<typeof personRefSchema>;

/** Which records a list of archivable ones shows: the archived ones are hidden unless asked for. */
export const archivedFilterSchema = z.enum(['exclude', 'include', 'only']).default('exclude');

/** What staff see of an archivable record (bench profile, load configuration): id, name, its own `fields`, then use. */
export function archivableRecordSchema<Fields extends z.ZodRawShape>(fields: Fields) {
  return z.object({
    ...namedRecordFields,
    ...fields,
    archived: z.boolean(),
    /** Roundups whose plan uses the record. */
    roundupCount: z.number().int(),
    ...timestampFields,
  });
}

/** A list of archivable records is asked for with which of them to show. */
export const archivableQuerySchema = z.object({ archived: archivedFilterSchema });
