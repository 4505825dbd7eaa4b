import { z } from 'zod';

/** Reports a value the form could not read into the request (e.g. "12,5" in an amount), by form field. */
export type FlagField = (field: string, message: string) => void;

/**
 * A form schema that finds every problem in one pass. `read` turns the form's text values into the request,
 * flagging what it cannot read; the shared request schema then checks the result at once, so a form never shows
 * its errors in two rounds (a piped schema would stop after the first step's problems). A field the reader
 * already flagged keeps the reader's message. `fieldOf` maps a request path to the form field showing it.
 */
export function formSchema<Values extends Record<string, string>, Request extends z.ZodType>(
  request: Request,
  read: (values: Values, flag: FlagField) => z.input<Request>,
  fieldOf: (path: string) => string = (path) => path,
) {
  return z
    .custom<Values>((value) => typeof value === 'object' && value !== null)
    .transform((values, ctx) => {
      const flagged = new Set<string>();
      const flag: FlagField = (field, message) => {
        flagged.add(field);
        ctx.addIssue({ code: 'custom', path: field.split('.'), message });
      };
      const converted = read(values, flag);
      const checked = request.safeParse(converted);
      if (!checked.success) {
        for (const issue of checked.error.issues) {
          const field = fieldOf(issue.path.map(String).join('.'));
          if (flagged.has(field)) continue;
          ctx.addIssue({ code: 'custom', path: field ? field.split('.') : [], message: issue.message });
        }
        return z.NEVER;
      }
      return flagged.size > 0 ? z.NEVER : (checked.data as z.output<Request>);
    });
}
