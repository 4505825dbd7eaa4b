import { useId, type InputHTMLAttributes } from 'react';

export interface SearchFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'id' | 'type' | 'className'> {
  label: string;
  /** The wrapper's width and place in its grid. */
  className?: string;
}

/** A labelled search box: the filter above a table, the catalog's search. Searching is never required. */
export function SearchField({ label, className, ...input }: SearchFieldProps) {
  const id = useId();
  return (
    <div className={className}>
      <label htmlFor={id} className="mb-1 block text-sm font-semibold">
        {label}
      </label>
      <input
        id={id}
        type="search"
        {...input}
        className="block w-full rounded-[3px] border border-edge bg-surface px-2.5 py-1.5 placeholder:text-muted focus-visible:border-copper"
      />
    </div>
  );
}
