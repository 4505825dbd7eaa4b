import { useId, type ReactNode } from 'react';

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

/** What every labelled field takes besides its control's own attributes. */
export interface FieldProps {
  label: ReactNode;
  /** A hint read with the field, e.g. the rule a password must follow. */
  description?: ReactNode;
  /** The field's error; shown in red beside it and announced with it. */
  error?: string;
  /** Marks the label as optional; fields are required unless they say so. */
  optional?: boolean;
  /** Override the generated id, so an error summary can link to the field. */
  id?: string;
  className?: string;
}

/** Separates what the field shell takes from the attributes meant for the control itself. */
export function splitFieldProps<Rest extends object>({
  label,
  description,
  error,
  optional,
  id,
  className,
  ...control
}: FieldProps & Rest): [FieldProps, Omit<Rest, keyof FieldProps>] {
  return [{ label, description, error, optional, id, className }, control];
}

/** The attributes that tie a control to its label, hint and error. */
export interface ControlLink {
  id: string;
  'aria-invalid': true | undefined;
  'aria-describedby': string | undefined;
  required: boolean;
}

export interface FieldShellProps extends FieldProps {
  /** The control, given the attributes that link it to the label, hint and error. */
  children: (control: ControlLink) => ReactNode;
}

/** Label above, control, then the error (when there is one) and the hint. */
export function FieldShell({ label, description, error, optional, id, className, children }: FieldShellProps) {
  const generated = useId();
  const ids = fieldIds(id ?? generated, Boolean(description), Boolean(error));
  const control: ControlLink = {
    id: ids.inputId,
    'aria-invalid': error ? true : undefined,
    'aria-describedby': ids.describedBy,
    required: !optional,
  };
  return (
    <div className={className}>
      <label htmlFor={ids.inputId} className="mb-1 block text-sm font-semibold text-ink">
        {label}
        {optional && <span className="ml-1.5 font-normal text-muted">(optional)</span>}
      </label>
      {children(control)}
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
