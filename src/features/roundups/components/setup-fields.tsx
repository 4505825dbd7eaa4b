import { TextField, type TextFieldProps } from '../../../components/ui/text-field';

/** One typed-in line of a reusable test setup (bench profile, load configuration): never filled in by the browser. */
export interface SetupFieldSpec<Name extends string> {
  name: Name;
  inputMode?: 'decimal' | 'numeric';
  placeholder?: string;
  description?: string;
  optional?: boolean;
}

/** The setup's text fields in the order of its table, each bound to the form by name. */
export function SetupFields<Name extends string>({
  field,
  specs,
}: {
  field: (name: Name) => TextFieldProps;
  specs: readonly SetupFieldSpec<Name>[];
}) {
  return (
    <>
      {specs.map(({ name, ...spec }) => (
        <TextField key={name} {...field(name)} {...spec} autoComplete="off" />
      ))}
    </>
  );
}
