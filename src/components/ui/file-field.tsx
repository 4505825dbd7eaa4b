import type { InputHTMLAttributes, Ref } from 'react';
import { cx } from '../../lib/class-names';
import { formatBytes } from '../../lib/upload-size';
import { FieldShell, splitFieldProps, type FieldProps } from './field-shell';

const fileInputStyles = cx(
  'block w-full max-w-md text-sm text-ink',
  'file:mr-3 file:min-h-9 file:cursor-pointer file:rounded-[3px] file:border file:border-edge file:bg-surface file:px-3.5 file:text-sm file:font-medium file:text-ink hover:file:bg-wash',
  'disabled:cursor-not-allowed disabled:opacity-55',
);

export interface FileFieldProps
  extends Omit<FieldProps, 'optional'>, Omit<InputHTMLAttributes<HTMLInputElement>, 'type' | 'id' | 'className'> {
  ref?: Ref<HTMLInputElement>;
  /** Replaces the usual look of the file input. */
  inputClassName?: string;
}

/** A file input with its label above and its error and hint read with it, like every other field. */
export function FileField({ inputClassName = fileInputStyles, ...props }: FileFieldProps) {
  const [field, input] = splitFieldProps(props);
  return (
    <FieldShell {...field}>
      {(link) => (
        <input
          {...input}
          id={link.id}
          type="file"
          aria-invalid={link['aria-invalid']}
          aria-describedby={link['aria-describedby']}
          className={inputClassName}
        />
      )}
    </FieldShell>
  );
}

/** The chosen file's name and size, under its field. */
export function ChosenFile({ file, className }: { file: File | null; className?: string }) {
  if (!file) return null;
  return (
    <p className={cx('text-sm text-ink', className)}>
      Chosen: <span className="font-mono text-[0.8125rem] break-all">{file.name}</span>{' '}
      <span className="numeric text-muted">({formatBytes(file.size)})</span>
    </p>
  );
}
