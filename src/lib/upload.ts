import type { z } from 'zod';
import { ApiError, apiErrorFrom, networkError, parseJsonBody, unexpectedResponseError } from './api-client';
import type { UploadLimit } from '../../shared/upload-limits';
import { fileTooLargeMessage } from './upload-size';

export interface UploadProgress {
  /** 'uploading' while bytes go out; 'processing' once all are sent and the server works on the file. */
  phase: 'uploading' | 'processing';
  loadedBytes: number;
  /** Null when the browser cannot tell the size of the request. */
  totalBytes: number | null;
}

/** A file as the user gave it: a chosen file, or text sent as a file of its own. */
export interface UploadFile {
  blob: Blob;
  fileName: string;
}

export interface UploadRequest<T> {
  path: string;
  file: UploadFile;
  /** Text fields, sent before the file so the server has them when the file arrives. */
  fields?: Record<string, string>;
  /** The 2xx body is checked against it; a mismatch is an error, never passed on. */
  schema: z.ZodType<T>;
  /** The upload's limits from shared/upload-limits: a file over the size is refused before a byte is sent. */
  limit: UploadLimit;
  onProgress?: (progress: UploadProgress) => void;
  signal?: AbortSignal;
}

/** The user cancelled the upload; nothing was answered. Not an error to show. */
export class UploadCancelled extends Error {
  constructor() {
    super('The upload was cancelled.');
    this.name = 'UploadCancelled';
  }
}

export function isUploadCancelled(error: unknown): error is UploadCancelled {
  return error instanceof UploadCancelled;
}

/**
 * POSTs one file as multipart/form-data. XMLHttpRequest rather than fetch because only XHR reports upload progress.
 * Resolves with the schema-checked 2xx body; rejects with an ApiError read exactly as apiRequest reads one (details
 * included), or with UploadCancelled. No sign-in redirect on 401: the page keeps the chosen file and says so.
 */
export function uploadFile<T>({
  path,
  file,
  fields = {},
  schema,
  limit,
  onProgress,
  signal,
}: UploadRequest<T>): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    if (signal?.aborted) {
      reject(new UploadCancelled());
      return;
    }
    if (file.blob.size > limit.maxFileBytes) {
      reject(new ApiError(413, 'payload_too_large', fileTooLargeMessage(file.fileName, file.blob.size, limit)));
      return;
    }

    const xhr = new XMLHttpRequest();
    xhr.open('POST', path);
    xhr.setRequestHeader('Accept', 'application/json');

    xhr.upload.addEventListener('progress', (event) => {
      onProgress?.({
        phase: 'uploading',
        loadedBytes: event.loaded,
        totalBytes: event.lengthComputable ? event.total : null,
      });
    });
    xhr.upload.addEventListener('load', () => {
      onProgress?.({ phase: 'processing', loadedBytes: file.blob.size, totalBytes: file.blob.size });
    });

    xhr.addEventListener('load', () => {
      const body = parseJsonBody(xhr.responseText);
      if (xhr.status < 200 || xhr.status >= 300) {
        reject(apiErrorFrom(xhr.status, body, xhr.getResponseHeader('retry-after')));
        return;
      }
      const checked = schema.safeParse(body);
      if (checked.success) resolve(checked.data);
      else reject(unexpectedResponseError(xhr.status));
    });
    xhr.addEventListener('error', () => reject(networkError()));
    xhr.addEventListener('abort', () => reject(new UploadCancelled()));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });

    const form = new FormData();
    for (const [name, value] of Object.entries(fields)) form.append(name, value);
    form.append('file', file.blob, file.fileName);
    onProgress?.({ phase: 'uploading', loadedBytes: 0, totalBytes: file.blob.size });
    xhr.send(form);
  });
}
