import type { RunBookingDto } from './bookings';
import type { ResultSignatureDto } from './integrity';

/** Where a run is in its life. */
export const RUN_STATES = ['queued', 'analysing', 'accepted', 'aborted', 'invalid', 'failed'] as const;
export type RunState = (typeof RUN_STATES)[number];

/** How often the worker analysing a run says it is alive. */
export const WORKER_HEARTBEAT_SECONDS = 10;

/** States after which nothing more happens to a run's result. */
export const FINISHED_STATES: readonly RunState[] = ['accepted', 'aborted', 'invalid', 'failed'];

export const VERDICTS = ['ACCEPT', 'ABORT', 'INVALID'] as const;
export type Verdict = (typeof VERDICTS)[number];

/** The state a run ends in for each verdict. */
export const STATE_OF_VERDICT = { ACCEPT: 'accepted', ABORT: 'aborted', INVALID: 'invalid' } as const satisfies Record<Verdict, RunState>;

/** States of a run whose verdict is in (and which a shift lead may sign off). */
export const VERDICT_STATES: readonly RunState[] = Object.values(STATE_OF_VERDICT);

/** A shift lead's sign-off of a finished run. */
export interface SignOffDto {
  userId: number;
  userName: string;
  comment: string;
  createdAt: string;
}

/** A run as lists show it. */
export interface RunSummaryDto {
  id: number;
  setupId: number;
  setupName: string;
  profileVersionId: number;
  profileName: string;
  profileVersion: number;
  state: RunState;
  /** Fraction of the file read by the analysis, 0..1. */
  progress: number;
  verdict: Verdict | null;
  /** CHSH win fraction and its acceptance threshold, when analysed. */
  winFraction: number | null;
  winThreshold: number | null;
  qber: number | null;
  /** CHSH value S and the finite key estimate (collective attacks), when analysed. */
  chshValue: number | null;
  finiteKeyBits: number | null;
  uploadedBy: string;
  acquiredOn: string | null;
  createdAt: string;
  finishedAt: string | null;
  /** Set when the same bytes were uploaded before: the earlier run. */
  duplicateOf: number | null;
  /** The booking the run belongs to; null: unbooked, its seed drawn after the data existed. */
  bookingId: number | null;
  /** Attempt k of its booking (k > 1: a replacement); null when unbooked. */
  attempt: number | null;
  /** Set when these bytes were uploaded before under another booking or night: that run. */
  replayOf: number | null;
  signedOff: boolean;
  /** SHA-256 of the archived log, hex. */
  fileSha256: string;
  /** The result's fingerprint, when analysed. */
  fingerprint: string | null;
}

/** One attempt to mail a run's verdict. */
export interface MailDeliveryDto {
  recipients: string[];
  status: 'sent' | 'failed';
  messageId: string | null;
  error: string | null;
  attemptedAt: string;
}

/** A run in full: `result` is the engine's JSON exactly as the `analyse` command prints it. */
export interface RunDto extends RunSummaryDto {
  file: { sha256: string; bytes: number; originalName: string };
  seed: string;
  mapping: Record<string, unknown> | null;
  notes: string;
  error: string | null;
  /** Analysis attempts so far (more than one: a worker stopped or died and the job was retried). */
  attempts: number;
  /** The worker of the latest attempt, `host:pid`. */
  analysedBy: string | null;
  startedAt: string | null;
  /** The analysing worker's last sign of life (every WORKER_HEARTBEAT_SECONDS). */
  heartbeatAt: string | null;
  result: Record<string, unknown> | null;
  /** The server's signature over the stored result, when analysed. */
  signature: ResultSignatureDto | null;
  signOff: SignOffDto | null;
  deliveries: MailDeliveryDto[];
  /** The booking, its commitment and every attempt; null when unbooked. */
  booking: RunBookingDto | null;
}

/** A page of runs. */
export interface RunPageDto {
  items: RunSummaryDto[];
  total: number;
  page: number;
  pageSize: number;
}

/** Sort keys of `GET /api/runs`. */
export const RUN_SORT_KEYS = ['createdAt', 'acquiredOn', 'setup', 'state', 'verdict', 'winFraction'] as const;
export type RunSortKey = (typeof RUN_SORT_KEYS)[number];

/**
 * Filters of `GET /api/runs` beyond setup, state, verdict, dates and uploader: `profileVersionId`,
 * `sha256` and `fingerprint` (hex prefixes of at least 4 digits) and `finished=true`.
 */
export const RUN_SEARCH_MIN_PREFIX = 4;

/** Body of `POST /api/runs/:id/sign-off` (a shift lead of the run's setup). */
export interface SignOffRequest {
  comment: string;
}

/** One line of the audit trail. */
export interface AuditEventDto {
  id: number;
  actor: string | null;
  action: string;
  targetType: string;
  targetId: string;
  details: Record<string, unknown>;
  createdAt: string;
}
