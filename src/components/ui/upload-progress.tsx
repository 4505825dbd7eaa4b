import { useRef, useState } from 'react';
import type { UploadProgress as Progress } from '../../lib/upload';
import { formatBytes } from '../../lib/upload-size';
import { Button } from './button';

export interface UploadProgressProps {
  progress: Progress;
  /** What is being sent, e.g. "Checking the file" or "Analysing with your mapping". */
  label: string;
  /** What the server does once every byte is sent, e.g. "Uploaded. Checking every row against the catalog…". */
  processingText: string;
  /** Offered while bytes are going out; once they are sent, the server's work cannot be called back. */
  onCancel?: () => void;
}

/** One upload at a time: its progress while it runs, and cancelling it while bytes go out. */
export function useCancellableUpload() {
  const [progress, setProgress] = useState<Progress | null>(null);
  const controller = useRef<AbortController | null>(null);
  return {
    /** What the progress display takes, or null when nothing is being sent. */
    shown: progress && { progress, onCancel: () => controller.current?.abort() },
    /** For a request about to go out: where it reports its progress, and the signal that cancels it. */
    start: () => {
      controller.current = new AbortController();
      return { onProgress: setProgress, signal: controller.current.signal };
    },
    /** Once the request has settled, answered or not. */
    settled: () => setProgress(null),
  };
}

/** Bytes sent so far while uploading, then an open-ended bar while the server works on the file. */
export function UploadProgress({ progress, label, processingText, onCancel }: UploadProgressProps) {
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
      <p className="numeric mt-1.5 text-[0.8125rem] text-muted">{text}</p>
      {/* Only the change of phase is read out, not every progress event. */}
      <p className="sr-only" aria-live="polite">
        {uploading ? `${label}: uploading the file.` : processingText}
      </p>
    </div>
  );
}
