import { useCallback, useId, useMemo, useState, type ChangeEvent } from 'react';
import { describeSubmitError, type FormErrorItem } from '../../../lib/form-errors';
import {
  productFieldLabels,
  productFields,
  validateProduct,
  type ProductField,
  type ProductFormValues,
} from './product-form-values';
import type { z } from 'zod';
import type { createProductRequestSchema } from '../../../../shared/schemas/catalog';

type Errors = Partial<Record<ProductField, string>>;

/**
 * State of the product form: typed text per field, errors beside fields (from the shared schema first, then from
 * the server), a summary that links to each field, and whether anything differs from where the form started.
 */
export function useProductForm(initialValues: ProductFormValues) {
  const formId = useId();
  const [values, setValues] = useState(initialValues);
  const [errors, setErrors] = useState<Errors>({});
  const [formError, setFormError] = useState<string | undefined>();
  const [attempt, setAttempt] = useState(0);

  const fieldId = useCallback((name: ProductField) => `${formId}-${name.replaceAll('.', '-')}`, [formId]);

  const setValue = useCallback((name: ProductField, value: string) => {
    setValues((current) => ({ ...current, [name]: value }));
    setErrors((current) => {
      if (!(name in current)) return current;
      const next = { ...current };
      delete next[name];
      return next;
    });
  }, []);

  const field = (name: ProductField) => ({
    id: fieldId(name),
    name,
    label: productFieldLabels[name],
    value: values[name],
    error: errors[name],
    onChange: (event: ChangeEvent<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>) =>
      setValue(name, event.target.value),
  });

  const validate = (): z.output<typeof createProductRequestSchema> | null => {
    const result = validateProduct(values);
    setErrors(result.errors);
    if (result.input) {
      setFormError(undefined);
      return result.input;
    }
    setFormError(Object.keys(result.errors).length === 0 ? 'Some values are not valid.' : undefined);
    setAttempt((count) => count + 1);
    return null;
  };

  const fail = (error: unknown) => {
    const { fields, message } = describeSubmitError(error);
    const next: Errors = {};
    for (const [name, text] of Object.entries(fields)) {
      if (name in productFieldLabels && text) next[name as ProductField] = text;
    }
    setErrors(next);
    const unplaced = Object.entries(fields).filter(([name]) => !(name in productFieldLabels));
    setFormError(Object.keys(next).length === 0 ? (unplaced[0]?.[1] ?? message) : undefined);
    setAttempt((count) => count + 1);
  };

  const summaryItems: FormErrorItem[] = useMemo(
    () =>
      productFields
        .filter((name) => errors[name])
        .map((name) => ({ fieldId: fieldId(name), label: productFieldLabels[name], message: errors[name] as string })),
    [errors, fieldId],
  );

  const dirty = productFields.some((name) => values[name] !== initialValues[name]);

  return { values, setValue, errors, formError, attempt, field, validate, fail, summaryItems, dirty };
}
