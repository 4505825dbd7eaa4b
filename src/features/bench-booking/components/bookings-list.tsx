import { useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { EmptyState } from '../../../components/ui/empty-state';
import { describeSubmitError } from '../../../lib/form-errors';
import { formatSlot, userTimeZone } from '../../../lib/format-time';
import type { Booking } from '../../../../shared/schemas/benches';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';
import { useCancelBooking } from '../api/cancel-booking';

/** The tester's upcoming slots, soonest first, each with the cells it covers. */
export function BookingsList({ bookings }: { bookings: readonly Booking[] }) {
  const cancel = useCancelBooking();
  const [cancelling, setCancelling] = useState<Booking | null>(null);
  const [error, setError] = useState<string | undefined>();
  const [notice, setNotice] = useState<string | null>(null);

  const confirm = () => {
    if (!cancelling) return;
    const what = `${cancelling.bench.name}, ${formatSlot(cancelling.startsAt, cancelling.endsAt)}`;
    cancel.mutate(
      { benchId: cancelling.bench.id, bookingId: cancelling.id },
      {
        onSuccess: () => {
          setCancelling(null);
          setNotice(`Cancelled: ${what}.`);
        },
        onError: (failure) => setError(describeSubmitError(failure).message),
      },
    );
  };

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
                <ul className="mt-0.5 text-[0.8125rem] text-muted">
                  {booking.cells.map((item) => (
                    <li key={item.cell.id}>
                      {productDisplayName(item.product)} · {item.loadConfiguration.name}
                    </li>
                  ))}
                </ul>
                {booking.note && <p className="mt-0.5 text-[0.8125rem]">{booking.note}</p>}
                {booking.overrideReason && (
                  <p className="mt-0.5 text-[0.8125rem] text-amber">
                    Set-up differs from the profile: {booking.overrideReason}
                  </p>
                )}
              </div>
              {booking.cancellable && (
                <Button
                  size="sm"
                  variant="quiet"
                  aria-label={`Cancel booking: ${booking.bench.name}, ${formatSlot(booking.startsAt, booking.endsAt)}`}
                  onClick={() => {
                    setError(undefined);
                    setNotice(null);
                    setCancelling(booking);
                  }}
                >
                  Cancel
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
      <p className="text-[0.8125rem] text-muted">Times are in {userTimeZone()}, the time zone of this device.</p>
      <ConfirmDialog
        open={cancelling !== null}
        title="Cancel this booking?"
        confirmLabel="Cancel booking"
        cancelLabel="Keep it"
        pending={cancel.isPending}
        error={error}
        onConfirm={confirm}
        onCancel={() => setCancelling(null)}
      >
        {cancelling && (
          <p>
            {cancelling.bench.name}, {formatSlot(cancelling.startsAt, cancelling.endsAt)}. The slot becomes free for
            others.
          </p>
        )}
      </ConfirmDialog>
    </div>
  );
}
