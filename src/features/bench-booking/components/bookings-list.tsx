import { useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { EmptyState } from '../../../components/ui/empty-state';
import { formatSlot, userTimeZone } from '../../../lib/format-time';
import type { Booking } from '../../../../shared/schemas/benches';
import { BookingDetails, CancelBookingButton, CancelBookingDialog } from './booking-details';

/** The tester's upcoming slots, soonest first, each with the cells it covers. */
export function BookingsList({ bookings }: { bookings: readonly Booking[] }) {
  const [cancelling, setCancelling] = useState<Booking | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const zone = userTimeZone();

  return (
    <div className="space-y-3">
      {notice && (
        <Alert tone="success" announce>
          {notice}
        </Alert>
      )}
      {bookings.length === 0 ? (
        <EmptyState title="No upcoming bookings">Book a bench below for the cells you will run next.</EmptyState>
      ) : (
        <ul aria-label="Your bookings" className="divide-y divide-rule rounded-[3px] border border-rule bg-surface">
          {bookings.map((booking) => (
            <li key={booking.id} className="flex flex-wrap items-start gap-x-4 gap-y-2 px-3 py-2.5">
              <div className="min-w-0 flex-1 basis-56">
                <p className="font-semibold">
                  {booking.bench.name}{' '}
                  <span className="numeric font-normal">{formatSlot(booking.startsAt, booking.endsAt)}</span>
                </p>
                <BookingDetails booking={booking} />
              </div>
              <CancelBookingButton
                booking={booking}
                onCancel={() => {
                  setNotice(null);
                  setCancelling(booking);
                }}
              />
            </li>
          ))}
        </ul>
      )}
      <p className="text-[0.8125rem] text-muted">Times are in {zone}, the time zone of this device.</p>
      <CancelBookingDialog
        booking={cancelling}
        zoneLabel={zone}
        onClose={() => setCancelling(null)}
        onCancelled={(what) => setNotice(`Cancelled: ${what}.`)}
      />
    </div>
  );
}
