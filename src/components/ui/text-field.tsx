import type { InputHTMLAttributes, ReactNode, Ref } from 'react';
import { cx } from '../../lib/class-names';
import { controlStyles, FieldShell, splitFieldProps, type FieldProps } from './field-shell';

export interface TextFieldProps extends FieldProps, Omit<InputHTMLAttributes<HTMLInputElement>, 'id' | 'className'> {
  /** Extra content right of the input, e.g. a show-password button. */
  addon?: ReactNode;
  inputClassName?: string;
  ref?: Ref<HTMLInputElement>;
}

export function TextField({ addon, inputClassName, type = 'text', ...props }: TextFieldProps) {
  const [field, inputProps] = splitFieldProps(props);
  return (
    <FieldShell {...field}>
      {(control) => (
        <div className="flex gap-1.5">
          <input
            type={type}
            {...control}
            className={cx(controlStyles, 'min-w-0 flex-1', inputClassName)}
            {...inputProps}
          />
          {addon}
        </div>
      )}
    </FieldShell>
  );
}
