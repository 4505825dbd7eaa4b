import { useState } from 'react';
import { Link, useSearchParams } from 'react-router';
import { Panel } from '../../../components/ui/panel';
import { Select } from '../../../components/ui/select';
import type { Bench, Booking } from '../../../../shared/schemas/benches';
import type { QueueItem } from '../../../../shared/schemas/matrix';
import { BookingAgenda, type CalendarView } from './booking-agenda';
import { BookingForm } from './booking-form';
import { dateParam, startOfWeek, weekFromParams, zoneLabel } from './booking-time';
import { formatDayHeading } from '../../../lib/format-time';
import { useBenches } from '../../benches/api/get-benches';

export interface BookingCalendarProps {
  /** This week's bookings (the page loads them for the week in the address). */
  bookings: readonly Booking[];
  currentUserId: number;
  /** Bench testers book slots; these are their bookable cells (null for other roles). */
  bookableCells: readonly QueueItem[] | null;
  /** The moment the page was opened, from the loader (keeps rendering pure). */
  openedAt: number;
}

/** The week and bench the address asks for (?week=, ?bench=), seen from the moment the page opened. */
function useCalendarView(benches: readonly Bench[], openedAt: number): CalendarView {
  const [params] = useSearchParams();
  const requestedBench = Number(params.get('bench'));
  return {
    weekStart: weekFromParams(params, openedAt).weekStart,
    today: dateParam(new Date(openedAt)),
    benchId: benches.some((bench) => bench.id === requestedBench) ? requestedBench : null,
    weekHref: (date: Date) => {
      const next = new URLSearchParams(params);
      next.set('week', dateParam(startOfWeek(date)));
      return `?${next}`;
    },
    zoneLabel: zoneLabel(openedAt),
  };
}

/** The week's bookings on every bench (or one, ?bench=), and for testers the booking form beside them. */
export function BookingCalendar({ bookings, currentUserId, bookableCells, openedAt }: BookingCalendarProps) {
  const benches = useBenches();
  const [, setParams] = useSearchParams();
  const [lastBooking, setLastBooking] = useState<Booking | null>(null);
  const view = useCalendarView(benches, openedAt);
  const { weekStart, benchId, weekHref } = view;
  const nextHour = new Date(openedAt);
  nextHour.setHours(nextHour.getHours() + 1, 0, 0, 0);
  const lastBookingWeek = lastBooking ? dateParam(startOfWeek(new Date(lastBooking.startsAt))) : null;

  return (
    <div className="grid grid-cols-1 gap-5 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      {bookableCells && (
        <div className="lg:sticky lg:top-4 lg:col-start-2 lg:row-start-1 lg:self-start">
          <Panel title="Book a bench" description="Your slot, for your assigned cells.">
            <BookingForm
              benches={benches}
              cells={bookableCells}
              initialBenchId={benchId}
              suggestedStart={nextHour}
              onBooked={setLastBooking}
            />
            {lastBooking && lastBookingWeek !== dateParam(weekStart) && (
              <p className="mt-3 text-sm">
                <Link to={weekHref(new Date(lastBooking.startsAt))} className="underline underline-offset-2">
                  Show the week of {formatDayHeading(new Date(lastBooking.startsAt))}
                </Link>
              </p>
            )}
          </Panel>
        </div>
      )}
      <div className={bookableCells ? 'lg:col-start-1 lg:row-start-1' : 'lg:col-span-2'}>
        <div className="mb-3 sm:w-72">
          <Select
            label="Show bench"
            required={false}
            placeholder="All benches in service"
            options={benches.map((bench) => ({
              value: String(bench.id),
              label: bench.active ? bench.name : `${bench.name} (out of service)`,
            }))}
            value={benchId === null ? '' : String(benchId)}
            onChange={(event) =>
              setParams(
                (current) => {
                  const next = new URLSearchParams(current);
                  if (event.target.value) next.set('bench', event.target.value);
                  else next.delete('bench');
                  return next;
                },
                { preventScrollReset: true },
              )
            }
          />
        </div>
        <BookingAgenda view={view} benches={benches} bookings={bookings} currentUserId={currentUserId} />
      </div>
    </div>
  );
}
