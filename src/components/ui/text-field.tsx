import { useId, type InputHTMLAttributes, type ReactNode, type Ref } from 'react';
import { cx } from '../../lib/class-names';
import { controlStyles, fieldIds, FieldShell } from './field-shell';

export interface TextFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> {
  label: ReactNode;
  /** A hint read with the field, e.g. the rule a password must follow. */
  description?: ReactNode;
  /** The field's error; shown in red beside it and announced with it. */
  error?: string;
  optional?: boolean;
  /** Override the generated id, so an error summary can link to the field. */
  id?: string;
  /** Extra content right of the input, e.g. a show-password button. */
  addon?: ReactNode;
  className?: string;
  inputClassName?: string;
  ref?: Ref<HTMLInputElement>;
}

export function TextField({
  label,
  description,
  error,
  optional,
  id,
  addon,
  className,
  inputClassName,
  ref,
  type = 'text',
  ...inputProps
}: TextFieldProps) {
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
      <div className="flex gap-1.5">
        <input
          ref={ref}
          id={ids.inputId}
          type={type}
          aria-invalid={error ? true : undefined}
          aria-describedby={ids.describedBy}
          required={!optional}
          className={cx(controlStyles, 'min-w-0 flex-1', inputClassName)}
          {...inputProps}
        />
        {addon}
      </div>
    </FieldShell>
  );
}
