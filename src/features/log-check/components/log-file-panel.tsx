import { Link } from 'react-router';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Panel } from '../../../components/ui/panel';
import { UploadProgress } from '../../../components/ui/upload-progress';
import { formatCount } from './format-figures';
import { LogFilePicker } from './log-file-picker';
import type { LogCheck } from './use-log-check';

export interface LogFilePanelProps {
  check: LogCheck;
  signInPath: string;
  /** Recording a run: the file is kept as evidence once the run is submitted. */
  kept?: boolean;
}

/** Step 1: the file, its upload, and what became of it (read, cancelled, or why the request failed). */
export function LogFilePanel({ check, signInPath, kept = false }: LogFilePanelProps) {
  const { file, fileError, reading, failure, sending, cancelled, requestError } = check;
  const readWell = file && reading && !sending && !cancelled && failure?.stage !== 'reading';

  return (
    <Panel title="1 · The soak log" description="One soak of one load configuration: time, VRM probes, ambient.">
      <LogFilePicker file={file} onChoose={check.choose} error={fileError} kept={kept} />
      {sending && (
        <div className="mt-3">
          <UploadProgress
            progress={sending.progress}
            label={sending.stage === 'reading' ? 'Reading the file' : 'Analysing with your mapping'}
            processingText="Uploaded. The server is reading the log…"
            onCancel={check.cancel}
          />
        </div>
      )}
      {cancelled && (
        <div className="mt-3 flex flex-wrap items-center gap-3">
          <p role="status" className="text-sm text-muted">
            Upload cancelled. Your file and mapping are still here.
          </p>
          <Button size="sm" variant="secondary" onClick={check.retry}>
            Send it again
          </Button>
        </div>
      )}
      {readWell && (
        <p role="status" className="mt-3 text-sm text-ink">
          <span aria-hidden="true" className="mr-1.5 font-mono text-teal">
            ✓
          </span>
          Read {reading.preview.columns.length} columns and {formatCount(reading.preview.dataRowCount)} lines. Check how
          the file was read and the mapping below, then press Analyse.
        </p>
      )}
      {requestError && (
        <Alert tone="danger" announce className="mt-3">
          {requestError.message}{' '}
          {requestError.signedOut ? (
            <Link to={signInPath} className="font-semibold text-copper underline underline-offset-2">
              Sign in again
            </Link>
          ) : (
            <Button size="sm" variant="secondary" className="ml-1" onClick={check.retry}>
              Try again
            </Button>
          )}
        </Alert>
      )}
    </Panel>
  );
}
