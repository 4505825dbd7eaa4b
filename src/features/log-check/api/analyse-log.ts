import { useMutation } from '@tanstack/react-query';
import { ApiError } from '../../../lib/api-client';
import { apiErrorSchema } from '../../../../shared/schemas/common';
import {
  analysisPreviewFailureSchema,
  analysisPreviewResponseSchema,
  type AnalysisRequestInput,
  type AnalysisResult,
  type LogPreview,
  type ParseError,
} from '../../../../shared/schemas/analysis';
import { logCheckKeys } from './log-check-keys';

export const analysisPreviewPath = '/api/log-check/analyse';

/** The server refuses larger files (MAX_LOG_BYTES in server/routes/analysis.routes.ts); checked here first. */
export const maxLogBytes = 25 * 1024 * 1024;

export interface UploadProgress {
  /** 'uploading' while bytes go out; 'reading' once they are all sent and the server is analysing. */
  phase: 'uploading' | 'reading';
  loadedBytes: number;
  /** Null when the browser cannot tell the size of the request. */
  totalBytes: number | null;
}

export type AnalyseLogOutcome =
  | { kind: 'analysed'; preview: LogPreview; analysis: AnalysisResult }
  /** 422: the file or the mapping could not be read; the preview is there when the table itself could be. */
  | { kind: 'unreadable'; preview: LogPreview | null; errors: ParseError[]; message: string };

export interface AnalyseLogInput {
  file: File;
  /** Null for the first look at a file: the server then answers with its guessed mapping, which is never kept. */
  request: AnalysisRequestInput | null;
  onProgress?: (progress: UploadProgress) => void;
  signal?: AbortSignal;
}

const networkMessage = 'Benchwire could not reach the server. Check the connection and try again.';
const unexpectedMessage = 'The server sent an answer this page does not understand.';

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

function errorFrom(status: number, body: unknown): ApiError {
  const parsed = apiErrorSchema.safeParse(body);
  if (parsed.success) {
    const { code, message, fields } = parsed.data.error;
    return new ApiError(status, code, message, fields ?? {});
  }
  if (status === 413) {
    return new ApiError(status, 'payload_too_large', 'The file is larger than the server accepts (25 MB).', {
      file: 'The file is too large.',
    });
  }
  return new ApiError(
    status,
    `http_${status}`,
    status >= 500 ? 'Something went wrong on the server.' : unexpectedMessage,
  );
}

/**
 * POST /api/log-check/analyse as multipart. XMLHttpRequest rather than fetch because only XHR reports upload progress,
 * which a tester needs to see for a long soak logged at a high rate. 200 and 422 are both answers about the file;
 * anything else is thrown as an ApiError (400/415 carry the message for the file field).
 */
export function analyseLog({ file, request, onProgress, signal }: AnalyseLogInput): Promise<AnalyseLogOutcome> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', analysisPreviewPath);
    xhr.setRequestHeader('Accept', 'application/json');

    xhr.upload.addEventListener('progress', (event) => {
      onProgress?.({
        phase: 'uploading',
        loadedBytes: event.loaded,
        totalBytes: event.lengthComputable ? event.total : null,
      });
    });
    xhr.upload.addEventListener('load', () => {
      onProgress?.({ phase: 'reading', loadedBytes: file.size, totalBytes: file.size });
    });

    xhr.addEventListener('load', () => {
      const body = parseJson(xhr.responseText);
      if (xhr.status === 200) {
        const checked = analysisPreviewResponseSchema.safeParse(body);
        if (checked.success) resolve({ kind: 'analysed', ...checked.data });
        else reject(new ApiError(200, 'unexpected_response', unexpectedMessage));
        return;
      }
      if (xhr.status === 422) {
        const checked = analysisPreviewFailureSchema.safeParse(body);
        const error = apiErrorSchema.safeParse(body);
        if (checked.success) {
          resolve({
            kind: 'unreadable',
            preview: checked.data.preview,
            errors: checked.data.errors,
            message: error.success ? error.data.error.message : 'The logger file could not be read.',
          });
          return;
        }
      }
      reject(errorFrom(xhr.status, body));
    });
    xhr.addEventListener('error', () => reject(new ApiError(0, 'network_error', networkMessage)));
    xhr.addEventListener('abort', () => reject(new DOMException('The upload was cancelled.', 'AbortError')));

    if (signal) {
      if (signal.aborted) {
        reject(new DOMException('The upload was cancelled.', 'AbortError'));
        return;
      }
      signal.addEventListener('abort', () => xhr.abort(), { once: true });
    }

    // Text fields first, so the server has the settings by the time the file arrives.
    const form = new FormData();
    if (request) form.append('request', JSON.stringify(request));
    form.append('file', file, file.name);
    onProgress?.({ phase: 'uploading', loadedBytes: 0, totalBytes: file.size });
    xhr.send(form);
  });
}

export function isAbortError(error: unknown): boolean {
  return error instanceof DOMException && error.name === 'AbortError';
}

/** Nothing is stored by this endpoint, so there is no cache to invalidate. */
export function useAnalyseLog() {
  return useMutation({ mutationKey: logCheckKeys.item('analyse'), mutationFn: analyseLog });
}
