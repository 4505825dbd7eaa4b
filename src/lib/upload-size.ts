const thinSpace = '\u2009';

/** Sizes as file managers show them: powers of 1024, one decimal below 10, whole numbers above (878 KB, 2.4 MB). */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes}${thinSpace}B`;
  const [value, unit] = bytes < 1024 * 1024 ? [bytes / 1024, 'KB'] : [bytes / (1024 * 1024), 'MB'];
  const digits = value < 10 && !Number.isInteger(value) ? 1 : 0;
  return `${value.toLocaleString('en-GB', { maximumFractionDigits: digits })}${thinSpace}${unit}`;
}

/** What to tell the user about a file over the limit, before anything is sent. */
export function fileTooLargeMessage(fileName: string, sizeBytes: number, maxBytes: number): string {
  return `“${fileName}” is ${formatBytes(sizeBytes)}; the limit is ${formatBytes(maxBytes)}.`;
}
