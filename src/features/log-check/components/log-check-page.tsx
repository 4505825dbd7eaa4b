import { useEffect, useMemo, useRef, useState } from 'react';
import { Link } from 'react-router';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { PageHeader } from '../../../components/ui/page-header';
import { Panel } from '../../../components/ui/panel';
import { isApiError } from '../../../lib/api-client';
import type { AnalysisRequestInput, LogPreview, ParseError } from '../../../../shared/schemas/analysis';
import {
  isAbortError,
  maxLogBytes,
  useAnalyseLog,
  type AnalyseLogOutcome,
  type UploadProgress,
} from '../api/analyse-log';
import { AnalysisResults } from './analysis-results';
import { ColumnMappingForm } from './column-mapping-form';
import { formatBytes, formatCount } from './format-figures';
import { LogFilePicker } from './log-file-picker';
import { LogPreviewPanel } from './log-preview';
import { draftFromPreview, requestFromDraft, type MappingDraft } from './mapping-draft';
import { ParseErrorTable } from './parse-error-table';
import { readChartSeries, type ChartSeries } from './read-chart-series';
import { TemperatureChart } from './temperature-chart';
import { UploadProgressBar } from './upload-progress';

type Stage = 'reading' | 'analysing';

interface Sending {
  stage: Stage;
  file: File;
  request: AnalysisRequestInput | null;
}

/** Everything below belongs to one chosen file; it is shown only while that file is the chosen one. */
interface Reading {
  file: File;
  preview: LogPreview;
  /** The server's guess as a draft, to mark the fields nobody has checked yet; null when it could not guess. */
  guess: MappingDraft | null;
}
interface Failure {
  file: File;
  stage: Stage;
  errors: ParseError[];
  message: string;
  hasPreview: boolean;
}
interface Result {
  file: File;
  outcome: Extract<AnalyseLogOutcome, { kind: 'analysed' }>;
  /** The request as sent, to tell when the form no longer matches the figures. */
  requestJson: string;
}

const acceptedName = /\.(csv|tsv|txt|log|dat)$/i;

export interface LogCheckPageProps {
  /** Where to sign in again when the session ends during an upload. */
  signInPath: string;
}

/**
 * Log check: choose a logger file, see how Benchwire reads it, confirm the column mapping and options, and get the
 * analysis. Nothing is stored; the chosen file stays in memory so the mapping can be changed and the file sent again.
 */
export function LogCheckPage({ signInPath }: LogCheckPageProps) {
  const analyse = useAnalyseLog();
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [reading, setReading] = useState<Reading | null>(null);
  const [draft, setDraft] = useState<MappingDraft | null>(null);
  const [failure, setFailure] = useState<Failure | null>(null);
  const [requestError, setRequestError] = useState<{ message: string; signedOut: boolean } | null>(null);
  const [progress, setProgress] = useState<{ stage: Stage; progress: UploadProgress } | null>(null);
  const [cancelled, setCancelled] = useState(false);
  const [result, setResult] = useState<Result | null>(null);
  const [chart, setChart] = useState<{ file: File; requestJson: string; series: ChartSeries | null } | null>(null);
  const inFlight = useRef<AbortController | null>(null);
  const lastSent = useRef<Sending | null>(null);
  const resultHeading = useRef<HTMLHeadingElement>(null);

  const current = <T extends { file: File }>(value: T | null): T | null =>
    value && value.file === file ? value : null;
  const shownReading = current(reading);
  const shownFailure = current(failure);
  const shownResult = current(result);
  const shownChart = current(chart);

  // Moves focus to the new result so keyboard and screen-reader users land on it.
  useEffect(() => {
    if (result) resultHeading.current?.focus();
  }, [result]);

  const currentRequestJson = useMemo(() => {
    if (!shownReading || !draft) return null;
    const built = requestFromDraft(draft, shownReading.preview);
    return built.request ? JSON.stringify(built.request) : null;
  }, [draft, shownReading]);

  const send = (sending: Sending) => {
    inFlight.current?.abort();
    const controller = new AbortController();
    inFlight.current = controller;
    lastSent.current = sending;
    setCancelled(false);
    setRequestError(null);
    setFailure(null);
    setProgress({
      stage: sending.stage,
      progress: { phase: 'uploading', loadedBytes: 0, totalBytes: sending.file.size },
    });

    analyse.mutate(
      {
        file: sending.file,
        request: sending.request,
        signal: controller.signal,
        onProgress: (next) => {
          if (inFlight.current === controller) setProgress({ stage: sending.stage, progress: next });
        },
      },
      {
        onSuccess: (outcome) => {
          setFileError(null);
          if (outcome.preview && (sending.stage === 'reading' || outcome.kind === 'unreadable')) {
            const preview = outcome.preview;
            const previous = reading && draft ? { draft, preview: reading.preview } : null;
            if (sending.stage === 'reading') {
              const guess = preview.guessedMapping ? draftFromPreview(preview, null) : null;
              setReading({ file: sending.file, preview, guess });
              setDraft(draftFromPreview(preview, previous));
            }
          }
          if (outcome.kind === 'unreadable') {
            setFailure({
              file: sending.file,
              stage: sending.stage,
              errors: outcome.errors,
              message: outcome.message,
              hasPreview: outcome.preview !== null,
            });
            return;
          }
          // The first answer analyses with the guessed mapping; it is never shown as a result.
          if (sending.stage === 'analysing' && sending.request) {
            const requestJson = JSON.stringify(sending.request);
            setResult({ file: sending.file, outcome, requestJson });
            void readChartSeries(sending.file, sending.request).then((series) =>
              setChart({ file: sending.file, requestJson, series }),
            );
          }
        },
        onError: (error) => {
          if (isAbortError(error)) return;
          if (isApiError(error) && error.status === 401) {
            setRequestError({ message: 'Your session ended, so the file was not read.', signedOut: true });
          } else if (isApiError(error) && (error.fields.file || error.status === 413 || error.status === 415)) {
            setFileError(error.fields.file ? `${error.message} ${error.fields.file}`.trim() : error.message);
          } else if (isApiError(error) && error.status === 400) {
            setRequestError({ message: error.message, signedOut: false });
          } else {
            setRequestError({
              message: isApiError(error) ? error.message : 'Something went wrong. Try again.',
              signedOut: false,
            });
          }
        },
        onSettled: () => {
          if (inFlight.current === controller) {
            inFlight.current = null;
            setProgress(null);
          }
        },
      },
    );
  };

  const choose = (chosen: File) => {
    if (!acceptedName.test(chosen.name)) {
      setFileError(`“${chosen.name}” is not a logger export: choose a .csv, .tsv or .txt file.`);
      return;
    }
    if (chosen.size === 0) {
      setFileError(`“${chosen.name}” is empty.`);
      return;
    }
    if (chosen.size > maxLogBytes) {
      setFileError(`“${chosen.name}” is ${formatBytes(chosen.size)}; the limit is ${formatBytes(maxLogBytes)}.`);
      return;
    }
    setFileError(null);
    setFile(chosen);
    send({ stage: 'reading', file: chosen, request: null });
  };

  const cancel = () => {
    inFlight.current?.abort();
    inFlight.current = null;
    setProgress(null);
    setCancelled(true);
  };

  const busy = progress !== null;

  return (
    <>
      <PageHeader
        eyebrow="Bench"
        title="Log check"
        description="Upload a logger file from a soak to see how Benchwire reads it, confirm which column is which, and get the peak, steady state, throttle, QA flags and verdict. Nothing is saved."
      />

      <div className="space-y-6">
        <Panel title="1 · The soak log" description="One soak of one load configuration: time, VRM probes, ambient.">
          <LogFilePicker file={file} onChoose={choose} error={fileError} />
          {progress && (
            <div className="mt-3">
              <UploadProgressBar
                progress={progress.progress}
                label={progress.stage === 'reading' ? 'Reading the file' : 'Analysing with your mapping'}
                onCancel={cancel}
              />
            </div>
          )}
          {cancelled && !busy && (
            <div className="mt-3 flex flex-wrap items-center gap-3">
              <p role="status" className="text-sm text-muted">
                Upload cancelled. Your file and mapping are still here.
              </p>
              <Button
                size="sm"
                variant="secondary"
                onClick={() => {
                  if (lastSent.current) send(lastSent.current);
                }}
              >
                Send it again
              </Button>
            </div>
          )}
          {file && shownReading && !busy && !cancelled && shownFailure?.stage !== 'reading' && (
            <p role="status" className="mt-3 text-sm text-ink">
              <span aria-hidden="true" className="mr-1.5 font-mono text-teal">
                ✓
              </span>
              Read {shownReading.preview.columns.length} columns and {formatCount(shownReading.preview.dataRowCount)}{' '}
              lines. Check how the file was read and the mapping below, then press Analyse.
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
                <Button
                  size="sm"
                  variant="secondary"
                  className="ml-1"
                  onClick={() => {
                    if (lastSent.current) send(lastSent.current);
                  }}
                >
                  Try again
                </Button>
              )}
            </Alert>
          )}
        </Panel>

        {shownFailure?.stage === 'reading' && (
          <ParseErrorTable
            errors={shownFailure.errors}
            message={shownFailure.message}
            stage="reading"
            hasPreview={shownFailure.hasPreview}
          />
        )}

        {file && shownReading && draft && (
          <>
            <LogPreviewPanel preview={shownReading.preview} fileName={file.name} />
            <div>
              <h2 className="mb-3 text-lg font-semibold text-ink">2 · Mapping and options</h2>
              <ColumnMappingForm
                preview={shownReading.preview}
                draft={draft}
                guess={shownReading.guess}
                onChange={setDraft}
                pending={busy && progress?.stage === 'analysing'}
                disabled={busy && progress?.stage === 'reading'}
                onAnalyse={(request) => send({ stage: 'analysing', file, request })}
              />
            </div>
          </>
        )}

        {shownFailure?.stage === 'analysing' && (
          <ParseErrorTable
            errors={shownFailure.errors}
            message={shownFailure.message}
            stage="analysing"
            hasPreview={shownFailure.hasPreview}
          />
        )}

        {file && shownResult && (
          <AnalysisResults
            analysis={shownResult.outcome.analysis}
            fileName={file.name}
            outdated={currentRequestJson !== shownResult.requestJson}
            headingRef={resultHeading}
            chart={
              shownChart?.requestJson === shownResult.requestJson && shownChart.series ? (
                <TemperatureChart series={shownChart.series} analysis={shownResult.outcome.analysis} />
              ) : null
            }
          />
        )}
      </div>
    </>
  );
}
