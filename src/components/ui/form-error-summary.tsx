import { useEffect, useRef } from 'react';
import type { FormErrorItem } from '../../lib/form-errors';

export interface FormErrorSummaryProps {
  /** Field problems, in the order the fields appear. */
  items: readonly FormErrorItem[];
  /** A problem with the form as a whole (e.g. the server's message). */
  message?: string;
  /** Bump on every failed submit: the summary takes focus so the problem is read out and visible. */
  attempt?: number;
  title?: string;
}

/** The list of what stops a form from being sent, each entry a link to its field. */
export function FormErrorSummary({
  items,
  message,
  attempt = 0,
  title = 'This could not be saved',
}: FormErrorSummaryProps) {
  const ref = useRef<HTMLDivElement>(null);
  const visible = items.length > 0 || Boolean(message);

  useEffect(() => {
    if (visible && attempt > 0) ref.current?.focus();
  }, [attempt, visible]);

  if (!visible) return null;
  return (
    <div
      ref={ref}
      tabIndex={-1}
      role="alert"
      className="mb-4 rounded-[3px] border border-l-4 border-rule border-l-red bg-surface px-3.5 py-2.5 text-sm"
    >
      <p className="font-semibold text-ink">{title}</p>
      {message && <p className="mt-0.5 text-ink">{message}</p>}
      {items.length > 0 && (
        <ul className="mt-1 list-none space-y-0.5">
          {items.map((item) => (
            <li key={item.fieldId}>
              <a
                href={`#${item.fieldId}`}
                className="text-red underline underline-offset-2"
                onClick={(event) => {
                  event.preventDefault();
                  document.getElementById(item.fieldId)?.focus();
                }}
              >
                {item.label}: {item.message}
              </a>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
