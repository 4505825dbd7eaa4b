import { useId, type ReactNode, type Ref, type SelectHTMLAttributes } from 'react';
import { cx } from '../../lib/class-names';
import { controlStyles, fieldIds, FieldShell } from './field-shell';

export interface SelectOption {
  value: string;
  label: string;
  disabled?: boolean;
}

export interface SelectProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id' | 'children'> {
  label: ReactNode;
  options: readonly SelectOption[];
  /** An empty first option such as "Choose a role…"; selecting it means no value. */
  placeholder?: string;
  description?: ReactNode;
  error?: string;
  optional?: boolean;
  id?: string;
  className?: string;
  ref?: Ref<HTMLSelectElement>;
}

export function Select({
  label,
  options,
  placeholder,
  description,
  error,
  optional,
  id,
  className,
  ref,
  ...selectProps
}: SelectProps) {
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
      <select
        ref={ref}
        id={ids.inputId}
        aria-invalid={error ? true : undefined}
        aria-describedby={ids.describedBy}
        required={!optional}
        className={cx(controlStyles, 'appearance-auto pr-8')}
        {...selectProps}
      >
        {placeholder !== undefined && <option value="">{placeholder}</option>}
        {options.map((option) => (
          <option key={option.value} value={option.value} disabled={option.disabled}>
            {option.label}
          </option>
        ))}
      </select>
    </FieldShell>
  );
}
