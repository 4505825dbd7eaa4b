import { useState } from 'react';
import { Link } from 'react-router';
import { Badge } from '../../../components/ui/badge';
import { buttonStyles } from '../../../components/ui/button';
import { cx } from '../../../lib/class-names';
import type { Bench, Booking } from '../../../../shared/schemas/benches';
import { formatDayHeading, formatLongDay, formatShortDate, formatSlot } from '../../../lib/format-time';
import { BookingDetails, CancelBookingButton, CancelBookingDialog } from './booking-details';
import { addDays, dateParam, dayShare, formatDuration, overlapsDay } from './booking-time';

/** What the address and the moment the page opened say about the calendar on screen. */
export interface CalendarView {
  weekStart: Date;
  /** Today's local date as YYYY-MM-DD, to mark it. */
  today: string;
  /** Null shows every bench. */
  benchId: number | null;
  /** A link to another week, keeping the other parts of the address. */
  weekHref: (weekStart: Date) => string;
  zoneLabel: string;
}

export interface BookingAgendaProps {
  view: CalendarView;
  benches: readonly Bench[];
  bookings: readonly Booking[];
  currentUserId: number;
}

/**
 * The week as a list of days. Each day has a strip per bench (a 24-hour rule with the booked spans, for the eye)
 * and the bookings written out (for everyone, screen readers included).
 */
export function BookingAgenda({ view, benches, bookings, currentUserId }: BookingAgendaProps) {
  const { weekStart, today, benchId, weekHref, zoneLabel } = view;
  const [cancelling, setCancelling] = useState<Booking | null>(null);
  const shownBenches = benches.filter((bench) => (benchId === null ? bench.active : bench.id === benchId));
  const shown = bookings.filter((booking) => benchId === null || booking.bench.id === benchId);
  const days = Array.from({ length: 7 }, (_, index) => addDays(weekStart, index));
  const weekEnd = days[6];

  return (
    <section aria-labelledby="agenda-heading">
      <div className="mb-3 flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="agenda-heading" className="text-lg font-semibold text-ink">
            Week of {formatShortDate(weekStart)} – {formatShortDate(weekEnd)} {weekEnd.getFullYear()}
          </h2>
          <p className="text-sm text-muted">Times in {zoneLabel}.</p>
        </div>
        <nav aria-label="Weeks" className="flex flex-wrap gap-2">
          <Link to={weekHref(addDays(weekStart, -7))} className={buttonStyles('secondary', 'sm')}>
            <span aria-hidden="true">←</span> Previous week
          </Link>
          <Link to={weekHref(new Date(`${today}T00:00:00`))} className={buttonStyles('quiet', 'sm')}>
            This week
          </Link>
          <Link to={weekHref(addDays(weekStart, 7))} className={buttonStyles('secondary', 'sm')}>
            Next week <span aria-hidden="true">→</span>
          </Link>
        </nav>
      </div>

      <ol className="space-y-3">
        {days.map((day) => {
          const key = dateParam(day);
          const dayBookings = shown.filter((booking) => overlapsDay(day, booking.startsAt, booking.endsAt));
          const isToday = key === today;
          return (
            <li key={key}>
              <section
                aria-labelledby={`day-${key}`}
                className={cx('rounded-[3px] border bg-surface', isToday ? 'border-copper' : 'border-rule')}
              >
                <div
                  className={cx(
                    'flex flex-wrap items-center gap-2 px-3 py-2',
                    dayBookings.length > 0 && 'border-b border-rule',
                  )}
                >
                  <h3 id={`day-${key}`} className="font-semibold text-ink">
                    <span aria-hidden="true">{formatDayHeading(day)}</span>
                    <span className="sr-only">{formatLongDay(day)}</span>
                  </h3>
                  {isToday && <Badge tone="accent">Today</Badge>}
                  <span className="ml-auto text-xs text-muted">
                    {dayBookings.length === 0
                      ? benchId === null
                        ? 'No bookings: every bench is free'
                        : 'No bookings: free all day'
                      : `${dayBookings.length} booking${dayBookings.length === 1 ? '' : 's'}`}
                  </span>
                </div>
                {dayBookings.length > 0 && (
                  <div className="px-3 py-2.5">
                    <DayStrips day={day} benches={shownBenches} bookings={dayBookings} currentUserId={currentUserId} />
                    <ul className="mt-2.5 divide-y divide-rule">
                      {dayBookings.map((booking) => (
                        <BookingLine
                          key={booking.id}
                          booking={booking}
                          own={booking.tester.id === currentUserId}
                          onCancel={() => setCancelling(booking)}
                        />
                      ))}
                    </ul>
                  </div>
                )}
              </section>
            </li>
          );
        })}
      </ol>

      <CancelBookingDialog booking={cancelling} zoneLabel={zoneLabel} onClose={() => setCancelling(null)} />
    </section>
  );
}

function BookingLine({ booking, own, onCancel }: { booking: Booking; own: boolean; onCancel: () => void }) {
  return (
    <li className="flex flex-wrap items-start gap-x-4 gap-y-1 py-2 first:pt-0 last:pb-0">
      <div className="w-full sm:w-44 sm:shrink-0">
        <p className="numeric text-ink">{formatSlot(booking.startsAt, booking.endsAt, { withDay: false })}</p>
        <p className="text-xs text-muted">{formatDuration(booking.startsAt, booking.endsAt)}</p>
      </div>
      <div className="min-w-0 flex-1 text-sm">
        <p className="flex flex-wrap items-center gap-x-2 gap-y-0.5">
          <span className="font-semibold text-ink">{booking.bench.name}</span>
          <span className="text-muted">·</span>
          <span>{booking.tester.displayName}</span>
          {own && <Badge tone="accent">Yours</Badge>}
        </p>
        <BookingDetails booking={booking} />
      </div>
      <CancelBookingButton booking={booking} onCancel={onCancel} />
    </li>
  );
}

/** One 24-hour rule per bench with its booked spans; decorative, the list below says the same in words. */
function DayStrips({
  day,
  benches,
  bookings,
  currentUserId,
}: {
  day: Date;
  benches: readonly Bench[];
  bookings: readonly Booking[];
  currentUserId: number;
}) {
  if (benches.length === 0) return null;
  return (
    <div aria-hidden="true" className="space-y-1">
      <div className="ml-[7.5rem] flex justify-between font-mono text-[0.625rem] text-muted sm:ml-[9.5rem]">
        <span>00</span>
        <span>06</span>
        <span>12</span>
        <span>18</span>
        <span>24</span>
      </div>
      {benches.map((bench) => (
        <div key={bench.id} className="flex items-center gap-2">
          <span className="w-28 shrink-0 truncate text-xs text-muted sm:w-36">{bench.name}</span>
          <div className="relative h-3 flex-1 rounded-[2px] bg-wash">
            {[0.25, 0.5, 0.75].map((mark) => (
              <span key={mark} className="absolute inset-y-0 w-px bg-rule" style={{ left: `${mark * 100}%` }} />
            ))}
            {bookings
              .filter((booking) => booking.bench.id === bench.id)
              .map((booking) => {
                const share = dayShare(day, booking.startsAt, booking.endsAt);
                if (!share) return null;
                return (
                  <span
                    key={booking.id}
                    className={cx(
                      'absolute inset-y-0 rounded-[2px] border',
                      booking.tester.id === currentUserId ? 'border-copper bg-copper' : 'border-ink/60 bg-slate',
                    )}
                    style={{ left: `${share.left * 100}%`, width: `max(${share.width * 100}%, 3px)` }}
                  />
                );
              })}
          </div>
        </div>
      ))}
    </div>
  );
}
