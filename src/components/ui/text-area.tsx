import type { Ref, TextareaHTMLAttributes } from 'react';
import { cx } from '../../lib/class-names';
import { controlStyles, FieldShell, type FieldProps } from './field-shell';

export interface TextAreaProps
  extends FieldProps, Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id' | 'className'> {
  textAreaClassName?: string;
  ref?: Ref<HTMLTextAreaElement>;
}

/** A multi-line text field with the kit's label, hint and error layout. */
export function TextArea({
  label,
  description,
  error,
  optional,
  id,
  className,
  textAreaClassName,
  rows = 3,
  ...textAreaProps
}: TextAreaProps) {
  return (
    <FieldShell {...{ label, description, error, optional, id, className }}>
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
