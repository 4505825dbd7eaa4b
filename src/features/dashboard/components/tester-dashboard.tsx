import { Link } from 'react-router';
import { buttonStyles } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Panel } from '../../../components/ui/panel';
import { cx } from '../../../lib/class-names';
import { formatCalendarDate, formatSlot, userTimeZone } from '../../../lib/format-time';
import type { Dashboard } from '../../../../shared/schemas/dashboard';
import { CellStateBadge } from '../../../components/ui/cell-state-badge';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';

export interface TesterDashboardProps {
  dashboard: Extract<Dashboard, { view: 'tester' }>;
  myBenchPath: string;
}

const shown = 8;

/** A tester's next work and booked bench time, with the way into My bench. */
export function TesterDashboard({ dashboard, myBenchPath }: TesterDashboardProps) {
  const { queue, upcomingBookings, awaitingReview } = dashboard;
  const overdue = queue.filter((item) => item.cell.overdue).length;
  return (
    <div className="grid grid-cols-1 items-start gap-5 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      <Panel
        title="Next in your queue"
        description={
          queue.length === 0
            ? 'Nothing assigned to you right now.'
            : `${queue.length} cell${queue.length === 1 ? '' : 's'} to run${overdue ? `, ${overdue} overdue` : ''}${
                awaitingReview.length ? `; ${awaitingReview.length} recorded, waiting for the editor` : ''
              }.`
        }
        actions={
          <Link to={myBenchPath} className={buttonStyles('secondary', 'sm')}>
            Open My bench
          </Link>
        }
      >
        {queue.length === 0 ? (
          <EmptyState title="Your queue is empty">Assigned matrix cells appear here by due date.</EmptyState>
        ) : (
          <ol className="divide-y divide-rule text-sm">
            {queue.slice(0, shown).map((item) => (
              <li key={item.cell.id} className="grid grid-cols-[minmax(0,1fr)_auto] items-start gap-3 py-2 first:pt-0">
                <div className="min-w-0">
                  <p className="font-medium">
                    {productDisplayName(item.product)} · {item.loadConfiguration.name}
                  </p>
                  <p className="text-[0.8125rem] text-muted">{item.roundup.title}</p>
                </div>
                <div className="flex flex-col items-end gap-0.5">
                  <CellStateBadge state={item.cell.state} />
                  {item.cell.dueDate && (
                    <span className={cx('numeric', item.cell.overdue ? 'font-semibold text-red' : 'text-muted')}>
                      {item.cell.overdue ? 'Overdue · ' : 'Due '}
                      {formatCalendarDate(item.cell.dueDate)}
                    </span>
                  )}
                </div>
              </li>
            ))}
          </ol>
        )}
        {queue.length > shown && (
          <p className="mt-3 text-[0.8125rem] text-muted">
            {queue.length - shown} more in{' '}
            <Link to={myBenchPath} className="text-copper underline">
              My bench
            </Link>
            .
          </p>
        )}
      </Panel>
      <Panel title="Your bench bookings">
        {upcomingBookings.length === 0 ? (
          <EmptyState title="No upcoming bookings">Book a bench from My bench.</EmptyState>
        ) : (
          <ul className="divide-y divide-rule text-sm">
            {upcomingBookings.map((booking) => (
              <li key={booking.id} className="py-2 first:pt-0 last:pb-0">
                <p className="font-semibold">{booking.bench.name}</p>
                <p className="numeric">{formatSlot(booking.startsAt, booking.endsAt)}</p>
                <p className="text-[0.8125rem] text-muted">
                  {booking.cells.length} cell{booking.cells.length === 1 ? '' : 's'}
                  {booking.note && ` · ${booking.note}`}
                </p>
              </li>
            ))}
          </ul>
        )}
        <p className="mt-3 text-[0.8125rem] text-muted">Times are in {userTimeZone()}.</p>
      </Panel>
    </div>
  );
}
