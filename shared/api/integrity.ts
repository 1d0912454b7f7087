import type { RunBookingDto } from './bookings';
import type { AnalysisResult } from '../analysis/result';
import type { SignOffDto } from './runs';

/**
 * What the server signs when it stores a result. The signed bytes are
 * `SIGNED_STATEMENT_PREFIX + canonicalJson(statement)` in UTF-8 (see `signedStatementBytes`).
 */
export interface SignedStatement {
  runId: number;
  /** SHA-256 of the archived log, hex. */
  fileSha256: string;
  /** The result's fingerprint, hex. */
  fingerprint: string;
  /** When it was signed, ISO 8601 in UTC. */
  signedAt: string;
}

/** A stored result's signature. */
export interface ResultSignatureDto {
  algorithm: 'Ed25519';
  /** Names the public key: the first 16 hex digits of the SHA-256 of its raw 32 bytes. */
  keyId: string;
  statement: SignedStatement;
  /** The 64-byte Ed25519 signature, base64. */
  signature: string;
}

/** A public key the server signs (or signed) results with. */
export interface SigningKeyDto {
  keyId: string;
  algorithm: 'Ed25519';
  /** SubjectPublicKeyInfo, PEM: what `openssl pkey -pubin` reads. */
  publicKeyPem: string;
  createdAt: string;
  /** Set once another key took over; results it signed still verify with it. */
  retiredAt: string | null;
}

export const VERIFICATION_CHECKS = ['result-fingerprint', 'signature', 'archive-file', 'system-trail'] as const;
export type VerificationCheck = (typeof VERIFICATION_CHECKS)[number];

/** One check of `GET /api/runs/:id/verification`. */
export interface VerificationCheckDto {
  check: VerificationCheck;
  passed: boolean;
  /** A sentence saying what was compared and what was found. */
  detail: string;
}

/** Whether a stored result and its archived file are still what was signed, and the system trail still what was recorded. */
export interface VerificationDto {
  runId: number;
  checkedAt: string;
  /** True only when every check passed. */
  intact: boolean;
  checks: VerificationCheckDto[];
}

export const REVERIFICATION_STATES = ['queued', 'analysing', 'reproduced', 'differs', 'failed'] as const;
export type ReverificationState = (typeof REVERIFICATION_STATES)[number];

/** A field where a re-analysis disagrees with the stored result (`path` as `chsh.winFraction`). */
export interface FieldDifference {
  path: string;
  stored: unknown;
  recomputed: unknown;
}

/** A re-analysis of a finished run's archived file, kept beside (never over) the original result. */
export interface ReverificationDto {
  id: number;
  runId: number;
  requestedBy: string;
  /** Another seed than the run's, when an admin asked for one: a fresh draw of test rounds that never replaces the verdict. */
  seed: string | null;
  state: ReverificationState;
  storedFingerprint: string;
  storedEngineVersion: string;
  newFingerprint: string | null;
  newEngineVersion: string | null;
  /** Empty unless `differs`; at most the first 50. */
  differences: FieldDifference[];
  /** All differing fields. */
  differenceCount: number;
  error: string | null;
  createdAt: string;
  finishedAt: string | null;
}

/** Body of `POST /api/runs/:id/reverifications`: empty, or (admins only) another seed, 64 hex digits. */
export interface ReverificationRequest {
  seed?: string;
}

/** The formats of `GET /api/runs/:id/export/:format`. */
export const EXPORT_FORMATS = ['json', 'pdf', 'counts.csv', 'blocks.csv'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

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
  reverifications: ReverificationDto[];
}
