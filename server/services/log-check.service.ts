import { AppError } from '../errors';
import type { AnalysisPreviewResponse, AnalysisRequestInput } from '../../shared/schemas/analysis';
import { analyseLogFile, type AnalyseLogFileOutcome } from '../../shared/domain/analysis/analyse-log';
import { logFileUploadLimit } from '../../shared/upload-limits';

/** An uploaded logger file as the upload middleware hands it over. */
export interface LogFileUpload {
  originalname: string;
  buffer: Uint8Array;
}

/** Runs the analysis pipeline on a file's bytes (in a worker pool on the server, in the process in the lab CLI). */
export type LogFileAnalyser = (bytes: Uint8Array, request: AnalysisRequestInput) => Promise<AnalyseLogFileOutcome>;

/** The pipeline in this process (the lab CLI; the server until it hands the work to its worker pool). */
export const analyseInProcess: LogFileAnalyser = async (bytes, request) => analyseLogFile(bytes, request);

const extensionList = logFileUploadLimit.acceptedExtensions.join(', ');

/**
 * Log check: a tester's logger file, read and analysed without saving anything. The file type is checked here; the
 * reading, mapping and analysis are the one pipeline in shared/domain/analysis/analyse-log.
 */
export class LogCheckService {
  constructor(private readonly analyser: LogFileAnalyser = analyseInProcess) {}

  async analyse(file: LogFileUpload | undefined, request: AnalysisRequestInput): Promise<AnalysisPreviewResponse> {
    const upload = checkLogFileUpload(file);
    return analysedOrThrow(await this.analyser(upload.buffer, request));
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
