import { formatUploadBytes, type UploadLimit } from '../../shared/upload-limits';

/** Sizes as the server writes them in its messages (one function, from shared/upload-limits). */
export const formatBytes = formatUploadBytes;

/** What to tell the user about a file over the limit, before anything is sent: its size, the limit, what to do. */
export function fileTooLargeMessage(fileName: string, sizeBytes: number, limit: UploadLimit): string {
  return `“${fileName}” is ${formatBytes(sizeBytes)}; the limit is ${formatBytes(limit.maxFileBytes)}. ${limit.whenTooLarge}`;
}

/** Whether a file name ends in one of the endings the upload's route reads. */
export function hasAcceptedExtension(fileName: string, limit: UploadLimit): boolean {
  const name = fileName.toLowerCase();
  return limit.acceptedExtensions.some((extension) => name.endsWith(extension));
}

/** The file input's `accept` list for an upload. */
export function acceptAttribute(limit: UploadLimit): string {
  return limit.acceptedExtensions.join(',');
}
