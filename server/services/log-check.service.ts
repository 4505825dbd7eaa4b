import { AppError } from '../errors';
import { sharedCopyInSlices } from '../lib/event-loop-slices';
import { lazyWorkerPool, type LazyWorkerPool } from '../lib/worker-pool';
import type { AnalyseLogTask } from '../workers/analyse-log';
import type { AnalysisPreviewResponse, AnalysisRequestInput } from '../../shared/schemas/analysis';
import { analyseLogFile, type AnalyseLogFileOutcome } from '../../shared/domain/analysis/analyse-log';
import { logAnalysisLimits, logFileUploadLimit } from '../../shared/upload-limits';

/** An uploaded logger file as the upload middleware hands it over. */
export interface LogFileUpload {
  originalname: string;
  buffer: Uint8Array;
}

/**
 * Runs the analysis pipeline on a file's bytes: in the server's worker pool (pooledAnalyser), or in this process
 * where nothing else waits (the lab CLI, tests of the pipeline's answers). `signal`: the caller went away.
 */
export type LogFileAnalyser = (
  bytes: Uint8Array,
  request: AnalysisRequestInput,
  signal?: AbortSignal,
) => Promise<AnalyseLogFileOutcome>;

/** The pipeline in this process. */
export const analyseInProcess: LogFileAnalyser = async (bytes, request) => analyseLogFile(bytes, request);

/** An analyser with worker threads behind it, to be closed when the server stops. */
export interface PooledLogFileAnalyser extends LogFileAnalyser {
  close(): Promise<void>;
}

const seconds = (ms: number) => `${Math.round(ms / 1000)} s`;

/**
 * The pipeline in worker threads (server/workers/analyse-log.ts), so a large or awkward file never holds the event
 * loop: other requests are answered while it is read. A task past the time budget has its thread ended and answers
 * 422 analysis_too_long; a full queue answers 503 analysis_busy; a thread out of memory 422 analysis_too_large.
 */
export function pooledAnalyser({
  timeBudgetMs = logAnalysisLimits.timeBudgetMs,
  maxQueue = 8,
  maxHeapMb = 768,
  pool = lazyWorkerPool('analyse-log', { maxQueue, maxHeapMb, idleTimeoutMs: 60_000 }),
}: {
  timeBudgetMs?: number;
  maxQueue?: number;
  maxHeapMb?: number;
  pool?: LazyWorkerPool;
} = {}): PooledLogFileAnalyser {
  const analyse: LogFileAnalyser = async (bytes, request, signal) => {
    const budget = AbortSignal.timeout(timeBudgetMs);
    try {
      // Shared memory, filled slice by slice: the message to the worker then copies nothing on this thread.
      const task: AnalyseLogTask = { bytes: await sharedCopyInSlices(bytes), request };
      return await pool.run<AnalyseLogFileOutcome>(task, signal ? AbortSignal.any([budget, signal]) : budget);
    } catch (error) {
      if (budget.aborted) {
        throw new AppError(
          'analysis_too_long',
          422,
          `The analysis was stopped after ${seconds(timeBudgetMs)}, the most one file may take. Export fewer channels, log at a lower rate, or split the log into parts.`,
        );
      }
      if ((error as Error)?.message === 'Task queue is at limit') {
        throw new AppError(
          'analysis_busy',
          503,
          'Benchwire is analysing other files right now. Try again in a minute.',
        );
      }
      if ((error as { code?: string })?.code === 'ERR_WORKER_OUT_OF_MEMORY') {
        throw new AppError(
          'analysis_too_large',
          422,
          'The file needs more memory to analyse than one analysis may use. Export fewer channels, log at a lower rate, or split the log into parts.',
        );
      }
      throw error;
    }
  };
  return Object.assign(analyse, { close: () => pool.close() });
}

const extensionList = logFileUploadLimit.acceptedExtensions.join(', ');

/**
 * Log check: a tester's logger file, read and analysed without saving anything. The file type is checked here; the
 * reading, mapping and analysis are the one pipeline in shared/domain/analysis/analyse-log, run by the analyser.
 */
export class LogCheckService {
  constructor(private readonly analyser: LogFileAnalyser = analyseInProcess) {}

  /** `signal`: the caller went away; the work stops. */
  async analyse(
    file: LogFileUpload | undefined,
    request: AnalysisRequestInput,
    signal?: AbortSignal,
  ): Promise<AnalysisPreviewResponse> {
    const upload = checkLogFileUpload(file);
    return analysedOrThrow(await this.analyser(upload.buffer, request, signal));
  }
}

/** The checks every logger-file upload passes before it is read: a file is attached, named like a log, not empty. */
export function checkLogFileUpload(file: LogFileUpload | undefined): LogFileUpload {
  if (!file) {
    throw new AppError('validation_failed', 400, 'Attach a logger file (CSV or TSV).', { file: 'Choose a file.' });
  }
  const name = file.originalname.toLowerCase();
  if (!logFileUploadLimit.acceptedExtensions.some((extension) => name.endsWith(extension))) {
    throw new AppError('unsupported_file', 415, `Upload the logger export as ${extensionList}.`, {
      file: `Use a ${extensionList} file.`,
    });
  }
  if (file.buffer.length === 0) {
    throw new AppError('validation_failed', 400, 'The file is empty.', { file: 'The file is empty.' });
  }
  return file;
}

/** The pipeline's answer, or the 415 (not text) / 422 (rows and columns that could not be read) a person can act on. */
export function analysedOrThrow(outcome: AnalyseLogFileOutcome): AnalysisPreviewResponse {
  if ('notText' in outcome) {
    throw new AppError('unsupported_file', 415, 'This is not a text export: save the log as CSV or TSV.', {
      file: 'Not a text file.',
    });
  }
  if (!outcome.ok) {
    throw new AppError(
      'log_parse_failed',
      422,
      'The logger file could not be read. See the listed rows and columns.',
      undefined,
      { preview: outcome.preview, errors: outcome.errors },
    );
  }
  return { preview: outcome.preview, analysis: outcome.analysis };
}
