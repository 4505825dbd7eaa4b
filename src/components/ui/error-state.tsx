import type { ReactNode } from 'react';
import { isApiError } from '../../lib/api-client';
import { Button } from './button';

export interface ErrorStateProps {
  /** The thrown error; an ApiError's message and status are shown, anything else gets a general sentence. */
  error?: unknown;
  title?: ReactNode;
  children?: ReactNode;
  /** Shows a "Try again" button. */
  onRetry?: () => void;
  /** Extra actions, e.g. a link back to the dashboard. */
  actions?: ReactNode;
}

export function describeError(error: unknown): { message: string; detail: string | null } {
  if (isApiError(error)) {
    return { message: error.message, detail: error.status ? `${error.status} · ${error.code}` : error.code };
  }
  return { message: 'Something went wrong while showing this page.', detail: null };
}

export function ErrorState({ error, title = 'This could not be loaded', children, onRetry, actions }: ErrorStateProps) {
  const { message, detail } = describeError(error);
  return (
    <div role="alert" className="rounded-[3px] border border-l-4 border-rule border-l-red bg-surface px-5 py-5">
      <p className="font-semibold text-ink">{title}</p>
      <p className="mt-1 text-sm text-ink">{children ?? message}</p>
      {detail && <p className="numeric mt-2 text-muted">{detail}</p>}
      {(onRetry || actions) && (
        <div className="mt-4 flex flex-wrap gap-2">
          {onRetry && (
            <Button variant="secondary" onClick={onRetry}>
              Try again
            </Button>
          )}
          {actions}
        </div>
      )}
    </div>
  );
}
