import type { UploadProgress } from '../api/import-catalog';

function formatBytes(bytes: number): string {
  if (bytes < 1000) return `${bytes}\u2009B`;
  return `${(bytes / 1000).toLocaleString('en-GB', { maximumFractionDigits: 1 })}\u2009kB`;
}

export interface UploadProgressBarProps {
  progress: UploadProgress;
  /** What is happening, e.g. "Checking the file". */
  label: string;
  /** What the server does once the bytes are sent. */
  processingText: string;
}

/** Bytes sent while uploading, then an open-ended bar while the server works on the file. */
export function UploadProgressBar({ progress, label, processingText }: UploadProgressBarProps) {
  const { phase, loadedBytes, totalBytes } = progress;
  const uploading = phase === 'uploading';
  const percent = uploading && totalBytes ? Math.min(100, Math.round((loadedBytes / totalBytes) * 100)) : null;
  const text = uploading
    ? totalBytes
      ? `Uploading ${formatBytes(loadedBytes)} of ${formatBytes(totalBytes)} (${percent}\u2009%)`
      : `Uploading ${formatBytes(loadedBytes)}`
    : processingText;

  return (
    <div className="rounded-[3px] border border-rule bg-surface px-4 py-3">
      <p className="text-sm font-semibold text-ink">{label}</p>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent ?? undefined}
        aria-valuetext={text}
        className="mt-2 h-2 overflow-hidden rounded-[2px] bg-wash"
      >
        {percent !== null ? (
          <div className="h-full bg-copper transition-[width] duration-150" style={{ width: `${percent}%` }} />
        ) : (
          <div className="h-full w-1/3 animate-[benchwire-progress_1.1s_ease-in-out_infinite] bg-copper motion-reduce:w-full motion-reduce:animate-none" />
        )}
      </div>
      <p className="numeric mt-1.5 text-muted" aria-live="polite">
        {text}
      </p>
    </div>
  );
}
