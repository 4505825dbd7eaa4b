import { useMutation } from '@tanstack/react-query';
import { isApiError } from '../../../lib/api-client';
import { uploadFile, type UploadProgress } from '../../../lib/upload';
import { logFileUploadLimit } from '../../../../shared/upload-limits';
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

/**
 * POST /api/log-check/analyse. 200 and a 422 `log_parse_failed` are both answers about the file (the 422's details
 * hold the preview and every row-and-column problem); anything else is thrown as an ApiError.
 */
export async function analyseLog({ file, request, onProgress, signal }: AnalyseLogInput): Promise<AnalyseLogOutcome> {
  try {
    const answer = await uploadFile({
      path: analysisPreviewPath,
      file: { blob: file, fileName: file.name },
      fields: request ? { request: JSON.stringify(request) } : {},
      schema: analysisPreviewResponseSchema,
      limit: logFileUploadLimit,
      onProgress,
      signal,
    });
    return { kind: 'analysed', ...answer };
  } catch (error) {
    if (isApiError(error) && error.status === 422 && error.code === 'log_parse_failed') {
      const details = analysisPreviewFailureSchema.safeParse(error.details);
      if (details.success) return { kind: 'unreadable', ...details.data, message: error.message };
    }
    throw error;
  }
}

/** Nothing is stored by this endpoint, so there is no cache to invalidate. */
export function useAnalyseLog() {
  return useMutation({ mutationKey: logCheckKeys.item('analyse'), mutationFn: analyseLog });
}
