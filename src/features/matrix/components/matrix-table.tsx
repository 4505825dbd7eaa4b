import { useMemo } from 'react';
import { ScrollingTable } from '../../../components/ui/scrolling-table';
import { Link } from 'react-router';
import { Button } from '../../../components/ui/button';
import { CellStateBadge } from '../../../components/ui/cell-state-badge';
import { cx } from '../../../lib/class-names';
import { formatCalendarDate } from '../../../lib/format-time';
import { paths } from '../../../lib/paths';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';
import { cellActionRules, type CellAction } from '../../../../shared/domain/planning/matrix-cell-states';
import type { MatrixCell, RoundupMatrix } from '../../../../shared/schemas/matrix';
import type { Role } from '../../../../shared/schemas/common';
import { mayReadCellRuns } from '../../../../shared/access/roles';
import type { MatrixBoardState } from './use-matrix-board';

type Row = RoundupMatrix['rows'][number];

/** Who looks at the matrix: a tester sees the runs links of their own cells only (the server refuses the rest). */
export interface MatrixViewer {
  id: number;
  role: Role;
}

export interface MatrixTableProps {
  matrix: RoundupMatrix;
  viewer?: MatrixViewer;
  assigning: boolean;
  selection: MatrixBoardState['selection'];
  pendingCellId: number | undefined;
  onAction: (cell: MatrixCell, name: string, action: CellAction) => void;
}

/** Products down, load configurations across; the product column stays in view while scrolling sideways. */
export function MatrixTable({ matrix, viewer, assigning, selection, pendingCellId, onAction }: MatrixTableProps) {
  const columnName = useMemo(
    () => new Map(matrix.columns.map((column) => [column.loadConfigurationId, column.name])),
    [matrix.columns],
  );
  return (
    <ScrollingTable caption="Test matrix: products by load configuration">
      <thead>
        <tr>
          <th
            scope="col"
            className="sticky top-0 left-0 z-20 border-b border-edge/70 bg-wash px-3 py-1.5 text-left text-xs font-semibold tracking-wide text-muted uppercase shadow-[inset_-1px_0_0_var(--color-rule)]"
          >
            Product
          </th>
          {matrix.columns.map((column, index) => (
            <th
              key={column.loadConfigurationId}
              scope="col"
              className="sticky top-0 z-10 min-w-44 border-b border-edge/70 bg-wash px-3 py-1.5 text-left text-xs font-semibold tracking-wide text-muted uppercase"
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
            roundupId={matrix.roundupId}
            viewer={viewer}
            columnCount={matrix.columns.length}
            columnName={columnName}
            assigning={assigning}
            selection={selection}
            pendingCellId={pendingCellId}
            onAction={onAction}
          />
        ))}
      </tbody>
    </ScrollingTable>
  );
}

interface MatrixRowProps {
  row: Row;
  roundupId: number;
  viewer: MatrixViewer | undefined;
  columnCount: number;
  columnName: ReadonlyMap<number, string>;
  assigning: boolean;
  selection: MatrixBoardState['selection'];
  pendingCellId: number | undefined;
  onAction: (cell: MatrixCell, name: string, action: CellAction) => void;
}

function MatrixRow({
  row,
  roundupId,
  viewer,
  columnCount,
  columnName,
  assigning,
  selection,
  pendingCellId,
  onAction,
}: MatrixRowProps) {
  const name = productDisplayName(row.product);
  const rowChosen = selection.isRowChosen(row.entryId);
  const rowAssignable = row.kind === 'tested' && row.cells.some(selection.isAssignable);
  const line = 'border-b border-rule group-last:border-b-0';
  return (
    <tr className={cx('group align-top', rowChosen && 'bg-copper/5')}>
      <th
        scope="row"
        className={cx(
          'sticky left-0 z-[1] min-w-40 bg-surface px-3 py-2 text-left font-medium shadow-[inset_-1px_0_0_var(--color-rule)]',
          line,
        )}
      >
        <div className="flex items-start gap-2">
          {assigning && rowAssignable && (
            <input
              type="checkbox"
              aria-label={`Choose the whole row: ${name}`}
              checked={rowChosen}
              onChange={(event) => selection.chooseRow(row.entryId, event.target.checked)}
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
        <td colSpan={columnCount} className={cx('px-3 py-2 text-[0.8125rem] text-muted', line)}>
          Shown in comparisons with its earlier results; no cells to test.
        </td>
      ) : (
        row.cells.map((cell) => (
          <MatrixCellView
            key={cell.id}
            cell={cell}
            cellName={`${name} · ${columnName.get(cell.loadConfigurationId) ?? ''}`}
            runsPath={
              !viewer || mayReadCellRuns(viewer, cell.tester?.id ?? null) ? paths.roundupCell(roundupId, cell.id) : null
            }
            className={line}
            choosable={assigning && selection.isAssignable(cell)}
            rowChosen={rowChosen}
            chosen={rowChosen || selection.isCellChosen(cell.id)}
            pending={pendingCellId === cell.id}
            onChoose={(on) => selection.chooseCell(cell.id, on)}
            onAction={onAction}
          />
        ))
      )}
    </tr>
  );
}

interface MatrixCellViewProps {
  cell: MatrixCell;
  cellName: string;
  /** The cell's runs: its results, review and recording; null when they are another tester's. */
  runsPath: string | null;
  className: string;
  choosable: boolean;
  rowChosen: boolean;
  chosen: boolean;
  pending: boolean;
  onChoose: (on: boolean) => void;
  onAction: (cell: MatrixCell, name: string, action: CellAction) => void;
}

function MatrixCellView({
  cell,
  cellName,
  runsPath,
  className,
  choosable,
  rowChosen,
  chosen,
  pending,
  onChoose,
  onAction,
}: MatrixCellViewProps) {
  return (
    <td className={cx('px-3 py-2', cell.overdue && 'bg-red/5', className)}>
      <div className="flex items-start gap-2">
        {choosable && (
          <input
            type="checkbox"
            aria-label={`Choose ${cellName}`}
            checked={chosen}
            disabled={rowChosen}
            onChange={(event) => onChoose(event.target.checked)}
            className="mt-1 size-4.5 shrink-0 accent-copper"
          />
        )}
        <div className="min-w-0 space-y-0.5">
          <CellStateBadge state={cell.state} />
          {runsPath && (
            <p className="text-[0.8125rem]">
              <Link
                to={runsPath}
                aria-label={`Runs of ${cellName}`}
                className="text-copper underline-offset-2 hover:underline"
              >
                Runs
              </Link>
            </p>
          )}
          <p className="text-[0.8125rem]">
            {cell.tester ? cell.tester.displayName : <span className="text-muted">No tester</span>}
          </p>
          {cell.dueDate && (
            <p className={cx('numeric', cell.overdue ? 'font-semibold text-red' : 'text-muted')}>
              {cell.overdue ? 'Overdue · ' : 'Due '}
              {formatCalendarDate(cell.dueDate)}
            </p>
          )}
          {cell.qaFlags.length > 0 && (
            // In words with a mark, never colour alone: the flags of the run the results matrix shows for this cell.
            <p className="text-[0.8125rem] text-ink">
              <span aria-hidden="true" className="mr-1 font-mono font-semibold text-amber">
                !
              </span>
              <span className="font-semibold">
                {cell.qaFlags.length === 1 ? 'QA flag:' : `${cell.qaFlags.length} QA flags:`}
              </span>{' '}
              {cell.qaFlags.join('; ')}
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
                  pending={pending}
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
}
