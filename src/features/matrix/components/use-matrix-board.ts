import { useMemo, useState } from 'react';
import { z } from 'zod';
import { describeSubmitError } from '../../../lib/form-errors';
import { formatCalendarDate } from '../../../lib/format-time';
import { countOf } from '../../../lib/plural';
import { useZodForm } from '../../../lib/use-zod-form';
import {
  assignableStates,
  cellStateLabels,
  type CellAction,
} from '../../../../shared/domain/planning/matrix-cell-states';
import { calendarDateSchema } from '../../../../shared/schemas/planning-fields';
import type { AssignCellsRequest, MatrixCell, RoundupMatrix } from '../../../../shared/schemas/matrix';
import type { PersonRef } from '../../../../shared/schemas/planning-fields';

export type MatrixNotice = { tone: 'success' | 'danger'; text: string } | null;

export interface MatrixBoardIo {
  /** Sends an assignment; resolves with the cells that were assigned. */
  assignCells: (assignment: AssignCellsRequest) => Promise<{ cells: readonly MatrixCell[] }>;
  /** Moves one cell; resolves with the cell as it now is. */
  transitionCell: (move: { cellId: number; action: CellAction; note?: string }) => Promise<MatrixCell>;
}

export interface UseMatrixBoardOptions extends MatrixBoardIo {
  matrix: RoundupMatrix;
  /** Editors on an open roundup choose and assign cells. */
  assigning: boolean;
  testers: readonly PersonRef[] | undefined;
}

/** The assignment form's own fields; which cells it applies to comes from the choice in the grid. */
const assignFormSchema = z.object({
  testerId: z.string().min(1, 'Choose a tester.'),
  dueDate: z.string().min(1, 'Choose the due date.').pipe(calendarDateSchema),
});

const noCellsMessage = 'Choose at least one cell or row.';

function toggled(set: ReadonlySet<number>, id: number, on: boolean): ReadonlySet<number> {
  const next = new Set(set);
  if (on) next.add(id);
  else next.delete(id);
  return next;
}

/**
 * The matrix's state machine: which cells and rows are chosen, the assignment form, and the moves of single cells
 * (with the send-back reason). Talks to the server only through `assignCells` and `transitionCell`.
 */
export function useMatrixBoard({ matrix, assigning, testers, assignCells, transitionCell }: UseMatrixBoardOptions) {
  const [chosenRows, setChosenRows] = useState<ReadonlySet<number>>(new Set());
  const [chosenCells, setChosenCells] = useState<ReadonlySet<number>>(new Set());
  const [cellsError, setCellsError] = useState<string | undefined>();
  const [assignPending, setAssignPending] = useState(false);
  const [pendingCellId, setPendingCellId] = useState<number | undefined>();
  const [notice, setNotice] = useState<MatrixNotice>(null);
  const [sendBack, setSendBack] = useState<{ cell: MatrixCell; name: string } | null>(null);
  const [sendBackError, setSendBackError] = useState<string | undefined>();

  const form = useZodForm({
    schema: assignFormSchema,
    initialValues: { testerId: '', dueDate: '' },
    labels: { testerId: 'Tester', dueDate: 'Due date' },
  });

  const isAssignable = (cell: MatrixCell) => assigning && assignableStates.includes(cell.state);

  const chosenCount = useMemo(() => {
    let count = 0;
    for (const row of matrix.rows) {
      for (const cell of row.cells) {
        if (!assignableStates.includes(cell.state)) continue;
        if (chosenRows.has(row.entryId) || chosenCells.has(cell.id)) count += 1;
      }
    }
    return count;
  }, [matrix.rows, chosenRows, chosenCells]);

  const chooseRow = (entryId: number, on: boolean) => {
    setChosenRows((current) => toggled(current, entryId, on));
    setCellsError(undefined);
  };
  const chooseCell = (cellId: number, on: boolean) => {
    setChosenCells((current) => toggled(current, cellId, on));
    setCellsError(undefined);
  };
  const clearChoice = () => {
    setChosenRows(new Set());
    setChosenCells(new Set());
  };

  const submitAssignment = async () => {
    setNotice(null);
    // Cells inside a chosen row go with the row.
    const cellIds = [...chosenCells].filter(
      (id) => !matrix.rows.some((row) => chosenRows.has(row.entryId) && row.cells.some((c) => c.id === id)),
    );
    const entryIds = [...chosenRows];
    // Every problem at once: the form's fields and the choice of cells.
    const nothingChosen = cellIds.length + entryIds.length === 0;
    setCellsError(nothingChosen ? noCellsMessage : undefined);
    const input = form.validate();
    if (!input || nothingChosen) return;

    const testerId = Number(input.testerId);
    const testerName = testers?.find((tester) => tester.id === testerId)?.displayName ?? 'the tester';
    setAssignPending(true);
    try {
      const { cells } = await assignCells({ cellIds, entryIds, testerId, dueDate: input.dueDate });
      clearChoice();
      setNotice({
        tone: 'success',
        text:
          cells.length === 0
            ? 'Nothing was assigned: the chosen rows have no cells that can be assigned.'
            : `${countOf(cells.length, 'cell', 'cells')} assigned to ${testerName}, due ${formatCalendarDate(input.dueDate)}.`,
      });
    } catch (error) {
      form.fail(error);
      setNotice({ tone: 'danger', text: describeSubmitError(error).message });
    } finally {
      setAssignPending(false);
    }
  };

  const move = async (cell: MatrixCell, name: string, action: CellAction, note?: string) => {
    setNotice(null);
    setPendingCellId(cell.id);
    try {
      const updated = await transitionCell({ cellId: cell.id, action, note });
      setSendBack(null);
      setNotice({ tone: 'success', text: `${name}: ${cellStateLabels[updated.state]}.` });
    } catch (error) {
      const { message } = describeSubmitError(error);
      if (action === 'send-back') setSendBackError(message);
      else setNotice({ tone: 'danger', text: `${name} did not move. ${message}` });
    } finally {
      setPendingCellId(undefined);
    }
  };

  /** A cell's move button: send-back first asks why, every other move goes straight to the server. */
  const requestMove = (cell: MatrixCell, name: string, action: CellAction) => {
    if (action === 'send-back') {
      setSendBackError(undefined);
      setSendBack({ cell, name });
    } else void move(cell, name, action);
  };

  return {
    notice,
    selection: {
      count: chosenCount,
      isRowChosen: (entryId: number) => chosenRows.has(entryId),
      isCellChosen: (cellId: number) => chosenCells.has(cellId),
      isAssignable,
      chooseRow,
      chooseCell,
      clear: clearChoice,
    },
    assignment: {
      form,
      cellsError,
      pending: assignPending,
      submit: () => void submitAssignment(),
    },
    moves: {
      pendingCellId,
      request: requestMove,
      sendBack: {
        cellName: sendBack?.name ?? null,
        error: sendBackError,
        pending: pendingCellId !== undefined && pendingCellId === sendBack?.cell.id,
        send: (note: string) => sendBack && void move(sendBack.cell, sendBack.name, 'send-back', note),
        close: () => setSendBack(null),
      },
    },
  };
}

export type MatrixBoardState = ReturnType<typeof useMatrixBoard>;
