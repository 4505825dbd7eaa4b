import { Button } from '../../../components/ui/button';
import type { UploadProgress } from '../api/analyse-log';
import { formatBytes } from './format-figures';

export interface UploadProgressBarProps {
  progress: UploadProgress;
  /** What is being sent, e.g. "Reading the file" or "Analysing with your mapping". */
  label: string;
  onCancel?: () => void;
}

/** Bytes sent so far while uploading, then an open-ended bar while the server reads the log. */
export function UploadProgressBar({ progress, label, onCancel }: UploadProgressBarProps) {
  const { phase, loadedBytes, totalBytes } = progress;
  const percent = totalBytes ? Math.min(100, Math.round((loadedBytes / totalBytes) * 100)) : null;
  const uploading = phase === 'uploading';
  const text = uploading
    ? totalBytes
      ? `Uploading: ${formatBytes(loadedBytes)} of ${formatBytes(totalBytes)} (${percent}\u2009%)`
      : `Uploading: ${formatBytes(loadedBytes)} sent`
    : 'Uploaded. The server is reading the log…';

  return (
    <div className="rounded-[3px] border border-rule bg-surface px-4 py-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-sm font-semibold text-ink">{label}</p>
        {onCancel && uploading && (
          <Button size="sm" variant="quiet" onClick={onCancel}>
            Cancel upload
          </Button>
        )}
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={uploading && percent !== null ? percent : undefined}
        aria-valuetext={text}
        className="mt-2 h-2 overflow-hidden rounded-[2px] bg-wash"
      >
        {uploading && percent !== null ? (
          <div className="h-full bg-copper transition-[width] duration-150" style={{ width: `${percent}%` }} />
        ) : (
          <div className="h-full w-1/3 animate-[benchwire-progress_1.1s_ease-in-out_infinite] bg-copper motion-reduce:w-full motion-reduce:animate-none" />
        )}
      </div>
      <p className="mt-1.5 text-[0.8125rem] text-muted tabular-nums">{text}</p>
      {/* Only the change of phase is read out, not every progress event. */}
      <p className="sr-only" aria-live="polite">
        {uploading ? 'Uploading the file.' : 'Uploaded. The server is reading the log.'}
      </p>
    </div>
  );
}
