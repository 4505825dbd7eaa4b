import { Panel } from '../../../components/ui/panel';
import type { Bench, Booking } from '../../../../shared/schemas/benches';
import type { QueueItem } from '../../../../shared/schemas/matrix';
import { BookingForm } from './booking-form';
import { BookingsList } from './bookings-list';

export interface MyBookingsProps {
  /** The tester's upcoming bookings, soonest first. */
  bookings: readonly Booking[];
  benches: readonly Bench[];
  /** Cells assigned to the tester that can still be booked. */
  cells: readonly QueueItem[];
  /** The moment the page was opened, from the loader (keeps rendering pure). */
  openedAt: number;
}

/** A tester's own bench time: what is booked, and booking more. */
export function MyBookings({ bookings, benches, cells, openedAt }: MyBookingsProps) {
  const nextHour = new Date(openedAt);
  nextHour.setHours(nextHour.getHours() + 1, 0, 0, 0);
  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-2">
      <Panel title="Your bookings">
        <BookingsList bookings={bookings} />
      </Panel>
      <Panel title="Book a bench" description="Reserve bench time for cells assigned to you.">
        <BookingForm benches={benches} cells={cells} suggestedStart={nextHour} />
      </Panel>
    </div>
  );
}
