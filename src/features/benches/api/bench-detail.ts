import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';
import {
  benchDetailSchema,
  instrumentSchema,
  maintenanceEntrySchema,
  type BenchDetail,
  type CreateInstrumentRequest,
  type CreateMaintenanceRequest,
  type Instrument,
  type MaintenanceEntry,
  type UpdateInstrumentRequest,
} from '../../../../shared/schemas/bench-detail';
import { benchKeys } from './bench-keys';

/** One bench: its set-up, probes and logger with their calibration, and its maintenance log. */
export function getBenchDetail(id: number, signal?: AbortSignal): Promise<BenchDetail> {
  return apiClient.get(`/api/benches/${id}/detail`, { signal, schema: benchDetailSchema });
}

export function benchDetailQueryOptions(id: number) {
  return queryOptions({ queryKey: benchKeys.detail(id), queryFn: ({ signal }) => getBenchDetail(id, signal) });
}

export function useBenchDetail(id: number) {
  return useSuspenseQuery(benchDetailQueryOptions(id)).data;
}

export function addInstrument({ benchId, instrument }: { benchId: number; instrument: CreateInstrumentRequest }) {
  return apiClient.post<Instrument>(`/api/benches/${benchId}/instruments`, instrument, { schema: instrumentSchema });
}

export function updateInstrument({
  benchId,
  instrumentId,
  changes,
}: {
  benchId: number;
  instrumentId: number;
  changes: UpdateInstrumentRequest;
}) {
  return apiClient.patch<Instrument>(`/api/benches/${benchId}/instruments/${instrumentId}`, changes, {
    schema: instrumentSchema,
  });
}

export function logMaintenance({ benchId, entry }: { benchId: number; entry: CreateMaintenanceRequest }) {
  return apiClient.post<MaintenanceEntry>(`/api/benches/${benchId}/maintenance`, entry, {
    schema: maintenanceEntrySchema,
  });
}

export function useAddInstrument() {
  return useChangeMutation(addInstrument, 'bench');
}

export function useUpdateInstrument() {
  return useChangeMutation(updateInstrument, 'bench');
}

export function useLogMaintenance() {
  return useChangeMutation(logMaintenance, 'bench');
}
