import { z } from 'zod';

type Issue = z.core.$ZodRawIssue;

const typeNouns: Record<string, string> = {
  number: 'a number',
  int: 'a whole number',
  string: 'some text',
  boolean: 'yes or no',
  date: 'a date',
  array: 'a list',
};

function sizeMessage(issue: Issue & { code: 'too_small' | 'too_big' }): string {
  const small = issue.code === 'too_small';
  const limit = Number(
    small ? (issue as { minimum: number | bigint }).minimum : (issue as { maximum: number | bigint }).maximum,
  );
  const inclusive = issue.inclusive !== false;
  switch (issue.origin) {
    case 'string':
      if (small && limit <= 1) return 'Fill this in.';
      return small ? `Use at least ${limit} characters.` : `Use at most ${limit} characters.`;
    case 'array':
    case 'set':
      if (small && limit <= 1) return 'Choose at least one.';
      return small ? `Choose at least ${limit}.` : `Choose at most ${limit}.`;
    default:
      if (small) return inclusive ? `Enter ${limit} or more.` : `Enter more than ${limit}.`;
      return inclusive ? `Enter ${limit} or less.` : `Enter less than ${limit}.`;
  }
}

/**
 * Words a person can act on for every check a schema makes without a message of its own. A message written in the
 * schema still wins; this replaces the validation library's developer wording ("Invalid option: expected one of
 * …", "Invalid input: expected number, received NaN") on the forms and in the API's field errors.
 */
export function humanIssueMessage(issue: Issue): string | undefined {
  switch (issue.code) {
    case 'invalid_value':
      return issue.values.length === 1 ? 'This value is not allowed here.' : 'Choose one of the options.';
    case 'invalid_type':
      if (issue.input === undefined || issue.input === null || issue.input === '') return 'Fill this in.';
      return `Enter ${typeNouns[issue.expected] ?? 'a valid value'}.`;
    case 'too_small':
    case 'too_big':
      return sizeMessage(issue);
    case 'invalid_format':
      if (issue.format === 'email') return 'Enter an e-mail address, such as name@example.org.';
      if (issue.format === 'date') return 'Enter a date as year-month-day, such as 2026-03-14.';
      if (issue.format === 'datetime') return 'Enter a date and time.';
      if (issue.format === 'url') return 'Enter a web address starting with https://.';
      return 'Check the format of this value.';
    case 'not_multiple_of':
      return `Enter a multiple of ${String(issue.divisor)}.`;
    case 'invalid_union':
      return 'Check this value.';
    case 'unrecognized_keys':
      return `Not expected here: ${issue.keys.join(', ')}.`;
    default:
      return undefined;
  }
}

let installed = false;

/** Makes `humanIssueMessage` the fallback for every schema; called once by the client and once by the server. */
export function installHumanMessages(): void {
  if (installed) return;
  installed = true;
  z.config({ customError: humanIssueMessage });
}
