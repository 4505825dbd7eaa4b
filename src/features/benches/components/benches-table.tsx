import { useMemo } from 'react';
import { Link } from 'react-router';
import { paths } from '../../../lib/paths';
import { Badge } from '../../../components/ui/badge';
import { DataTable, type DataTableColumns } from '../../../components/ui/data-table';
import { buttonColumn, textColumn } from '../../../components/ui/data-table-columns';
import type { Bench, Booking } from '../../../../shared/schemas/benches';
import { formatDayAndTime } from '../../../lib/format-time';

export interface BenchesTableProps {
  benches: readonly Bench[];
  /** This week's bookings, to show each bench's next slot. */
  bookings: readonly Booking[];
  /** Editors edit benches and take them out of service. */
  onEdit?: (bench: Bench) => void;
  /** The moment "next" is measured from (passed in, so rendering stays pure). */
  now: number;
}

export function BenchesTable({ benches, bookings, onEdit, now }: BenchesTableProps) {
  const columns = useMemo<DataTableColumns<Bench>>(() => {
    const nextBooking = (bench: Bench) =>
      bookings.find((booking) => booking.bench.id === bench.id && Date.parse(booking.endsAt) > now) ?? null;
    return [
      textColumn('name', 'Bench', (bench) => bench.name, {
        rowHeader: true,
        cell: (bench) => (
          <Link to={paths.bench(bench.id)} className="whitespace-nowrap text-copper underline-offset-2 hover:underline">
            {bench.name}
          </Link>
        ),
      }),
      textColumn('status', 'Status', (bench) => (bench.active ? 'In service' : 'Out of service'), {
        cell: (bench) =>
          bench.active ? <Badge tone="positive">In service</Badge> : <Badge tone="muted">Out of service</Badge>,
      }),
      textColumn('location', 'Location', (bench) => bench.location, {
        cell: (bench) => bench.location ?? <span className="text-muted">—</span>,
      }),
      textColumn('profile', 'Built to profile', (bench) => bench.benchProfile?.name ?? null, {
        hideBelow: 'md',
        cell: (bench) => bench.benchProfile?.name ?? <span className="text-muted">None</span>,
      }),
      {
        id: 'next',
        header: 'Next booking this week',
        numeric: true,
        sortValue: (bench) => {
          const next = nextBooking(bench);
          return next ? Date.parse(next.startsAt) : null;
        },
        cell: (bench) => {
          const next = nextBooking(bench);
          if (!next) return <span className="text-muted">Free</span>;
          return formatDayAndTime(next.startsAt);
        },
      },
      {
        id: 'notes',
        header: 'Notes',
        hideBelow: 'lg',
        filterValue: (bench) => bench.notes ?? '',
        cell: (bench) => (
          <span className="text-[0.8125rem]">{bench.notes ?? <span className="text-muted">—</span>}</span>
        ),
      },
      onEdit && buttonColumn({ label: 'Edit', name: (bench) => `Edit ${bench.name}`, onClick: onEdit }),
    ];
  }, [bookings, onEdit, now]);

  return (
    <DataTable
      caption="Benches"
      rows={benches}
      columns={columns}
      initialSort="name"
      rowClassName={(bench) => (bench.active ? undefined : 'text-muted')}
    />
  );
}
