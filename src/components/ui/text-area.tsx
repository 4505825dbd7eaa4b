import type { Ref, TextareaHTMLAttributes } from 'react';
import { cx } from '../../lib/class-names';
import { controlStyles, FieldShell, splitFieldProps, type FieldProps } from './field-shell';

export interface TextAreaProps
  extends FieldProps, Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id' | 'className'> {
  textAreaClassName?: string;
  ref?: Ref<HTMLTextAreaElement>;
}

/** A multi-line text field with the kit's label, hint and error layout. */
export function TextArea({ textAreaClassName, rows = 3, ...props }: TextAreaProps) {
  const [field, textAreaProps] = splitFieldProps(props);
  return (
    <FieldShell {...field}>
      {(control) => (
        <textarea
          rows={rows}
          {...control}
          className={cx(controlStyles, 'resize-y', textAreaClassName)}
          {...textAreaProps}
        />
      )}
    </FieldShell>
  );
}
