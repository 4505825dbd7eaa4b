import type { ReactNode } from 'react';

export interface FieldIds {
  inputId: string;
  descriptionId?: string;
  errorId?: string;
  describedBy?: string;
}

/** The ids a form control needs so its label, hint and error are read with it. */
export function fieldIds(baseId: string, hasDescription: boolean, hasError: boolean): FieldIds {
  const descriptionId = hasDescription ? `${baseId}-description` : undefined;
  const errorId = hasError ? `${baseId}-error` : undefined;
  const describedBy = [errorId, descriptionId].filter(Boolean).join(' ') || undefined;
  return { inputId: baseId, descriptionId, errorId, describedBy };
}

export interface FieldShellProps {
  ids: FieldIds;
  label: ReactNode;
  description?: ReactNode;
  error?: string;
  /** Marks the label as optional; fields are required unless they say so. */
  optional?: boolean;
  children: ReactNode;
  className?: string;
}

/** Label above, control, then the error (when there is one) and the hint. */
export function FieldShell({ ids, label, description, error, optional, children, className }: FieldShellProps) {
  return (
    <div className={className}>
      <label htmlFor={ids.inputId} className="mb-1 block text-sm font-semibold text-ink">
        {label}
        {optional && <span className="ml-1.5 font-normal text-muted">(optional)</span>}
      </label>
      {children}
      {error && (
        <p id={ids.errorId} className="mt-1 flex gap-1.5 text-sm font-medium text-red">
          <span aria-hidden="true">✕</span>
          <span>{error}</span>
        </p>
      )}
      {description && (
        <p id={ids.descriptionId} className="mt-1 text-[0.8125rem] text-muted">
          {description}
        </p>
      )}
    </div>
  );
}

export const controlStyles =
  'block w-full rounded-[3px] border bg-surface px-2.5 py-1.5 text-ink placeholder:text-muted ' +
  'disabled:cursor-not-allowed disabled:bg-wash disabled:text-muted aria-invalid:border-red aria-invalid:border-2 ' +
  'border-edge focus-visible:border-copper';
