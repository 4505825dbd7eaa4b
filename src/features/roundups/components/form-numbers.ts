import { z } from 'zod';

const numberPattern = /^-?\d+(?:\.\d+)?$/;

/**
 * A number typed into a text field, checked by the shared schema's own rule once it is a number. Commas are
 * refused rather than guessed at: "1,5" means different things in different places.
 */
export function numberFromText<Inner extends z.ZodType<number, number>>(
  inner: Inner,
  emptyMessage = 'Enter a number.',
) {
  return z
    .string()
    .trim()
    .min(1, emptyMessage)
    .regex(numberPattern, 'Enter a number, with a dot for decimals.')
    .transform(Number)
    .pipe(inner);
}

/** As numberFromText, but an empty field means null. */
export function optionalNumberFromText<Inner extends z.ZodType<number, number>>(inner: Inner) {
  return z
    .string()
    .trim()
    .refine((text) => text === '' || numberPattern.test(text), 'Enter a number, with a dot for decimals.')
    .transform((text) => (text === '' ? null : Number(text)))
    .pipe(inner.nullable());
}
