import { Spinner } from './spinner';

export interface LoadingStateProps {
  /** What is being loaded, e.g. "Loading users…". */
  label?: string;
  /** Centre it in the whole window (before the app frame exists). */
  fullPage?: boolean;
}

/** A calm placeholder while a page or section waits for data. */
export function LoadingState({ label = 'Loading…', fullPage = false }: LoadingStateProps) {
  return (
    <div
      role="status"
      className={
        fullPage
          ? 'flex min-h-dvh items-center justify-center gap-3 text-muted'
          : 'flex items-center gap-3 px-1 py-10 text-muted'
      }
    >
      <Spinner size="md" />
      <span>{label}</span>
    </div>
  );
}
