import type { RunDto } from '../api';

/** How a run came to its seed, in sentences: booked (attempt k, the earlier ones) or unbooked. */
export interface BookingWords {
  /** "Booked" or "Unbooked". */
  state: 'Booked' | 'Unbooked';
  /** The line that says it all: the night and attempt, or the unbooked caution. */
  headline: string;
  /** Further sentences: the commitment, the replacement's reason, the earlier attempts, a replay. */
  details: string[];
}

/** The unbooked caution, word for word everywhere a run is shown. */
export const UNBOOKED_CAUTION = 'Unbooked: the seed that chose the test rounds was drawn at upload, after the data existed.';

/** The caution of a replacement: its log came after the seed was revealed. */
export const REVEALED_SEED_CAUTION =
  'This log came after the seed was revealed with the first attempt: whoever wrote it could know which rounds would be tested. Judge the replacement with that in mind.';

/**
 * The words of a run's booking for the run page, the mail and the PDF; `day` writes the night (the
 * mail and the PDF keep YYYY-MM-DD, the app writes it in the reader's locale).
 */
export function bookingWords(run: Pick<RunDto, 'id' | 'booking' | 'replayOf'>, day: (isoDate: string) => string = (isoDate) => isoDate): BookingWords {
  const replay = run.replayOf === null ? [] : [`Replay: these bytes were uploaded before as run ${run.replayOf}, under another booking or night.`];
  const booking = run.booking;
  if (!booking) return { state: 'Unbooked', headline: UNBOOKED_CAUTION, details: replay };
  const earlier = booking.attempts.filter((attempt) => attempt.attempt !== booking.attempt);
  return {
    state: 'Booked',
    headline: `Booked night ${day(booking.night)} (booking ${booking.bookingId}): attempt ${booking.attempt} of ${booking.attempts.length}.`,
    details: [
      `Seed committed at booking, before acquisition: SHA-256 ${booking.seedCommitment}.`,
      ...(booking.attempt > 1
        ? [
            `Replaces the earlier log: ${booking.replacementReason}`,
            // The seed was revealed with attempt 1, so this log may have been written knowing its test rounds.
            REVEALED_SEED_CAUTION,
          ]
        : []),
      ...(earlier.length > 0 ? [`Other attempts: ${earlier.map((attempt) => `${attempt.attempt} — run ${attempt.runId}, ${attempt.verdict ?? attempt.state}`).join('; ')}.`] : []),
      ...replay,
    ],
  };
}
