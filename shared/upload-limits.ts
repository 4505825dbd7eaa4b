/**
 * Size limits of every upload, imported by the server's one multer set-up and by the client's upload helper, so a
 * file the browser lets through is never refused by the server for its size (and the other way round).
 *
 * Sizes are bytes. A field limit counts the text fields of one multipart request (the file parts are counted by
 * `files`). The numbers are Benchwire's own choices; the reasons are beside each.
 */

export interface UploadLimit {
  /** Largest file, in bytes. */
  maxFileBytes: number;
  /** Most files in one request. */
  maxFiles: number;
  /** Most text fields besides the files. */
  maxFields: number;
  /** Longest text field value, in bytes (the analysis settings JSON, a checksum). */
  maxFieldBytes: number;
  /** File name endings the route reads; the client's file picker offers only these. */
  acceptedExtensions: readonly string[];
  /** What to do with a file over the limit, said after the limit in messages on both sides. */
  whenTooLarge: string;
}

const mebibyte = 1024 * 1024;

/**
 * A logger export: a one-hour soak at 10 Hz with a dozen channels is ~3 MB; a day-long log at 1 Hz is smaller still.
 * 25 MB (MiB) leaves room for long logs at high rates without letting a file hold a request for long.
 */
export const logFileUploadLimit: UploadLimit = {
  maxFileBytes: 25 * mebibyte,
  maxFiles: 1,
  maxFields: 2,
  maxFieldBytes: 64 * 1024,
  acceptedExtensions: ['.csv', '.tsv', '.txt', '.log', '.dat'],
  whenTooLarge: 'Split a long log into parts, or export fewer channels.',
};

/** A catalog CSV: 2,000 rows of product fields stay well under 900 kB (CATALOG_IMPORT_MAX_ROWS). */
export const catalogImportUploadLimit: UploadLimit = {
  maxFileBytes: 900_000,
  maxFiles: 1,
  maxFields: 2,
  maxFieldBytes: 1024,
  acceptedExtensions: ['.csv', '.txt'],
  whenTooLarge: 'Split the CSV into parts of at most 2,000 rows.',
};

/**
 * A bench photo straight from a camera: full-size JPEGs of 24–45 megapixels run 10–25 MB (common practice, no
 * source). The pixel limit is checked from the image header on the server (server/images).
 */
export const photoUploadLimit: UploadLimit = {
  maxFileBytes: 32 * mebibyte,
  maxFiles: 1,
  maxFields: 4,
  maxFieldBytes: 4 * 1024,
  acceptedExtensions: ['.jpg', '.jpeg', '.png', '.webp'],
  whenTooLarge: 'Export the photo at a smaller size or higher compression.',
};

/**
 * Limits on the shape of a logger file, checked before the heavy work so a file that would hold a worker for long is
 * refused at once with a message that says what to change. Every real logger export we know fits well inside them.
 */
export const logAnalysisLimits = {
  /** Longest line, in characters. A 256-channel row of 20-character cells is ~5,000. */
  maxLineChars: 64 * 1024,
  /** Most columns in the header. Multichannel data loggers log up to a few hundred channels. */
  maxColumns: 512,
  /** Most cells (data lines × columns): a 24-hour soak at 10 Hz with 5 channels is 4.3 million. */
  maxCells: 5_000_000,
  /**
   * Longest an analysis may run before it is stopped and the file refused with a message. Measured here, on 2 cores
   * with a load average of 20–30: the worst accepted file took 6–10 s in the event loop, 14–23 s in a worker thread
   * run below the event loop's priority.
   */
  timeBudgetMs: 30_000,
} as const;

const thinSpace = '\u2009';

/**
 * How a size is written in messages on both sides: powers of 1024 as file managers show them, one decimal below 10,
 * whole numbers above (878 KB, 2.4 MB, 25 MB).
 */
export function formatUploadBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes}${thinSpace}B`;
  const [value, unit] = bytes < mebibyte ? [bytes / 1024, 'KB'] : [bytes / mebibyte, 'MB'];
  const digits = value < 10 && !Number.isInteger(value) ? 1 : 0;
  return `${value.toLocaleString('en-GB', { maximumFractionDigits: digits })}${thinSpace}${unit}`;
}
