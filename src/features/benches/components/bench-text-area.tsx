import { useId, type Ref, type TextareaHTMLAttributes } from 'react';
import { cx } from '../../../lib/class-names';
import { controlStyles, fieldIds, FieldShell } from '../../../components/ui/field-shell';

export interface BenchTextAreaProps extends Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> {
  label: string;
  description?: string;
  error?: string;
  optional?: boolean;
  id?: string;
  className?: string;
  textAreaClassName?: string;
  ref?: Ref<HTMLTextAreaElement>;
}

/** A multi-line text field with the kit’s label, hint and error layout (the bench note). */
export function BenchTextArea({
  label,
  description,
  error,
  optional,
  id,
  className,
  textAreaClassName,
  ref,
  rows = 3,
  ...props
}: BenchTextAreaProps) {
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
        {...props}
      />
    </FieldShell>
  );
}
