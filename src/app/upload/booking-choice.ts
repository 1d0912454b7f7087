import type { BookingDto } from '@shared/api';

/** How long after its window closes a booking still takes a log that names none (the server's rule, server/bookings). */
const UPLOAD_GRACE_MS = 24 * 3_600_000;

/**
 * The bookings a log can join at `now`: their window has opened and closed less than a day ago.
 * Latest window first, as the server picks among them for an upload that names none.
 */
export function openBookings(bookings: readonly BookingDto[], now: Date): BookingDto[] {
  const time = now.getTime();
  return bookings
    .filter((booking) => new Date(booking.windowStart).getTime() <= time && new Date(booking.windowEnd).getTime() >= time - UPLOAD_GRACE_MS)
    .sort((first, second) => new Date(second.windowStart).getTime() - new Date(first.windowStart).getTime());
}

/** The log a new upload to `booking` would replace, and the attempt the upload would be; null for its first log. */
export interface Replacement {
  /** The booking's latest run and its attempt. */
  readonly runId: number;
  readonly attempt: number;
  /** The attempt the new upload becomes. */
  readonly next: number;
}

/** What a new log of `booking` would replace: its latest attempt, if it has one. */
export function replacementIn(booking: BookingDto | null): Replacement | null {
  const latest = booking?.attempts.at(-1);
  return latest === undefined ? null : { runId: latest.runId, attempt: latest.attempt, next: latest.attempt + 1 };
}
