import { queryOptions, useMutation, useQuery, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient, apiRequest } from '../../../lib/api-client';
import { createQueryKeys } from '../../../lib/query-keys';
import { invalidateAfter } from '../../../lib/stale-after';
import { uploadFile, type UploadProgress } from '../../../lib/upload';
import { logFileUploadLimit } from '../../../../shared/upload-limits';
import type { VerdictRubric } from '../../../../shared/schemas/analysis';
import {
  cellRunsSchema,
  createRunResponseSchema,
  roundupResultsSchema,
  testRunSchema,
  type CellRuns,
  type LoggerRunRequest,
  type ManualRunRequest,
  type ReanalyseRunRequest,
  type ReviewRunRequest,
  type RoundupResults,
} from '../../../../shared/schemas/test-runs';

export const testRunKeys = createQueryKeys('test-runs');

export function getCellRuns(cellId: number, signal?: AbortSignal): Promise<CellRuns> {
  return apiClient.get(`/api/cells/${cellId}/runs`, { signal, schema: cellRunsSchema });
}

export function cellRunsQueryOptions(cellId: number) {
  return queryOptions({
    queryKey: [...testRunKeys.all, 'cell', cellId] as const,
    queryFn: ({ signal }) => getCellRuns(cellId, signal),
  });
}

export function useCellRuns(cellId: number) {
  return useSuspenseQuery(cellRunsQueryOptions(cellId)).data;
}

export function getRoundupResults(roundupId: number, signal?: AbortSignal): Promise<RoundupResults> {
  return apiClient.get(`/api/roundups/${roundupId}/results`, { signal, schema: roundupResultsSchema });
}

export function roundupResultsQueryOptions(roundupId: number) {
  return queryOptions({
    queryKey: [...testRunKeys.all, 'results', roundupId] as const,
    queryFn: ({ signal }) => getRoundupResults(roundupId, signal),
  });
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
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ cellId, file, request, onProgress, signal }: RecordLoggerRunInput) =>
      uploadFile({
        path: `/api/cells/${cellId}/runs`,
        file: { blob: file, fileName: file.name },
        fields: { request: JSON.stringify(request) },
        schema: createRunResponseSchema,
        limit: logFileUploadLimit,
        onProgress,
        signal,
      }),
    onSuccess: () => invalidateAfter(queryClient, 'run'),
  });
}

export function useRecordManualRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ cellId, request }: { cellId: number; request: ManualRunRequest }) =>
      apiClient.post(`/api/cells/${cellId}/manual-runs`, request, { schema: runResponseSchema }),
    onSuccess: () => invalidateAfter(queryClient, 'run'),
  });
}

export function useReviewRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ runId, review }: { runId: number; review: ReviewRunRequest }) =>
      apiClient.post(`/api/runs/${runId}/review`, review),
    onSuccess: () => invalidateAfter(queryClient, 'run'),
  });
}

export function useMarkRunOfRecord() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (runId: number) => apiClient.post(`/api/runs/${runId}/run-of-record`, {}),
    onSuccess: () => invalidateAfter(queryClient, 'run'),
  });
}

export function useReanalyseRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ runId, request = {} }: { runId: number; request?: ReanalyseRunRequest }) =>
      apiClient.post(`/api/runs/${runId}/analyses`, request),
    onSuccess: () => invalidateAfter(queryClient, 'run'),
  });
}

export function useSetRubric() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ roundupId, rubric }: { roundupId: number; rubric: VerdictRubric | null }) =>
      apiRequest(`/api/roundups/${roundupId}/rubric`, { method: 'PUT', body: { rubric } }),
    onSuccess: () => invalidateAfter(queryClient, 'run'),
  });
}
