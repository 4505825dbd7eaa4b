import { useId, type InputHTMLAttributes, type ReactNode, type Ref } from 'react';
import { fieldIds } from './field-shell';

export interface CheckboxProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'type' | 'id'> {
  label: ReactNode;
  description?: ReactNode;
  error?: string;
  id?: string;
  className?: string;
  ref?: Ref<HTMLInputElement>;
}

export function Checkbox({ label, description, error, id, className, ref, ...inputProps }: CheckboxProps) {
  const generated = useId();
  const ids = fieldIds(id ?? generated, Boolean(description), Boolean(error));
  return (
    <div className={className}>
      <div className="flex items-start gap-2.5">
        <input
          ref={ref}
          id={ids.inputId}
          type="checkbox"
          aria-invalid={error ? true : undefined}
          aria-describedby={ids.describedBy}
          className="mt-0.5 size-4.5 shrink-0 accent-copper"
          {...inputProps}
        />
        <label htmlFor={ids.inputId} className="text-sm font-medium text-ink">
          {label}
        </label>
      </div>
      {error && (
        <p id={ids.errorId} className="mt-1 ml-7 text-sm font-medium text-red">
          {error}
        </p>
      )}
      {description && (
        <p id={ids.descriptionId} className="mt-0.5 ml-7 text-[0.8125rem] text-muted">
          {description}
        </p>
      )}
    </div>
  );
}
