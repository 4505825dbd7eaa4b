import { useMemo } from 'react';
import { Link } from 'react-router';
import { Button, buttonStyles } from '../../../components/ui/button';
import { DataTable, type DataTableColumns } from '../../../components/ui/data-table';
import { actionsColumn, textColumn } from '../../../components/ui/data-table-columns';
import { EmptyState } from '../../../components/ui/empty-state';
import { cx } from '../../../lib/class-names';
import { cellActionRules, cellStates, type CellAction } from '../../../../shared/domain/planning/matrix-cell-states';
import type { Booking } from '../../../../shared/schemas/benches';
import type { QueueItem } from '../../../../shared/schemas/matrix';
import { formatCalendarDate, formatSlot } from '../../../lib/format-time';
import { paths } from '../../../lib/paths';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';
import { CellStateBadge } from '../../../components/ui/cell-state-badge';
import { useMediaQuery } from '../../../lib/use-media-query';

export interface QueueTableProps {
  caption: string;
  items: readonly QueueItem[];
  bookings: readonly Booking[];
  /** Link to the roundup's matrix. */
  matrixPath: (roundupId: number) => string;
  /** Shows the tester's moves (start, back to queue, record); leave out for a read-only list. */
  onMove?: (item: QueueItem, action: CellAction) => void;
  pendingCellId?: number;
  empty: { title: string; text: string };
}

/** Assigned cells, earliest due date first, each with its roundup, product, configuration and booked time. */
export function QueueTable({ caption, items, bookings, matrixPath, onMove, pendingCellId, empty }: QueueTableProps) {
  const slotByCell = useMemo(() => {
    const map = new Map<number, Booking>();
    for (const booking of bookings) for (const item of booking.cells) map.set(item.cell.id, booking);
    return map;
  }, [bookings]);
  // On a phone the moves sit under the product name, where no sideways scrolling is needed; wider, in their own
  // column pinned to the right edge. Rendered in one place only, so each move is one button.
  const wide = useMediaQuery('(min-width: 40rem)');

  const columns = useMemo<DataTableColumns<QueueItem>>(
    () => [
      {
        id: 'due',
        header: 'Due',
        numeric: true,
        sortValue: (item) => item.cell.dueDate,
        cell: (item) =>
          item.cell.dueDate ? (
            <span className={cx(item.cell.overdue && 'font-semibold text-red')}>
              {item.cell.overdue && <span className="mr-1">Overdue ·</span>}
              {formatCalendarDate(item.cell.dueDate)}
            </span>
          ) : (
            <span className="text-muted">No date</span>
          ),
      },
      textColumn('product', 'Product', (item) => productDisplayName(item.product), {
        rowHeader: true,
        className: 'min-w-40',
        cell: (item) => (
          <>
            {productDisplayName(item.product)}
            {onMove && !wide && (
              <span className="mt-1.5 block font-normal">
                <QueueActions item={item} onMove={onMove} pending={pendingCellId === item.cell.id} />
              </span>
            )}
          </>
        ),
      }),
      textColumn('configuration', 'Configuration', (item) => item.loadConfiguration.name),
      textColumn('roundup', 'Roundup', (item) => item.roundup.title, {
        hideBelow: 'md',
        className: 'min-w-44',
        cell: (item) => (
          <Link to={matrixPath(item.roundup.id)} className="text-copper underline-offset-2 hover:underline">
            {item.roundup.title}
          </Link>
        ),
      }),
      {
        id: 'state',
        header: 'State',
        sortValue: (item) => cellStates.indexOf(item.cell.state),
        filterValue: (item) => item.cell.state,
        cell: (item) => (
          <span>
            <CellStateBadge state={item.cell.state} />
            {item.cell.state === 'needs-retest' && item.cell.note && (
              <span className="mt-0.5 block max-w-60 text-xs">Retest: {item.cell.note}</span>
            )}
          </span>
        ),
      },
      {
        id: 'slot',
        header: 'Bench time',
        hideBelow: 'lg',
        sortValue: (item) => slotByCell.get(item.cell.id)?.startsAt ?? null,
        cell: (item) => {
          const booking = slotByCell.get(item.cell.id);
          return booking ? (
            <span className="whitespace-nowrap">
              {booking.bench.name}
              <span className="block text-xs text-muted">{formatSlot(booking.startsAt, booking.endsAt)}</span>
            </span>
          ) : (
            <span className="text-muted">Not booked</span>
          );
        },
      },
      onMove &&
        wide &&
        actionsColumn((item) => <QueueActions item={item} onMove={onMove} pending={pendingCellId === item.cell.id} />, {
          pinEnd: true,
        }),
    ],
    [matrixPath, onMove, pendingCellId, slotByCell, wide],
  );

  return (
    <DataTable
      caption={caption}
      rows={items}
      columns={columns}
      rowKey={(item) => item.cell.id}
      initialSort="due"
      filter={{ placeholder: 'Product, configuration or roundup', aboveRows: 6 }}
      noun={['cell', 'cells']}
      rowClassName={(item) => (item.cell.overdue ? 'bg-red/5' : undefined)}
      empty={<EmptyState title={empty.title}>{empty.text}</EmptyState>}
    />
  );
}

function QueueActions({
  item,
  onMove,
  pending,
}: {
  item: QueueItem;
  onMove: (item: QueueItem, action: CellAction) => void;
  pending: boolean;
}) {
  const name = `${productDisplayName(item.product)} · ${item.loadConfiguration.name}`;
  return (
    <span className="flex flex-wrap gap-1.5">
      <Link
        to={paths.roundupCell(item.roundup.id, item.cell.id)}
        aria-label={`Record a run: ${name}`}
        className={buttonStyles('secondary', 'sm')}
      >
        Record a run
      </Link>
      {item.cell.actions.map((action) => (
        <Button
          key={action}
          size="sm"
          variant={action === 'record' ? 'primary' : 'secondary'}
          pending={pending}
          aria-label={`${cellActionRules[action].label}: ${name}`}
          onClick={() => onMove(item, action)}
        >
          {cellActionRules[action].label}
        </Button>
      ))}
    </span>
  );
}
