import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { matrixCellSchema, type MatrixCell } from '../../../../shared/schemas/matrix';
import type { CellAction } from '../../../../shared/domain/planning/matrix-cell-states';
import { invalidatePlanning } from '../../../lib/invalidate-planning';

export interface MoveCellInput {
  roundupId: number;
  cellId: number;
  action: CellAction;
}

/** A tester's own move: start a run, put it back in the queue, or mark it recorded. */
export function moveCell({ roundupId, cellId, action }: MoveCellInput): Promise<MatrixCell> {
  return apiClient.post(
    `/api/roundups/${roundupId}/cells/${cellId}/transitions`,
    { action },
    { schema: matrixCellSchema },
  );
}

export function useMoveCell() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: moveCell, onSuccess: () => invalidatePlanning(queryClient) });
}
