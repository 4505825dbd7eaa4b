import type { ReactNode } from 'react';
import { isApiError } from '../../lib/api-client';
import { Button } from './button';

export interface ErrorStateProps {
  /** The thrown error; it is described in words, and "Try again" is offered only where trying again can help. */
  error?: unknown;
  title?: ReactNode;
  children?: ReactNode;
  /** Offers "Try again" when the error is one that a second attempt can cure (no connection, a server fault). */
  onRetry?: () => void;
  /** Extra actions, e.g. a link back to the list. */
  actions?: ReactNode;
}

export interface ErrorDescription {
  message: string;
  /** Whether trying the same thing again can help: not for a missing record, a refused role or bad input. */
  retryable: boolean;
  /** What is missing or refused, so a page can offer the way back instead of a retry. */
  kind: 'missing' | 'forbidden' | 'offline' | 'server' | 'refused' | 'unknown';
}

/** An error in words a user can act on; codes and status numbers stay out of sight. */
export function describeError(error: unknown): ErrorDescription {
  if (!isApiError(error)) {
    return { message: 'Something went wrong while showing this page.', retryable: true, kind: 'unknown' };
  }
  if (error.status === 0) {
    return {
      message: 'Benchwire could not reach the server. Check the connection, then try again.',
      retryable: true,
      kind: 'offline',
    };
  }
  if (error.status === 404) {
    return {
      message: 'It may have been deleted, or the address is not quite right.',
      retryable: false,
      kind: 'missing',
    };
  }
  if (error.status === 403) return { message: error.message, retryable: false, kind: 'forbidden' };
  if (error.status === 429) return { message: error.message, retryable: true, kind: 'refused' };
  if (error.status >= 500) {
    return {
      message: 'Something went wrong on the server. Try again in a moment; if it keeps happening, tell an editor.',
      retryable: true,
      kind: 'server',
    };
  }
  return { message: error.message, retryable: false, kind: 'refused' };
}

export function ErrorState({ error, title = 'This could not be loaded', children, onRetry, actions }: ErrorStateProps) {
  const { message, retryable } = describeError(error);
  const showRetry = Boolean(onRetry) && (error === undefined || retryable);
  return (
    <div role="alert" className="rounded-[3px] border border-l-4 border-rule border-l-red bg-surface px-5 py-5">
      <p className="font-semibold text-ink">{title}</p>
      <p className="mt-1 text-sm text-ink">{children ?? message}</p>
      {(showRetry || actions) && (
        <div className="mt-4 flex flex-wrap gap-2">
          {showRetry && (
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
