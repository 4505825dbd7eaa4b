import { useAssignCells } from '../api/assign-cells';
import { useMatrix } from '../api/get-matrix';
import { useTesters } from '../api/get-testers';
import { useTransitionCell } from '../api/transition-cell';
import { isAssigning, MatrixBoard } from './matrix-board';
import type { MatrixViewer } from './matrix-table';

export interface MatrixGridProps {
  roundupId: number;
  /** Editors assign cells (the server checks again). */
  canAssign: boolean;
  /** Who looks: a tester sees the runs links of their own cells only. */
  viewer?: MatrixViewer;
}

/**
 * The test matrix of one roundup: products down, load configurations across, one cell per pair with its state and
 * tester. Editors choose cells or rows and assign them; every cell offers the moves the server allows this user.
 */
export function MatrixGrid({ roundupId, canAssign, viewer }: MatrixGridProps) {
  const matrix = useMatrix(roundupId);
  const testers = useTesters(isAssigning(matrix, canAssign));
  const assign = useAssignCells();
  const transition = useTransitionCell();
  return (
    <MatrixBoard
      matrix={matrix}
      canAssign={canAssign}
      viewer={viewer}
      testers={testers.data}
      assignCells={(assignment) => assign.mutateAsync({ roundupId, assignment })}
      transitionCell={(move) => transition.mutateAsync({ roundupId, ...move })}
    />
  );
}
