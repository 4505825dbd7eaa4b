import { useState } from 'react';
import { Button } from './button';
import { TextField, type TextFieldProps } from './text-field';

export type PasswordFieldProps = Omit<TextFieldProps, 'type' | 'addon'>;

/** A password input with a Show/Hide toggle, so a long password can be checked before it is sent. */
export function PasswordField(props: PasswordFieldProps) {
  const [visible, setVisible] = useState(false);
  return (
    <TextField
      {...props}
      type={visible ? 'text' : 'password'}
      spellCheck={false}
      autoCapitalize="off"
      addon={
        <Button
          variant="secondary"
          size="md"
          aria-pressed={visible}
          aria-label={visible ? 'Hide password' : 'Show password'}
          onClick={() => setVisible((value) => !value)}
          className="w-16"
        >
          {visible ? 'Hide' : 'Show'}
        </Button>
      }
    />
  );
}
