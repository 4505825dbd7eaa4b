import { useId } from 'react';
import { TextField, type TextFieldProps } from './text-field';

export type SuggestingFieldProps = TextFieldProps & { suggestions: readonly string[] };

/** A free-text field that offers the values already known (platforms, time zones, codes in use) as suggestions. */
export function SuggestingField({ suggestions, ...field }: SuggestingFieldProps) {
  const listId = useId();
  return (
    <>
      <TextField {...field} autoComplete="off" list={listId} />
      <datalist id={listId}>
        {suggestions.map((suggestion) => (
          <option key={suggestion} value={suggestion} />
        ))}
      </datalist>
    </>
  );
}
