import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { matrixCellSchema, type MatrixCell } from '../../../../shared/schemas/matrix';
import type { CellAction } from '../../../../shared/domain/planning/matrix-cell-states';
import { invalidatePlanning } from '../../../lib/invalidate-planning';

export interface TransitionCellInput {
  roundupId: number;
  cellId: number;
  action: CellAction;
  /** Required for send-back: why the cell needs a retest. */
  note?: string;
}

/** One move of one cell; 403 when it is not the user's to make, 422 when the cell's state does not allow it. */
export function transitionCell({ roundupId, cellId, action, note }: TransitionCellInput): Promise<MatrixCell> {
  return apiClient.post(
    `/api/roundups/${roundupId}/cells/${cellId}/transitions`,
    { action, ...(note ? { note } : {}) },
    { schema: matrixCellSchema },
  );
}

export function useTransitionCell() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: transitionCell, onSuccess: () => invalidatePlanning(queryClient) });
}
