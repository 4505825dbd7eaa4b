import { useRef, useState, type DragEvent } from 'react';
import { cx } from '../../../lib/class-names';
import { ChosenFile, FileField } from '../../../components/ui/file-field';
import { acceptAttribute, formatBytes } from '../../../lib/upload-size';
import { logFileUploadLimit } from '../../../../shared/upload-limits';

export interface LogFilePickerProps {
  file: File | null;
  onChoose: (file: File) => void;
  /** Why the last file was refused (type, size, an empty file): shown beside the input. */
  error?: string | null;
  disabled?: boolean;
  /** The file is stored with a test run as evidence (recording a run), rather than read and forgotten (Log check). */
  kept?: boolean;
}

const accept = `${acceptAttribute(logFileUploadLimit)},text/csv,text/plain,text/tab-separated-values`;

/**
 * A drop area around an ordinary file input: dragging a file from the desktop works, and so does the keyboard (Tab to
 * the input, Enter or Space opens the browser's file chooser).
 */
export function LogFilePicker({ file, onChoose, error, disabled = false, kept = false }: LogFilePickerProps) {
  const [dragging, setDragging] = useState(false);
  const dragDepth = useRef(0);
  const input = useRef<HTMLInputElement>(null);

  const hasFiles = (event: DragEvent) => Array.from(event.dataTransfer.types).includes('Files');

  const onDragEnter = (event: DragEvent<HTMLDivElement>) => {
    if (disabled || !hasFiles(event)) return;
    event.preventDefault();
    dragDepth.current += 1;
    setDragging(true);
  };
  const onDragLeave = () => {
    dragDepth.current = Math.max(0, dragDepth.current - 1);
    if (dragDepth.current === 0) setDragging(false);
  };
  const onDragOver = (event: DragEvent<HTMLDivElement>) => {
    if (disabled || !hasFiles(event)) return;
    event.preventDefault();
    event.dataTransfer.dropEffect = 'copy';
  };
  const onDrop = (event: DragEvent<HTMLDivElement>) => {
    event.preventDefault();
    dragDepth.current = 0;
    setDragging(false);
    if (disabled) return;
    const dropped = event.dataTransfer.files[0];
    if (!dropped) return;
    // The input then names the dropped file too, as if it had been chosen there.
    if (input.current) input.current.files = event.dataTransfer.files;
    onChoose(dropped);
  };

  return (
    <div
      onDragEnter={onDragEnter}
      onDragLeave={onDragLeave}
      onDragOver={onDragOver}
      onDrop={onDrop}
      className={cx(
        'rounded-[3px] border-2 border-dashed px-4 py-5 transition-colors',
        dragging ? 'border-copper bg-wash' : error ? 'border-red bg-surface' : 'border-edge bg-surface',
      )}
    >
      <p className="text-sm font-semibold text-ink" aria-hidden="true">
        {dragging ? 'Let go to read this file' : 'Drop a logger file here'}
      </p>
      <p className="mt-0.5 text-[0.8125rem] text-muted" aria-hidden="true">
        or choose it below.
      </p>
      <FileField
        ref={input}
        className="mt-3"
        label="Logger file"
        accept={accept}
        disabled={disabled}
        error={error ?? undefined}
        description={
          <>
            A CSV, TSV or text export of the logger, up to {formatBytes(logFileUploadLimit.maxFileBytes)}.{' '}
            {kept
              ? 'When you submit the run, the file is stored byte for byte with its SHA-256 as the run’s evidence.'
              : 'Nothing is saved: the file is read and analysed, then forgotten.'}
          </>
        }
        onChange={(event) => {
          const chosen = event.target.files?.[0];
          if (chosen) onChoose(chosen);
        }}
      />
      <ChosenFile file={file} className="mt-3" />
    </div>
  );
}
