import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { describeSubmitError } from '../../../lib/form-errors';
import { formatSlot } from '../../../lib/format-time';
import type { Booking } from '../../../../shared/schemas/benches';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';
import { useCancelBooking } from '../api/cancel-booking';

/** What a booking is for: the cells it covers with their roundups, the tester's note and any set-up override. */
export function BookingDetails({ booking }: { booking: Booking }) {
  return (
    <>
      {booking.cells.length > 0 && (
        <ul className="mt-0.5 text-[0.8125rem] text-muted">
          {booking.cells.map((item) => (
            <li key={item.cell.id}>
              {productDisplayName(item.product)} · {item.loadConfiguration.name}{' '}
              <span className="whitespace-nowrap">({item.roundup.title})</span>
            </li>
          ))}
        </ul>
      )}
      {booking.note && <p className="mt-0.5 text-[0.8125rem] text-ink italic">“{booking.note}”</p>}
      {booking.overrideReason && (
        <p className="mt-0.5 text-[0.8125rem] text-amber">Set-up differs from the profile: {booking.overrideReason}</p>
      )}
    </>
  );
}

/** The Cancel button of a booking the user may cancel (nothing otherwise). */
export function CancelBookingButton({ booking, onCancel }: { booking: Booking; onCancel: () => void }) {
  if (!booking.cancellable) return null;
  return (
    <Button
      size="sm"
      variant="quiet"
      onClick={onCancel}
      aria-label={`Cancel the booking of ${booking.bench.name}, ${formatSlot(booking.startsAt, booking.endsAt)}`}
    >
      Cancel
    </Button>
  );
}

export interface CancelBookingDialogProps {
  /** The booking to cancel; null keeps the dialog closed. */
  booking: Booking | null;
  /** The time zone the slot is written in. */
  zoneLabel: string;
  onClose: () => void;
  /** After the server cancelled it, with the booking in words ("Bench A, Tue 3 Dec 09:00–12:00"). */
  onCancelled?: (what: string) => void;
}

/** Asks before cancelling a booking; a refusal from the server is shown in the dialog. */
export function CancelBookingDialog({ booking, zoneLabel, onClose, onCancelled }: CancelBookingDialogProps) {
  const cancel = useCancelBooking();
  const [error, setError] = useState<string | undefined>();
  const close = () => {
    setError(undefined);
    onClose();
  };
  const confirm = () => {
    if (!booking) return;
    const what = `${booking.bench.name}, ${formatSlot(booking.startsAt, booking.endsAt)}`;
    cancel.mutate(
      { benchId: booking.bench.id, bookingId: booking.id },
      {
        onSuccess: () => {
          close();
          onCancelled?.(what);
        },
        onError: (failure) => setError(describeSubmitError(failure).message),
      },
    );
  };
  return (
    <ConfirmDialog
      open={booking !== null}
      title="Cancel this booking?"
      confirmLabel="Cancel booking"
      cancelLabel="Keep it"
      pending={cancel.isPending}
      error={error}
      onCancel={close}
      onConfirm={confirm}
    >
      {booking && (
        <p>
          {booking.bench.name}, {formatSlot(booking.startsAt, booking.endsAt)} ({zoneLabel}), booked by{' '}
          {booking.tester.displayName}. The slot becomes free for others at once.
        </p>
      )}
    </ConfirmDialog>
  );
}
