import { useId, type ReactNode, type Ref, type TextareaHTMLAttributes } from 'react';
import { cx } from '../../lib/class-names';
import { controlStyles, fieldIds, FieldShell } from './field-shell';

export interface TextAreaProps extends Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> {
  label: ReactNode;
  /** A hint read with the field, e.g. what a note is for. */
  description?: ReactNode;
  /** The field's error; shown in red beside it and announced with it. */
  error?: string;
  optional?: boolean;
  /** Override the generated id, so an error summary can link to the field. */
  id?: string;
  className?: string;
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
  ref,
  rows = 3,
  ...textAreaProps
}: TextAreaProps) {
  const generated = useId();
  const ids = fieldIds(id ?? generated, Boolean(description), Boolean(error));
  return (
    <FieldShell
      ids={ids}
      label={label}
      description={description}
      error={error}
      optional={optional}
      className={className}
    >
      <textarea
        ref={ref}
        id={ids.inputId}
        rows={rows}
        aria-invalid={error ? true : undefined}
        aria-describedby={ids.describedBy}
        required={!optional}
        className={cx(controlStyles, 'resize-y', textAreaClassName)}
        {...textAreaProps}
      />
    </FieldShell>
  );
}
