import { cx } from '../../../lib/class-names';
import type { SaveStatus } from './use-autosave';

const words: Record<SaveStatus, string> = {
  saved: 'All changes saved',
  unsaved: 'Unsaved changes',
  saving: 'Saving…',
  failed: 'Not saved',
  conflict: 'Not saved: someone else saved first',
};

/** The autosave state in words (read out politely as it changes), with a retry after a failure. */
export function SaveStatusLine({
  status,
  error,
  onRetry,
}: {
  status: SaveStatus;
  error: string | null;
  onRetry: () => void;
}) {
  const bad = status === 'failed' || status === 'conflict';
  return (
    <span className="inline-flex flex-wrap items-center gap-2 text-sm">
      <span
        role="status"
        aria-live="polite"
        data-save-status={status}
        className={cx('font-medium', bad ? 'text-red' : status === 'saved' ? 'text-teal' : 'text-muted')}
      >
        {words[status]}
        {status === 'failed' && error ? `: ${error}` : ''}
      </span>
      {status === 'failed' && (
        <button type="button" className="text-copper underline" onClick={onRetry}>
          Try again
        </button>
      )}
    </span>
  );
}
