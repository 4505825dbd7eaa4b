import { TextField, type TextFieldProps } from '../../../components/ui/text-field';

export interface CelsiusFieldProps extends Omit<TextFieldProps, 'value' | 'onChange' | 'inputMode'> {
  value: string;
  /** The text as typed; the form checks it as a number when it is sent. */
  onValueChange: (value: string) => void;
}

/** A temperature in °C as typed: decimal keypad on phones, the text kept as it is until the form is sent. */
export function CelsiusField({ value, onValueChange, ...props }: CelsiusFieldProps) {
  return (
    <TextField {...props} inputMode="decimal" value={value} onChange={(event) => onValueChange(event.target.value)} />
  );
}

/** One temperature box of a form: the request field it fills, and what to say when it is empty or not a number. */
export interface CelsiusFieldSpec<Name extends string> {
  name: Name;
  id: string;
  label: string;
  invalid: string;
}

/** The typed temperatures as numbers, and a message for each box that is empty or not a number. */
export function readCelsius<Name extends string>(
  fields: readonly CelsiusFieldSpec<Name>[],
  typed: Record<Name, string>,
): { values: Record<Name, number>; errors: Partial<Record<Name, string>> } {
  const values = {} as Record<Name, number>;
  const errors: Partial<Record<Name, string>> = {};
  for (const field of fields) {
    const text = typed[field.name].trim();
    values[field.name] = Number(text);
    if (!text || !Number.isFinite(values[field.name])) errors[field.name] = field.invalid;
  }
  return { values, errors };
}

export interface CelsiusFieldsProps<Name extends string> {
  fields: readonly CelsiusFieldSpec<Name>[];
  typed: Record<Name, string>;
  onChange: (typed: Record<Name, string>) => void;
  errors: Partial<Record<string, string>>;
  required?: boolean;
  className?: string;
}

/** A form's temperature boxes, one per field of its table, each keeping its text as typed. */
export function CelsiusFields<Name extends string>({
  fields,
  typed,
  onChange,
  errors,
  required,
  className,
}: CelsiusFieldsProps<Name>) {
  return fields.map((field) => (
    <CelsiusField
      key={field.name}
      id={field.id}
      label={field.label}
      value={typed[field.name]}
      onValueChange={(value) => onChange({ ...typed, [field.name]: value })}
      error={errors[field.name]}
      required={required}
      className={className}
    />
  ));
}
