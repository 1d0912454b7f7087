import { z } from 'zod';
import type { RunBookingDto } from './bookings';
import type { AnalysisResult } from '../analysis/result';
import type { ResultSignatureDto, SigningKeyDto } from './integrity-signature';
import type { SignOffDto, WithdrawalDto } from './runs';
import type { RunStationsDto } from './stations';

export * from './integrity-signature';

export const VERIFICATION_CHECKS = ['result-fingerprint', 'signature', 'archive-file', 'system-trail'] as const;
export type VerificationCheck = (typeof VERIFICATION_CHECKS)[number];

/** One check of `GET /api/runs/:id/verification`. */
export const verificationCheckSchema = /* @__PURE__ */ z
  .object({
    check: z.enum(VERIFICATION_CHECKS),
    passed: z.boolean(),
    detail: z.string().meta({ description: 'A sentence saying what was compared and what was found.' }),
  })
  .meta({ id: 'VerificationCheckDto' });
export type VerificationCheckDto = z.infer<typeof verificationCheckSchema>;

/** Whether a stored result and its archived file are still what was signed, and the system trail still what was recorded. */
export const verificationSchema = /* @__PURE__ */ z
  .object({
    runId: z.number().int(),
    checkedAt: z.string(),
    intact: z.boolean().meta({ description: 'True only when every check passed.' }),
    checks: z.array(verificationCheckSchema),
  })
  .meta({ id: 'VerificationDto' });
export type VerificationDto = z.infer<typeof verificationSchema>;

export const REVERIFICATION_STATES = ['queued', 'analysing', 'reproduced', 'differs', 'failed'] as const;
export type ReverificationState = (typeof REVERIFICATION_STATES)[number];

/** A field where a re-analysis disagrees with the stored result (`path` as `chsh.winFraction`). */
export const fieldDifferenceSchema = /* @__PURE__ */ z.object({ path: z.string(), stored: z.unknown(), recomputed: z.unknown() }).meta({ id: 'FieldDifference' });
export type FieldDifference = z.infer<typeof fieldDifferenceSchema>;

/** A re-analysis of a finished run's archived file, kept beside (never over) the original result. */
export const reverificationSchema = /* @__PURE__ */ z
  .object({
    id: z.number().int(),
    runId: z.number().int(),
    requestedBy: z.string(),
    seed: z.string().nullable().meta({ description: "Another seed than the run's, when an admin asked for one: a fresh draw of test rounds that never replaces the verdict." }),
    state: z.enum(REVERIFICATION_STATES),
    storedFingerprint: z.string(),
    storedEngineVersion: z.string(),
    newFingerprint: z.string().nullable(),
    newEngineVersion: z.string().nullable(),
    differences: z.array(fieldDifferenceSchema).meta({ description: 'Empty unless `differs`; at most the first 50.' }),
    differenceCount: z.number().int().meta({ description: 'All differing fields.' }),
    error: z.string().nullable(),
    createdAt: z.string(),
    finishedAt: z.string().nullable(),
  })
  .meta({ id: 'ReverificationDto' });
export type ReverificationDto = z.infer<typeof reverificationSchema>;

/** Body of `POST /api/runs/:id/reverifications`: empty, or (admins only) another seed, 64 hex digits. */
export const reverificationRequestSchema = /* @__PURE__ */ z
  .strictObject({
    seed: z
      .string()
      .regex(/^[0-9a-fA-F]{64}$/, 'must be 64 hexadecimal digits')
      .optional(),
  })
  .meta({ id: 'ReverificationRequest' });
export type ReverificationRequest = z.infer<typeof reverificationRequestSchema>;

/** The formats of `GET /api/runs/:id/export/:format`. */
export const EXPORT_FORMATS = ['json', 'pdf', 'counts.csv', 'blocks.csv'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];
export const exportFormatSchema = /* @__PURE__ */ z
  .enum(EXPORT_FORMATS, { error: `must be one of ${EXPORT_FORMATS.join(', ')}` })
  .meta({ description: 'The formats of an export.' });

export const RUN_REPORT_FORMAT = 'bellkeep.run-report';

/** The JSON report of a run: everything needed to re-derive and check its result offline. */
export interface RunReportDto {
  format: typeof RUN_REPORT_FORMAT;
  formatVersion: 1;
  exportedAt: string;
  exportedBy: string;
  run: {
    id: number;
    setupName: string;
    stationA: string;
    stationB: string;
    originalName: string;
    uploadedBy: string;
    acquiredOn: string | null;
    notes: string;
    createdAt: string;
    finishedAt: string | null;
    state: string;
    verdict: string | null;
    duplicateOf: number | null;
    /** The booking with its seed commitment and attempts; null: unbooked (absent in reports made before bookings). */
    booking?: RunBookingDto | null;
    replayOf?: number | null;
  };
  profile: { profileId: number; versionId: number; name: string; version: number; parameters: Record<string, unknown> };
  mapping: Record<string, unknown> | null;
  /** The seed recorded with the run (the result's own `seed` is null for `from-log` selection). */
  seed: string;
  result: AnalysisResult;
  signature: ResultSignatureDto | null;
  publicKey: SigningKeyDto | null;
  signOff: SignOffDto | null;
  /** Set when the upload was withdrawn as a mistake (absent in reports made before withdrawals). */
  withdrawal?: WithdrawalDto | null;
  /** A run of two station logs: station B's file, the stated offset, the geometry (absent in reports made before station logs). */
  stations?: RunStationsDto | null;
  reverifications: ReverificationDto[];
}
