import type { Ref, SelectHTMLAttributes } from 'react';
import { cx } from '../../lib/class-names';
import { controlStyles, FieldShell, splitFieldProps, type FieldProps } from './field-shell';

export interface SelectOption {
  value: string;
  label: string;
  disabled?: boolean;
}

export interface SelectProps
  extends FieldProps, Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id' | 'children' | 'className'> {
  options: readonly SelectOption[];
  /** An empty first option such as "Choose a role…"; selecting it means no value. */
  placeholder?: string;
  ref?: Ref<HTMLSelectElement>;
}

export function Select({ options, placeholder, ...props }: SelectProps) {
  const [field, selectProps] = splitFieldProps(props);
  return (
    <FieldShell {...field}>
      {(control) => (
        <select {...control} className={cx(controlStyles, 'appearance-auto pr-8')} {...selectProps}>
          {placeholder !== undefined && <option value="">{placeholder}</option>}
          {options.map((option) => (
            <option key={option.value} value={option.value} disabled={option.disabled}>
              {option.label}
            </option>
          ))}
        </select>
      )}
    </FieldShell>
  );
}
