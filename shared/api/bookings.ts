import type { Verdict, RunState } from './runs';

/** One upload of a booked night: attempt 1 is the first log, later attempts are replacements. */
export interface BookingAttemptDto {
  runId: number;
  attempt: number;
  state: RunState;
  verdict: Verdict | null;
  /** Why the log was replaced (empty for attempt 1). */
  replacementReason: string;
  createdAt: string;
}

/**
 * A night booked before acquisition. The seed was drawn at booking and only its commitment,
 * SHA-256 of the seed's 64 hex characters, is shown until a log is in; then `seed` reveals it.
 */
export interface BookingDto {
  id: number;
  setupId: number;
  setupName: string;
  /** The night, YYYY-MM-DD (the acquisition date of its runs). */
  night: string;
  windowStart: string;
  windowEnd: string;
  plannedRounds: number;
  profileVersionId: number;
  profileName: string;
  profileVersion: number;
  /** Why a shift lead or admin chose a profile other than the setup's (empty otherwise). */
  profileReason: string;
  seedCommitment: string;
  /** Null until the first log of the booking is in. */
  seed: string | null;
  bookedBy: string;
  createdAt: string;
  attempts: BookingAttemptDto[];
}

/** Body of `POST /api/bookings`. */
export interface BookNightRequest {
  setupId: number;
  night: string;
  /** ISO date-times; the window may not start more than an hour in the past. */
  windowStart: string;
  windowEnd: string;
  plannedRounds: number;
  /** Only a shift lead of the setup or an admin may choose another profile, with `profileReason`. */
  profileVersionId?: number;
  profileReason?: string;
}

/** How a run came to its seed: under a booking, or unbooked (seed drawn after the data existed). */
export interface RunBookingDto {
  bookingId: number;
  night: string;
  seedCommitment: string;
  attempt: number;
  replacementReason: string;
  /** Every attempt of the booking, this one included, in order. */
  attempts: BookingAttemptDto[];
}

/** An upload token of the acquisition computer, as listed (never the token itself). */
export interface UploadTokenDto {
  id: number;
  setupId: number;
  name: string;
  createdBy: string;
  createdAt: string;
  expiresAt: string;
  revokedAt: string | null;
  lastUsedAt: string | null;
}

/** Answer of `POST /api/setups/:id/upload-tokens`: the token, shown this once. */
export interface CreatedUploadTokenDto extends UploadTokenDto {
  token: string;
}

/** Body of `POST /api/setups/:id/upload-tokens`. */
export interface CreateUploadTokenRequest {
  name: string;
  /** Days until it expires, 1 to 366. */
  validDays: number;
}

/** The prefix every upload token starts with, so it is never mistaken for a sign-in token. */
export const UPLOAD_TOKEN_PREFIX = 'bkup_';

/** The resumable-upload (tus 1.0) endpoint: metadata keys an upload may carry. */
export const RESUMABLE_UPLOAD_PATH = '/api/uploads';
export const RESUMABLE_METADATA_KEYS = ['filename', 'setupId', 'bookingId', 'acquiredOn', 'notes', 'mapping', 'replacementReason'] as const;
