import { useCallback, useId, useMemo, useState, type ChangeEvent, type FormEvent } from 'react';
import type { z } from 'zod';
import { describeSubmitError, zodFieldErrors, type FormErrorItem } from './form-errors';

type Values = Record<string, string>;

/** What a form sends through: a TanStack mutation's `mutate`, with the parsed input. */
interface SendingMutation<Input, Result> {
  mutate: (input: Input, callbacks: { onSuccess: (result: Result) => void; onError: (error: unknown) => void }) => void;
}

export interface UseZodFormOptions<Schema extends z.ZodType, V extends Values> {
  /** The same schema the server validates the request with (from shared/schemas). */
  schema: Schema;
  initialValues: V;
  /** Field labels in display order; used by the error summary. */
  labels: Record<keyof V & string, string>;
  /** Friendlier client-side messages for fields whose schema message reads technical (e.g. an enum). */
  messages?: Partial<Record<keyof V & string, string>>;
  /**
   * For a form whose typed text is not yet the request (numbers, nested fields keyed by a dotted path like
   * "powerDesign.stagesPerPhase"): the request to validate, with problems the schema cannot word ("not a number").
   */
  toRequest?: (values: V) => { request: unknown; errors: Partial<Record<keyof V & string, string>> };
  /** Says a schema problem in the form's words. */
  issueMessage?: (issue: z.core.$ZodIssue) => string;
}

/**
 * Form state for plain controlled inputs: validates with a shared zod schema on submit, shows the server's field
 * errors beside the fields, and never clears what was typed when something fails.
 */
export function useZodForm<Schema extends z.ZodType, V extends Values>({
  schema,
  initialValues,
  labels,
  messages,
  toRequest,
  issueMessage,
}: UseZodFormOptions<Schema, V>) {
  type Field = keyof V & string;
  const formId = useId();
  const [values, setValues] = useState<V>(initialValues);
  const [errors, setErrors] = useState<Partial<Record<Field, string>>>({});
  const [formError, setFormError] = useState<string | undefined>();
  const [attempt, setAttempt] = useState(0);

  const fieldId = useCallback((name: Field) => `${formId}-${name.replaceAll('.', '-')}`, [formId]);

  const setValue = useCallback((name: Field, value: string) => {
    setValues((current) => ({ ...current, [name]: value }));
    setErrors((current) => {
      if (!(name in current)) return current;
      const next = { ...current };
      delete next[name];
      return next;
    });
  }, []);

  /** Props for a TextField / Select / TextArea / PasswordField. */
  const field = (name: Field) => ({
    id: fieldId(name),
    name,
    label: labels[name],
    value: values[name],
    error: errors[name],
    onChange: (event: ChangeEvent<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>) =>
      setValue(name, event.target.value),
  });

  /** Parses the values; on failure shows the problems and returns null. */
  const validate = (): z.output<Schema> | null => {
    const { request, errors: typed } = toRequest?.(values) ?? {
      request: values,
      errors: {} as Partial<Record<Field, string>>,
    };
    const result = schema.safeParse(request);
    const found = result.success ? {} : zodFieldErrors(result.error, issueMessage);
    const next: Partial<Record<Field, string>> = {};
    for (const name of Object.keys(labels) as Field[]) {
      const problem = typed[name] ?? (found[name] && (messages?.[name] ?? found[name]));
      if (problem) next[name] = problem;
    }
    if (result.success && Object.keys(next).length === 0) {
      setErrors({});
      setFormError(undefined);
      return result.data;
    }
    setErrors(next);
    setFormError(
      Object.keys(next).length === 0 ? (Object.values(found)[0] ?? 'Some values are not valid.') : undefined,
    );
    setAttempt((count) => count + 1);
    return null;
  };

  /** Shows a failed request: field errors beside their fields, anything else as the form's message. */
  const fail = (error: unknown) => {
    const { fields, message } = describeSubmitError(error);
    const next: Partial<Record<Field, string>> = {};
    for (const [name, text] of Object.entries(fields)) {
      if (name in labels && text) next[name as Field] = text;
    }
    setErrors(next);
    setFormError(Object.keys(next).length === 0 ? message : undefined);
    setAttempt((count) => count + 1);
  };

  const reset = (next: V = initialValues) => {
    setValues(next);
    setErrors({});
    setFormError(undefined);
  };

  /** Whether anything differs from where the form started. */
  const dirty = (Object.keys(labels) as Field[]).some((name) => values[name] !== initialValues[name]);

  const summaryItems: FormErrorItem[] = useMemo(
    () =>
      (Object.keys(labels) as Field[])
        .filter((name) => errors[name])
        .map((name) => ({ fieldId: fieldId(name), label: labels[name], message: errors[name] as string })),
    [errors, labels, fieldId],
  );

  /** The error summary of the form under `title` (for FormDialog). */
  const problems = (title: string) => ({ title, items: summaryItems, message: formError, attempt });

  /**
   * A <form>'s onSubmit: `before` clears what the last submit said, then the values are checked and only valid input
   * reaches `send`; problems show beside the fields, and nothing typed is lost either way.
   */
  const handleSubmit = (send: (input: z.output<Schema>) => void, before?: () => void) => (event: FormEvent) => {
    event.preventDefault();
    before?.();
    const input = validate();
    if (input) send(input);
  };

  /**
   * Validates, then sends the parsed input; on success the form starts afresh and `onSaved` gets the answer, on
   * failure the server's problems show beside the fields.
   */
  const submitWith = <Result>(
    mutation: SendingMutation<z.output<Schema>, Result>,
    onSaved: (result: Result) => void,
  ) => {
    const input = validate();
    if (!input) return;
    mutation.mutate(input, {
      onSuccess: (result) => {
        reset();
        onSaved(result);
      },
      onError: fail,
    });
  };

  /** A FormDialog's submit side: busy while `mutation` runs, sends through submitWith, problems under `title`. */
  const dialogSubmit = <Result>(
    mutation: SendingMutation<z.output<Schema>, Result> & { isPending: boolean },
    onSaved: (result: Result) => void,
    title: string,
  ) => ({ pending: mutation.isPending, onSubmit: () => submitWith(mutation, onSaved), problems: problems(title) });

  return {
    values,
    setValue,
    errors,
    formError,
    attempt,
    field,
    validate,
    fail,
    reset,
    summaryItems,
    dirty,
    fieldId,
    problems,
    handleSubmit,
    submitWith,
    dialogSubmit,
  };
}
