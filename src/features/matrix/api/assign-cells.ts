import type { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { assignCellsResponseSchema, type AssignCellsRequest } from '../../../../shared/schemas/matrix';
import { useChangeMutation } from '../../../lib/stale-after';

export interface AssignCellsInput {
  roundupId: number;
  assignment: AssignCellsRequest;
}

export type AssignCellsResult = z.infer<typeof assignCellsResponseSchema>;

/** Assigns chosen cells and whole rows to one tester with a due date. */
export function assignCells({ roundupId, assignment }: AssignCellsInput): Promise<AssignCellsResult> {
  return apiClient.post(`/api/roundups/${roundupId}/assignments`, assignment, { schema: assignCellsResponseSchema });
}

export function useAssignCells() {
  return useChangeMutation(assignCells, 'plan');
}
