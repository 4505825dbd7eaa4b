import { AppError } from '../errors';

const acceptedExtensions = /\.(csv|tsv|txt|log|dat)$/i;

/**
 * Turns an uploaded logger file into text. Loggers write UTF-8 (with or without BOM) or UTF-16 with a BOM;
 * anything with NUL bytes and no UTF-16 BOM is a binary file (a spreadsheet, an image) and is refused.
 */
export function decodeLogFile(fileName: string, bytes: Buffer): string {
  if (!acceptedExtensions.test(fileName)) {
    throw new AppError('unsupported_file', 415, 'Upload the logger export as .csv, .tsv or .txt.', {
      file: 'Use a .csv, .tsv or .txt file.',
    });
  }
  if (bytes.length === 0) {
    throw new AppError('validation_failed', 400, 'The file is empty.', { file: 'The file is empty.' });
  }
  if (bytes[0] === 0xff && bytes[1] === 0xfe) return bytes.subarray(2).toString('utf16le');
  if (bytes[0] === 0xfe && bytes[1] === 0xff) {
    const swapped = Buffer.from(bytes.subarray(2));
    swapped.swap16();
    return swapped.toString('utf16le');
  }
  if (bytes.includes(0)) {
    throw new AppError('unsupported_file', 415, 'This is not a text export: save the log as CSV or TSV.', {
      file: 'Not a text file.',
    });
  }
  const text = bytes.toString('utf8');
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}
