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
