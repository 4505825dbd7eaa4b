import { createQueryKeys } from '../../../lib/query-keys';

/** Bookings on the bench calendar. A booking made or cancelled anywhere invalidates `staleAfter.booking`. */
export const bookingKeys = createQueryKeys('bench-booking');
