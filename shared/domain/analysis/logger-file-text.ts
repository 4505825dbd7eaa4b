import { textFileContent } from '../text-file-content';

/**
 * The text of a logger export: UTF-8 (with or without a byte-order mark) or UTF-16 with a byte-order mark, as every
 * uploaded text file is read (see textFileContent). Null for a binary file (a spreadsheet, an image).
 */
export function loggerFileText(bytes: Uint8Array): string | null {
  return textFileContent(bytes);
}
