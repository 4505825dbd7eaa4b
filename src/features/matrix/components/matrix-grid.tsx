import { useId, useMemo, useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { describeSubmitError } from '../../../lib/form-errors';
import { cx } from '../../../lib/class-names';
import {
  assignableStates,
  cellActionRules,
  cellStateLabels,
  cellStates,
  type CellAction,
} from '../../../../shared/domain/planning/matrix-cell-states';
import { assignCellsRequestSchema, type MatrixCell, type RoundupMatrix } from '../../../../shared/schemas/matrix';
import { useAssignCells } from '../api/assign-cells';
import { useMatrix } from '../api/get-matrix';
import { useTesters } from '../api/get-testers';
import { useTransitionCell } from '../api/transition-cell';
import { AssignBar } from './assign-bar';
import { CellStateBadge } from '../../../components/ui/cell-state-badge';
import { formatCalendarDate } from '../../../lib/format-time';
import { productName } from '../../../lib/product-name';
import { SendBackDialog } from './send-back-dialog';

export interface MatrixGridProps {
  roundupId: number;
  /** Editors assign cells (the server checks again). */
  canAssign: boolean;
}

type Row = RoundupMatrix['rows'][number];
type Notice = { tone: 'success' | 'danger'; text: string } | null;

const openStates = new Set(['planning', 'on-the-bench']);

/**
 * The test matrix: products down, load configurations across, one cell per pair with its state and tester.
 * Editors choose cells or rows and assign them; every cell offers the moves the server allows this user.
 */
export function MatrixGrid({ roundupId, canAssign }: MatrixGridProps) {
  const matrix = useMatrix(roundupId);
  const captionId = useId();
  const open = openStates.has(matrix.roundupState);
  const assigning = canAssign && open;
  const testers = useTesters(assigning);
  const assign = useAssignCells();
  const transition = useTransitionCell();

  const [chosenRows, setChosenRows] = useState<ReadonlySet<number>>(new Set());
  const [chosenCells, setChosenCells] = useState<ReadonlySet<number>>(new Set());
  const [testerId, setTesterId] = useState('');
  const [dueDate, setDueDate] = useState('');
  const [errors, setErrors] = useState<{ testerId?: string; dueDate?: string; cellIds?: string }>({});
  const [notice, setNotice] = useState<Notice>(null);
  const [sendBack, setSendBack] = useState<{ cell: MatrixCell; name: string } | null>(null);
  const [sendBackError, setSendBackError] = useState<string | undefined>();

  const columnName = useMemo(
    () => new Map(matrix.columns.map((column) => [column.loadConfigurationId, column.name])),
    [matrix.columns],
  );
  const assignable = (cell: MatrixCell) => assigning && assignableStates.includes(cell.state);

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

  const toggle = (set: ReadonlySet<number>, id: number, on: boolean) => {
    const next = new Set(set);
    if (on) next.add(id);
    else next.delete(id);
    return next;
  };

  const clearChoice = () => {
    setChosenRows(new Set());
    setChosenCells(new Set());
  };

  const submitAssignment = () => {
    setNotice(null);
    const cellIds = [...chosenCells].filter(
      (id) => !matrix.rows.some((row) => chosenRows.has(row.entryId) && row.cells.some((c) => c.id === id)),
    );
    const parsed = assignCellsRequestSchema.safeParse({
      cellIds,
      entryIds: [...chosenRows],
      testerId: testerId ? Number(testerId) : undefined,
      dueDate,
    });
    if (!parsed.success) {
      const next: typeof errors = {};
      for (const issue of parsed.error.issues) {
        const key = String(issue.path[0]) as keyof typeof errors;
        if (key === 'testerId') next.testerId ??= 'Choose a tester.';
        else if (key === 'dueDate') next.dueDate ??= dueDate ? issue.message : 'Choose the due date.';
        else next.cellIds ??= issue.message;
      }
      setErrors(next);
      return;
    }
    setErrors({});
    const testerName = testers.data?.find((t) => t.id === parsed.data.testerId)?.displayName ?? 'the tester';
    assign.mutate(
      { roundupId, assignment: parsed.data },
      {
        onSuccess: ({ cells }) => {
          clearChoice();
          setNotice({
            tone: 'success',
            text:
              cells.length === 0
                ? 'Nothing was assigned: the chosen rows have no cells that can be assigned.'
                : `${cells.length} cell${cells.length === 1 ? '' : 's'} assigned to ${testerName}, due ${formatCalendarDate(parsed.data.dueDate)}.`,
          });
        },
        onError: (error) => {
          const { fields, message } = describeSubmitError(error);
          setErrors({ testerId: fields.testerId, dueDate: fields.dueDate });
          setNotice({ tone: 'danger', text: message });
        },
      },
    );
  };

  const move = (cell: MatrixCell, name: string, action: CellAction, note?: string) => {
    setNotice(null);
    transition.mutate(
      { roundupId, cellId: cell.id, action, note },
      {
        onSuccess: (updated) => {
          setSendBack(null);
          setNotice({ tone: 'success', text: `${name}: ${cellStateLabels[updated.state]}.` });
        },
        onError: (error) => {
          const { message } = describeSubmitError(error);
          if (action === 'send-back') setSendBackError(message);
          else setNotice({ tone: 'danger', text: `${name} did not move. ${message}` });
        },
      },
    );
  };

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
          chosenCount={chosenCount}
          testers={testers.data}
          testerId={testerId}
          dueDate={dueDate}
          timeZone={matrix.timeZone}
          errors={errors}
          pending={assign.isPending}
          onTesterChange={(value) => {
            setTesterId(value);
            setErrors((current) => ({ ...current, testerId: undefined }));
          }}
          onDueDateChange={(value) => {
            setDueDate(value);
            setErrors((current) => ({ ...current, dueDate: undefined }));
          }}
          onAssign={submitAssignment}
          onClear={clearChoice}
        />
      )}
      {!open && <Alert className="mb-3">The roundup has left the bench: its matrix is closed to changes.</Alert>}
      {notice && (
        <Alert tone={notice.tone} announce className="mb-3">
          {notice.text}
        </Alert>
      )}

      <div
        role="region"
        aria-labelledby={captionId}
        tabIndex={0}
        className="overflow-x-auto rounded-[3px] border border-rule bg-surface"
      >
        <table className="w-full border-collapse text-sm">
          <caption id={captionId} className="sr-only">
            Test matrix: products by load configuration
          </caption>
          <thead>
            <tr className="border-b border-edge/70 bg-wash">
              <th
                scope="col"
                className="sticky left-0 z-10 bg-wash px-3 py-1.5 text-left text-xs font-semibold tracking-wide text-muted uppercase"
              >
                Product
              </th>
              {matrix.columns.map((column, index) => (
                <th
                  key={column.loadConfigurationId}
                  scope="col"
                  className="min-w-44 px-3 py-1.5 text-left text-xs font-semibold tracking-wide text-muted uppercase"
                >
                  <span className="numeric mr-1 font-normal">{index + 1}</span>
                  {column.name}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {matrix.rows.map((row) => (
              <MatrixRow
                key={row.entryId}
                row={row}
                columnCount={matrix.columns.length}
                columnName={columnName}
                assigning={assigning}
                rowChosen={chosenRows.has(row.entryId)}
                chosenCells={chosenCells}
                pendingCellId={transition.isPending ? transition.variables?.cellId : undefined}
                onChooseRow={(on) => setChosenRows((current) => toggle(current, row.entryId, on))}
                onChooseCell={(cellId, on) => setChosenCells((current) => toggle(current, cellId, on))}
                isAssignable={assignable}
                onAction={(cell, name, action) => {
                  if (action === 'send-back') {
                    setSendBackError(undefined);
                    setSendBack({ cell, name });
                  } else move(cell, name, action);
                }}
              />
            ))}
          </tbody>
        </table>
      </div>
      <p className="mt-2 text-[0.8125rem] text-muted">
        Due dates end at midnight in {matrix.timeZone}. Scroll the matrix sideways on a narrow screen.
      </p>

      <SendBackDialog
        open={sendBack !== null}
        cellName={sendBack?.name ?? ''}
        pending={transition.isPending}
        error={sendBackError}
        onClose={() => setSendBack(null)}
        onSend={(note) => sendBack && move(sendBack.cell, sendBack.name, 'send-back', note)}
      />
    </div>
  );
}

interface MatrixRowProps {
  row: Row;
  columnCount: number;
  columnName: ReadonlyMap<number, string>;
  assigning: boolean;
  rowChosen: boolean;
  chosenCells: ReadonlySet<number>;
  pendingCellId: number | undefined;
  onChooseRow: (on: boolean) => void;
  onChooseCell: (cellId: number, on: boolean) => void;
  isAssignable: (cell: MatrixCell) => boolean;
  onAction: (cell: MatrixCell, name: string, action: CellAction) => void;
}

function MatrixRow({
  row,
  columnCount,
  columnName,
  assigning,
  rowChosen,
  chosenCells,
  pendingCellId,
  onChooseRow,
  onChooseCell,
  isAssignable,
  onAction,
}: MatrixRowProps) {
  const name = productName(row.product);
  const rowAssignable = row.kind === 'tested' && row.cells.some(isAssignable);
  return (
    <tr className={cx('border-b border-rule align-top last:border-b-0', rowChosen && 'bg-copper/5')}>
      <th scope="row" className="sticky left-0 z-10 min-w-40 bg-surface px-3 py-2 text-left font-medium">
        <div className="flex items-start gap-2">
          {assigning && rowAssignable && (
            <input
              type="checkbox"
              aria-label={`Choose the whole row: ${name}`}
              checked={rowChosen}
              onChange={(event) => onChooseRow(event.target.checked)}
              className="mt-1 size-4.5 shrink-0 accent-copper"
            />
          )}
          <span>
            {name}
            <span className="block text-xs font-normal text-muted">
              {row.kind === 'reference' ? 'Reference, not re-tested' : row.product.chipset}
            </span>
          </span>
        </div>
      </th>
      {row.kind === 'reference' ? (
        <td colSpan={columnCount} className="px-3 py-2 text-[0.8125rem] text-muted">
          Shown in comparisons with its earlier results; no cells to test.
        </td>
      ) : (
        row.cells.map((cell) => {
          const cellName = `${name} · ${columnName.get(cell.loadConfigurationId) ?? ''}`;
          const canChoose = isAssignable(cell);
          return (
            <td key={cell.id} className={cx('px-3 py-2', cell.overdue && 'bg-red/5')}>
              <div className="flex items-start gap-2">
                {assigning && canChoose && (
                  <input
                    type="checkbox"
                    aria-label={`Choose ${cellName}`}
                    checked={rowChosen || chosenCells.has(cell.id)}
                    disabled={rowChosen}
                    onChange={(event) => onChooseCell(cell.id, event.target.checked)}
                    className="mt-1 size-4.5 shrink-0 accent-copper"
                  />
                )}
                <div className="min-w-0 space-y-0.5">
                  <CellStateBadge state={cell.state} />
                  <p className="text-[0.8125rem]">
                    {cell.tester ? cell.tester.displayName : <span className="text-muted">No tester</span>}
                  </p>
                  {cell.dueDate && (
                    <p className={cx('numeric', cell.overdue ? 'font-semibold text-red' : 'text-muted')}>
                      {cell.overdue ? 'Overdue · ' : 'Due '}
                      {formatCalendarDate(cell.dueDate)}
                    </p>
                  )}
                  {cell.note && cell.state === 'needs-retest' && (
                    <p className="text-[0.8125rem] text-ink">
                      <span className="font-semibold">Retest:</span> {cell.note}
                    </p>
                  )}
                  {cell.actions.length > 0 && (
                    <div className="flex flex-wrap gap-1.5 pt-1">
                      {cell.actions.map((action) => (
                        <Button
                          key={action}
                          size="sm"
                          variant={action === 'accept' ? 'primary' : action === 'send-back' ? 'danger' : 'secondary'}
                          aria-label={`${cellActionRules[action].label}: ${cellName}`}
                          pending={pendingCellId === cell.id}
                          onClick={() => onAction(cell, cellName, action)}
                        >
                          {cellActionRules[action].label}
                        </Button>
                      ))}
                    </div>
                  )}
                </div>
              </div>
            </td>
          );
        })
      )}
    </tr>
  );
}
