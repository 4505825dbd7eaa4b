import { Alert } from '../../../components/ui/alert';
import { CellStateBadge } from '../../../components/ui/cell-state-badge';
import { EmptyState } from '../../../components/ui/empty-state';
import { cellStates } from '../../../../shared/domain/planning/matrix-cell-states';
import type { RoundupMatrix } from '../../../../shared/schemas/matrix';
import type { PersonRef } from '../../../../shared/schemas/planning-fields';
import { AssignBar } from './assign-bar';
import { MatrixTable, type MatrixViewer } from './matrix-table';
import { SendBackDialog } from './send-back-dialog';
import { useMatrixBoard, type MatrixBoardIo } from './use-matrix-board';

export interface MatrixBoardProps extends MatrixBoardIo {
  matrix: RoundupMatrix;
  /** Editors may assign (the server checks again); only while the roundup is planned or on the bench. */
  canAssign: boolean;
  testers: readonly PersonRef[] | undefined;
  /** Who looks: a tester sees the runs links of their own cells only. */
  viewer?: MatrixViewer;
}

const openStates = new Set(['planning', 'on-the-bench']);

/** Whether the editor's assignment controls show: an editor, on a roundup that is still planned or on the bench. */
export function isAssigning(matrix: RoundupMatrix, canAssign: boolean): boolean {
  return canAssign && openStates.has(matrix.roundupState);
}

/** The matrix with its counts, the assignment controls, the grid and the send-back dialog. */
export function MatrixBoard({ matrix, canAssign, testers, viewer, assignCells, transitionCell }: MatrixBoardProps) {
  const open = openStates.has(matrix.roundupState);
  const assigning = isAssigning(matrix, canAssign);
  const board = useMatrixBoard({ matrix, assigning, testers, assignCells, transitionCell });

  if (matrix.columns.length === 0 || matrix.rows.length === 0) {
    return (
      <EmptyState title="The matrix is empty">
        {matrix.columns.length === 0
          ? 'Add load configurations to the test plan: each one becomes a column.'
          : 'Add products to the roundup: each tested product becomes a row.'}
      </EmptyState>
    );
  }

  const counts = matrix.progress.countsByState;
  const { form } = board.assignment;

  return (
    <div>
      <ul aria-label="Cells by state" className="mb-3 flex flex-wrap gap-x-4 gap-y-1.5 text-sm">
        {cellStates.map((state) => (
          <li key={state} className="flex items-center gap-1.5">
            <CellStateBadge state={state} />
            <span className="numeric">{counts[state] ?? 0}</span>
          </li>
        ))}
      </ul>

      {assigning && (
        <AssignBar
          chosenCount={board.selection.count}
          testers={testers}
          tester={form.field('testerId')}
          dueDate={form.field('dueDate')}
          timeZone={matrix.timeZone}
          cellsError={board.assignment.cellsError}
          pending={board.assignment.pending}
          onAssign={board.assignment.submit}
          onClear={board.selection.clear}
        />
      )}
      {!open && <Alert className="mb-3">The roundup has left the bench: its matrix is closed to changes.</Alert>}
      {board.notice && (
        <Alert tone={board.notice.tone} announce className="mb-3">
          {board.notice.text}
        </Alert>
      )}

      <MatrixTable
        matrix={matrix}
        viewer={viewer}
        assigning={assigning}
        selection={board.selection}
        pendingCellId={board.moves.pendingCellId}
        onAction={board.moves.request}
      />
      <p className="mt-2 text-[0.8125rem] text-muted">
        Due dates end at midnight in {matrix.timeZone}. On a narrow screen the matrix scrolls sideways; the product
        names stay in view.
      </p>

      <SendBackDialog
        open={board.moves.sendBack.cellName !== null}
        cellName={board.moves.sendBack.cellName ?? ''}
        pending={board.moves.sendBack.pending}
        error={board.moves.sendBack.error}
        onClose={board.moves.sendBack.close}
        onSend={board.moves.sendBack.send}
      />
    </div>
  );
}
