import type { RunSummaryDto } from '@shared/api';

/** A run's booking in a word or two for a list: a caution (unbooked, a replay) or a replacement's attempt. */
export interface BookingNote {
  readonly text: string;
  /** Whether it is a caution (shown in the warning tone beside its words). */
  readonly caution: boolean;
}

/**
 * The note beside a run in a list: "replay of N", "unbooked" or "attempt k"; none for a booked
 * night's first log, the usual case.
 */
export function bookingNote(run: Pick<RunSummaryDto, 'bookingId' | 'attempt' | 'replayOf'>): BookingNote | null {
  if (run.replayOf !== null) return { text: `replay of ${run.replayOf}`, caution: true };
  if (run.bookingId === null) return { text: 'unbooked', caution: true };
  return run.attempt !== null && run.attempt > 1 ? { text: `attempt ${run.attempt}`, caution: false } : null;
}
