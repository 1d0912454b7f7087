import { z } from 'zod';
import { bodyId, isoDate, isoDateTime, queryId } from './query-fields';
import { runStateSchema, verdictSchema } from './run-states';
import { STATIONS } from './stations';

/** One upload of a booked night: attempt 1 is the first log, later attempts are replacements. */
export const bookingAttemptSchema = /* @__PURE__ */ z
  .object({
    runId: z.number().int(),
    attempt: z.number().int(),
    state: runStateSchema,
    verdict: verdictSchema.nullable(),
    replacementReason: z.string().meta({ description: 'Why the log was replaced (empty for attempt 1).' }),
    createdAt: z.string(),
  })
  .meta({ id: 'BookingAttemptDto' });
export type BookingAttemptDto = z.infer<typeof bookingAttemptSchema>;

/**
 * A night booked before acquisition. The seed was drawn at booking and only its commitment,
 * SHA-256 of the seed's 64 hex characters, is shown until a log is in; then `seed` reveals it.
 */
export const bookingSchema = /* @__PURE__ */ z
  .object({
    id: z.number().int(),
    setupId: z.number().int(),
    setupName: z.string(),
    night: z.string().meta({ description: 'The night, YYYY-MM-DD (the acquisition date of its runs).' }),
    windowStart: z.string(),
    windowEnd: z.string(),
    plannedRounds: z.number().int(),
    profileVersionId: z.number().int(),
    profileName: z.string(),
    profileVersion: z.number().int(),
    profileReason: z.string().meta({ description: "Why a shift lead or admin chose a profile other than the setup's (empty otherwise)." }),
    seedCommitment: z.string(),
    seed: z.string().nullable().meta({ description: 'Null until the first log of the booking is in.' }),
    bookedBy: z.string(),
    createdAt: z.string(),
    attempts: z.array(bookingAttemptSchema),
  })
  .meta({ id: 'BookingDto' });
export type BookingDto = z.infer<typeof bookingSchema>;

/** Body of `POST /api/bookings`. */
export const bookNightRequestSchema = /* @__PURE__ */ z
  .strictObject({
    setupId: bodyId('a setup'),
    night: isoDate,
    windowStart: isoDateTime.meta({ description: 'The window may not start more than an hour in the past.' }),
    windowEnd: isoDateTime,
    plannedRounds: z.number({ error: 'must be a number of rounds' }).int().positive().max(Number.MAX_SAFE_INTEGER),
    profileVersionId: bodyId('a profile version').optional().meta({ description: 'Only a shift lead of the setup or an admin may choose another profile, with `profileReason`.' }),
    profileReason: z.string().max(2000).optional(),
  })
  .meta({ id: 'BookNightRequest' });
export type BookNightRequest = z.infer<typeof bookNightRequestSchema>;

/** Query of `GET /api/bookings`. */
export const bookingListQuerySchema = /* @__PURE__ */ z.strictObject({ setupId: queryId('a setup').optional() }).meta({ description: 'The bookings of one setup, or of all.' });
export type BookingListQuery = z.infer<typeof bookingListQuerySchema>;

/** How a run came to its seed: under a booking, or unbooked (seed drawn after the data existed). */
export const runBookingSchema = /* @__PURE__ */ z
  .object({
    bookingId: z.number().int(),
    night: z.string(),
    seedCommitment: z.string(),
    attempt: z.number().int(),
    replacementReason: z.string(),
    attempts: z.array(bookingAttemptSchema).meta({ description: 'Every attempt of the booking, this one included, in order.' }),
  })
  .meta({ id: 'RunBookingDto' });
export type RunBookingDto = z.infer<typeof runBookingSchema>;

/** An upload token of the acquisition computer, as listed (never the token itself). */
export const uploadTokenSchema = /* @__PURE__ */ z
  .object({
    id: z.number().int(),
    setupId: z.number().int(),
    name: z.string(),
    createdBy: z.string(),
    createdAt: z.string(),
    expiresAt: z.string(),
    revokedAt: z.string().nullable(),
    lastUsedAt: z.string().nullable(),
    station: z.enum(STATIONS).nullable().meta({ description: "The station whose computer holds it: it uploads that station's log only; null: joined logs." }),
  })
  .meta({ id: 'UploadTokenDto' });
export type UploadTokenDto = z.infer<typeof uploadTokenSchema>;

/** Answer of `POST /api/setups/:id/upload-tokens`: the token, shown this once. */
export const createdUploadTokenSchema = /* @__PURE__ */ uploadTokenSchema.extend({ token: z.string() }).meta({ id: 'CreatedUploadTokenDto' });
export type CreatedUploadTokenDto = z.infer<typeof createdUploadTokenSchema>;

/** Body of `POST /api/setups/:id/upload-tokens`. */
export const createUploadTokenRequestSchema = /* @__PURE__ */ z
  .strictObject({
    name: z.string().trim().min(1, 'is required: name the computer that will use it').max(120),
    validDays: z.number({ error: 'must be a number of days' }).int().min(1, 'must be at least 1 day').max(366, 'must be at most 366 days'),
    station: z.enum(STATIONS, { error: 'must be A or B' }).optional().meta({ description: "For a station's own computer: the token uploads that station's log only." }),
  })
  .meta({ id: 'CreateUploadTokenRequest' });
export type CreateUploadTokenRequest = z.infer<typeof createUploadTokenRequestSchema>;

/** The prefix every upload token starts with, so it is never mistaken for a sign-in token. */
export const UPLOAD_TOKEN_PREFIX = 'bkup_';

/** The resumable-upload (tus 1.0) endpoint: metadata keys an upload may carry. */
export const RESUMABLE_UPLOAD_PATH = '/api/uploads';
export const RESUMABLE_METADATA_KEYS = ['filename', 'setupId', 'bookingId', 'acquiredOn', 'notes', 'mapping', 'replacementReason', 'station'] as const;
