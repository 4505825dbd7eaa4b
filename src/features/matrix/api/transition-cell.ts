import { apiClient } from '../../../lib/api-client';
import { matrixCellSchema, type MatrixCell } from '../../../../shared/schemas/matrix';
import type { CellAction } from '../../../../shared/domain/planning/matrix-cell-states';
import { useChangeMutation } from '../../../lib/stale-after';

export interface TransitionCellInput {
  roundupId: number;
  cellId: number;
  action: CellAction;
  /** Required for send-back: why the cell needs a retest. */
  note?: string;
  /** A tester's reason to start a run outside every booking of the cell (after a 409 start_outside_booking). */
  overrideReason?: string;
}

/** One move of one cell; 403 when it is not the user's to make, 422 when the cell's state does not allow it. */
export function transitionCell({
  roundupId,
  cellId,
  action,
  note,
  overrideReason,
}: TransitionCellInput): Promise<MatrixCell> {
  return apiClient.post(
    `/api/roundups/${roundupId}/cells/${cellId}/transitions`,
    { action, ...(note ? { note } : {}), ...(overrideReason ? { overrideReason } : {}) },
    { schema: matrixCellSchema },
  );
}

export function useTransitionCell() {
  return useChangeMutation(transitionCell, 'plan');
}
