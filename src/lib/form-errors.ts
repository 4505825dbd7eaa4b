import type { z } from 'zod';
import { isApiError } from './api-client';

export type FieldErrors<Field extends string = string> = Partial<Record<Field, string>>;

/** The first message per field (keyed by its dotted path), as the server's `fields` object has them. */
export function zodFieldErrors(
  error: z.ZodError,
  message: (issue: z.core.$ZodIssue) => string = (issue) => issue.message,
): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join('.') || '_';
    fields[key] ??= message(issue);
  }
  return fields;
}

/** Splits a failed request into field errors (shown beside fields) and a message for the form as a whole. */
export function describeSubmitError(error: unknown): { fields: FieldErrors; message: string } {
  if (isApiError(error)) return { fields: error.fields, message: error.message };
  return { fields: {}, message: 'Something went wrong. Try again.' };
}

/** One line of a form's error summary: a link to the field and what is wrong with it. */
export interface FormErrorItem {
  fieldId: string;
  label: string;
  message: string;
}
