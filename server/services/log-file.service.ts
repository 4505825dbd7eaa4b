import { AppError } from '../errors';
import { loggerFileText } from '../../shared/domain/analysis/logger-file-text';

const acceptedExtensions = /\.(csv|tsv|txt|log|dat)$/i;

/** Turns an uploaded logger file into text, refusing other file types and binary content with clear errors. */
export function decodeLogFile(fileName: string, bytes: Buffer): string {
  if (!acceptedExtensions.test(fileName)) {
    throw new AppError('unsupported_file', 415, 'Upload the logger export as .csv, .tsv or .txt.', {
      file: 'Use a .csv, .tsv or .txt file.',
    });
  }
  if (bytes.length === 0) {
    throw new AppError('validation_failed', 400, 'The file is empty.', { file: 'The file is empty.' });
  }
  const text = loggerFileText(bytes);
  if (text === null) {
    throw new AppError('unsupported_file', 415, 'This is not a text export: save the log as CSV or TSV.', {
      file: 'Not a text file.',
    });
  }
  return text;
}
