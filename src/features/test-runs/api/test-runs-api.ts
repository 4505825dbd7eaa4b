import { useQuery, useSuspenseQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { endpointQueryOptions } from '../../../lib/endpoint-query';
import { apiClient, apiRequest } from '../../../lib/api-client';
import { createQueryKeys } from '../../../lib/query-keys';
import { useChangeMutation } from '../../../lib/stale-after';
import { uploadFile, type UploadProgress } from '../../../lib/upload';
import { logFileUploadLimit } from '../../../../shared/upload-limits';
import type { VerdictRubric } from '../../../../shared/schemas/analysis';
import {
  cellRunsSchema,
  createRunResponseSchema,
  roundupResultsSchema,
  testRunSchema,
  type LoggerRunRequest,
  type ManualRunRequest,
  type ReanalyseRunRequest,
  type ReviewRunRequest,
} from '../../../../shared/schemas/test-runs';

export const testRunKeys = createQueryKeys('test-runs');

export function cellRunsQueryOptions(cellId: number) {
  return endpointQueryOptions(
    [...testRunKeys.all, 'cell', cellId] as const,
    `/api/cells/${cellId}/runs`,
    cellRunsSchema,
  );
}

export function useCellRuns(cellId: number) {
  return useSuspenseQuery(cellRunsQueryOptions(cellId)).data;
}

export function roundupResultsQueryOptions(roundupId: number) {
  return endpointQueryOptions(
    [...testRunKeys.all, 'results', roundupId] as const,
    `/api/roundups/${roundupId}/results`,
    roundupResultsSchema,
  );
}

export function useRoundupResults(roundupId: number) {
  return useQuery(roundupResultsQueryOptions(roundupId));
}

const runResponseSchema = z.object({ run: testRunSchema });

export interface RecordLoggerRunInput {
  cellId: number;
  file: File;
  request: LoggerRunRequest;
  onProgress?: (progress: UploadProgress) => void;
  signal?: AbortSignal;
}

/** POST /api/cells/:cellId/runs: the same file the preview read, with the run's facts and the confirmed mapping. */
export function useRecordLoggerRun() {
  return useChangeMutation(
    ({ cellId, file, request, onProgress, signal }: RecordLoggerRunInput) =>
      uploadFile({
        path: `/api/cells/${cellId}/runs`,
        file: { blob: file, fileName: file.name },
        fields: { request: JSON.stringify(request) },
        schema: createRunResponseSchema,
        limit: logFileUploadLimit,
        onProgress,
        signal,
      }),
    'run',
  );
}

export function useRecordManualRun() {
  return useChangeMutation(
    ({ cellId, request }: { cellId: number; request: ManualRunRequest }) =>
      apiClient.post(`/api/cells/${cellId}/manual-runs`, request, { schema: runResponseSchema }),
    'run',
  );
}

export function useReviewRun() {
  return useChangeMutation(
    ({ runId, review }: { runId: number; review: ReviewRunRequest }) =>
      apiClient.post(`/api/runs/${runId}/review`, review),
    'run',
  );
}

export function useMarkRunOfRecord() {
  return useChangeMutation((runId: number) => apiClient.post(`/api/runs/${runId}/run-of-record`, {}), 'run');
}

export function useReanalyseRun() {
  return useChangeMutation(
    ({ runId, request = {} }: { runId: number; request?: ReanalyseRunRequest }) =>
      apiClient.post(`/api/runs/${runId}/analyses`, request),
    'run',
  );
}

export function useSetRubric() {
  return useChangeMutation(
    ({ roundupId, rubric }: { roundupId: number; rubric: VerdictRubric | null }) =>
      apiRequest(`/api/roundups/${roundupId}/rubric`, { method: 'PUT', body: { rubric } }),
    'run',
  );
}
