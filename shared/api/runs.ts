import { z } from 'zod';
import type { AnalysisResult } from '../analysis/result';
import { runBookingSchema } from './bookings';
import { resultSignatureSchema } from './integrity-signature';
import { isoDate, paging, queryId } from './query-fields';
import { RUN_STATES, VERDICTS, runStateSchema, verdictSchema } from './run-states';
import type { Role } from './roles';
import { runStationsSchema } from './stations';

export * from './run-states';

/** How often the worker analysing a run says it is alive. */
export const WORKER_HEARTBEAT_SECONDS = 10;

/**
 * The engine's result exactly as the `analyse` command prints it (`AnalysisResult` of
 * shared/analysis/result.ts). Its shape is the engine's to define and version (`engineVersion`),
 * so the contract names the fields every version has and leaves the rest open.
 */
export const analysisResultSchema = /* @__PURE__ */ z
  .custom<AnalysisResult>((value) => typeof value === 'object' && value !== null && typeof (value as { fingerprint?: unknown }).fingerprint === 'string')
  .meta({
    id: 'AnalysisResult',
    description: "The analysis engine's result (shared/analysis/result.ts), as `npm run analyse` prints it; the engine's version is in `engineVersion`.",
    type: 'object',
    required: ['engineVersion', 'verdict', 'fingerprint', 'checks', 'blocks'],
    properties: {
      engineVersion: { type: 'string' },
      verdict: { enum: VERDICTS },
      fingerprint: { type: 'string', description: 'SHA-256 of the canonical JSON of everything else, hex.' },
      checks: { type: 'array' },
      blocks: { type: 'array' },
    },
  });

/** What a shift lead decides of a finished run's night. */
export const SIGN_OFF_DECISIONS = ['key-kept', 'key-discarded', 'hardware-action'] as const;
export type SignOffDecision = (typeof SIGN_OFF_DECISIONS)[number];

/** Each decision in the lab's words (app, mail, PDF). */
export const SIGN_OFF_DECISION_WORDS: Record<SignOffDecision, string> = {
  'key-kept': 'Key kept',
  'key-discarded': 'Key discarded',
  'hardware-action': 'Hardware action needed',
};

/** A shift lead's sign-off of a finished run. */
export const signOffSchema = /* @__PURE__ */ z
  .object({ userId: z.number().int(), userName: z.string(), decision: z.enum(SIGN_OFF_DECISIONS), comment: z.string(), createdAt: z.string() })
  .meta({ id: 'SignOffDto' });
export type SignOffDto = z.infer<typeof signOffSchema>;

/** The withdrawal of a mistaken upload before its sign-off. */
export const withdrawalSchema = /* @__PURE__ */ z
  .object({ userId: z.number().int(), userName: z.string(), reason: z.string(), createdAt: z.string() })
  .meta({ id: 'WithdrawalDto' });
export type WithdrawalDto = z.infer<typeof withdrawalSchema>;

const nullableNumber = /* @__NO_SIDE_EFFECTS__ */ (description: string) => z.number().nullable().meta({ description });

/** A run as lists show it. */
export const runSummarySchema = /* @__PURE__ */ z
  .object({
    id: z.number().int(),
    setupId: z.number().int(),
    setupName: z.string(),
    profileVersionId: z.number().int(),
    profileName: z.string(),
    profileVersion: z.number().int(),
    state: runStateSchema,
    progress: z.number().meta({ description: 'Fraction of the file read by the analysis, 0..1.' }),
    verdict: verdictSchema.nullable(),
    winFraction: nullableNumber('CHSH win fraction, when analysed.'),
    winThreshold: nullableNumber("The CHSH criterion's acceptance threshold, when analysed."),
    qber: z.number().nullable(),
    chshValue: nullableNumber('CHSH value S, when analysed.'),
    finiteKeyBits: nullableNumber('The finite key estimate (collective attacks), when analysed.'),
    uploadedBy: z.string(),
    acquiredOn: z.string().nullable(),
    createdAt: z.string(),
    finishedAt: z.string().nullable(),
    duplicateOf: nullableNumber('Set when the same bytes were uploaded before: the earlier run.'),
    bookingId: nullableNumber('The booking the run belongs to; null: unbooked, its seed drawn after the data existed.'),
    attempt: nullableNumber('Attempt k of its booking (k > 1: a replacement); null when unbooked.'),
    replayOf: nullableNumber('Set when these bytes were uploaded before under another booking or night: that run.'),
    signedOff: z.boolean(),
    stationPair: z.boolean().meta({ description: 'The run joins two station logs (else one joined log).' }),
    withdrawn: z.boolean().meta({ description: 'The upload was withdrawn as a mistake: kept in the archive and the trail, awaiting no sign-off.' }),
    fileSha256: z.string().meta({ description: 'SHA-256 of the archived log, hex.' }),
    fingerprint: z.string().nullable().meta({ description: "The result's fingerprint, when analysed." }),
  })
  .meta({ id: 'RunSummaryDto' });
export type RunSummaryDto = z.infer<typeof runSummarySchema>;

/** One attempt to mail a run's verdict. */
export const mailDeliverySchema = /* @__PURE__ */ z
  .object({ recipients: z.array(z.string()), status: z.enum(['sent', 'failed']), messageId: z.string().nullable(), error: z.string().nullable(), attemptedAt: z.string() })
  .meta({ id: 'MailDeliveryDto' });
export type MailDeliveryDto = z.infer<typeof mailDeliverySchema>;

/** A run in full: `result` is the engine's JSON exactly as the `analyse` command prints it. */
export const runSchema = /* @__PURE__ */ runSummarySchema
  .extend({
    file: z.object({ sha256: z.string(), bytes: z.number().int(), originalName: z.string() }),
    seed: z.string(),
    mapping: z.record(z.string(), z.unknown()).nullable(),
    notes: z.string(),
    error: z.string().nullable(),
    attempts: z.number().int().meta({ description: 'Analysis attempts so far (more than one: a worker stopped or died and the job was retried).' }),
    analysedBy: z.string().nullable().meta({ description: 'The worker of the latest attempt, `host:pid`.' }),
    startedAt: z.string().nullable(),
    heartbeatAt: z.string().nullable().meta({ description: "The analysing worker's last sign of life (every WORKER_HEARTBEAT_SECONDS)." }),
    // A union, not .nullable(): the OpenAPI generator drops the null of a nullable named schema.
    result: z.union([analysisResultSchema, z.null()]),
    signature: resultSignatureSchema.nullable().meta({ description: "The server's signature over the stored result, when analysed." }),
    signOff: z.union([signOffSchema, z.null()]),
    withdrawal: z.union([withdrawalSchema, z.null()]),
    uploadedById: z.number().int().nullable().meta({ description: 'The person who uploaded the log; null for an upload token.' }),
    fourEyes: z.boolean().meta({ description: "The setup's four-eyes rule: whoever uploaded a run may not sign it off." }),
    deliveries: z.array(mailDeliverySchema),
    booking: runBookingSchema.nullable().meta({ description: 'The booking, its commitment and every attempt; null when unbooked.' }),
    stations: z
      .union([runStationsSchema, z.null()])
      .meta({ description: "A run of two station logs: station B's file (`file` is station A's), the stated offset and the geometry; null for a joined log." }),
  })
  .meta({ id: 'RunDto' });
export type RunDto = z.infer<typeof runSchema>;

/** A page of runs. */
export const runPageSchema = /* @__PURE__ */ z
  .object({ items: z.array(runSummarySchema), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() })
  .meta({ id: 'RunPageDto' });
export type RunPageDto = z.infer<typeof runPageSchema>;

/** Sort keys of `GET /api/runs`. */
export const RUN_SORT_KEYS = ['createdAt', 'acquiredOn', 'setup', 'state', 'verdict', 'winFraction'] as const;
export type RunSortKey = (typeof RUN_SORT_KEYS)[number];

/** Hex prefixes of `GET /api/runs` (`sha256`, `fingerprint`) have at least this many digits. */
export const RUN_SEARCH_MIN_PREFIX = 4;

const hexPrefix = /* @__PURE__ */ z
  .string()
  .regex(new RegExp(`^[0-9a-fA-F]{${RUN_SEARCH_MIN_PREFIX},64}$`), `must be ${RUN_SEARCH_MIN_PREFIX} to 64 hexadecimal digits`)
  .transform((hex) => hex.toLowerCase());

/** The filters, sort and page of `GET /api/runs`. */
export const runListQuerySchema = /* @__PURE__ */ z
  .strictObject({
    ...paging(25, 200),
    sort: z.enum(RUN_SORT_KEYS).default('createdAt'),
    direction: z.enum(['asc', 'desc']).default('desc'),
    setupId: queryId('a setup').optional(),
    state: z.enum(RUN_STATES).optional(),
    verdict: z.enum(VERDICTS).optional(),
    from: isoDate.optional().meta({ description: 'YYYY-MM-DD, inclusive.' }),
    to: isoDate.optional(),
    uploadedBy: queryId('a user').optional(),
    profileVersionId: queryId('a profile version').optional(),
    sha256: hexPrefix.optional().meta({ description: "A hex prefix of the log's SHA-256." }),
    fingerprint: hexPrefix.optional().meta({ description: "A hex prefix of the result's fingerprint." }),
    finished: z
      .enum(['true', 'false'], { error: 'must be true or false' })
      .transform((flag) => flag === 'true')
      .optional()
      .meta({ description: 'Only runs whose analysis has ended (with a verdict or failed).' }),
    awaitingSignOff: z
      .enum(['true'], { error: 'must be true' })
      .transform(() => true)
      .optional()
      .meta({ description: 'Only runs with a verdict that no shift lead has signed off yet.' }),
  })
  .meta({ description: 'The filters, sort and page of the run list.' });
export type RunListQuery = z.infer<typeof runListQuerySchema>;

/** Body of `POST /api/runs/:id/sign-off` (a shift lead of the run's setup). */
export const signOffRequestSchema = /* @__PURE__ */ z
  .strictObject({
    decision: z.enum(SIGN_OFF_DECISIONS, { error: `must be one of ${SIGN_OFF_DECISIONS.join(', ')}` }).meta({
      description: 'key-kept (ACCEPT with a key only), key-discarded, or hardware-action (the setup needs work before the next night).',
    }),
    comment: z.string().trim().min(1, 'is required: say what you decided').max(4000),
  })
  .meta({ id: 'SignOffRequest' });
export type SignOffRequest = z.infer<typeof signOffRequestSchema>;

/** Body of `POST /api/runs/:id/withdraw` (its uploader, or an admin). */
export const withdrawRequestSchema = /* @__PURE__ */ z
  .strictObject({ reason: z.string().trim().min(1, 'is required: say why the upload was a mistake').max(2000) })
  .meta({ id: 'WithdrawRequest' });
export type WithdrawRequest = z.infer<typeof withdrawRequestSchema>;

/**
 * Whether a person may withdraw a run's upload: the person who uploaded it, an admin, or, for a log
 * a station's upload token sent (no person uploaded it), any experimentalist. Server and app ask the same.
 */
export function mayWithdrawUpload(run: { uploadedById: number | null }, person: { id: number; roles: readonly Role[] }): boolean {
  if (person.roles.includes('admin')) return true;
  return run.uploadedById === null ? person.roles.includes('experimentalist') : run.uploadedById === person.id;
}

/** One line of the audit trail. */
export const auditEventSchema = /* @__PURE__ */ z
  .object({
    id: z.number().int(),
    actor: z.string().nullable(),
    action: z.string(),
    targetType: z.string(),
    targetId: z.string(),
    targetName: z.string().nullable().meta({ description: 'The person, setup, profile, booking or upload token by name; null where the id is the name (a run, a key).' }),
    details: z.record(z.string(), z.unknown()).meta({ description: 'What the line needs; a change carries `changes`: each field changed, with `from` and `to`.' }),
    createdAt: z.string(),
  })
  .meta({ id: 'AuditEventDto' });
export type AuditEventDto = z.infer<typeof auditEventSchema>;
