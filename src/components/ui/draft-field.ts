import type { FieldErrors } from '../../lib/form-errors';

/**
 * For fields kept as typed in one draft object: the props that tie a TextField, Select or TextArea to one key of it
 * (its value, its error, and a change that keeps the other keys as they are).
 */
export function draftField<Draft extends { [Key in keyof Draft]: string }>(
  draft: Draft,
  onChange: (draft: Draft) => void,
  errors: FieldErrors,
) {
  return (name: keyof Draft & string) => ({
    value: draft[name],
    onChange: (event: { target: { value: string } }) => onChange({ ...draft, [name]: event.target.value }),
    error: errors[name],
  });
}
