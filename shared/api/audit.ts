import type { AuditEventDto } from './runs';

/** What the system-wide trail can be narrowed to (`GET /api/audit`, `GET /api/audit/export.csv`). */
export interface AuditQuery {
  page?: number;
  pageSize?: number;
  actorId?: number;
  /** Exact action, e.g. `run.exported`, or a family ending in a dot, e.g. `profile.`. */
  action?: string;
  targetType?: AuditTargetType;
  targetId?: string;
  /** Inclusive dates, YYYY-MM-DD (UTC). */
  from?: string;
  to?: string;
}

export const AUDIT_TARGET_TYPES = ['run', 'user', 'profile', 'setup', 'booking', 'upload-token', 'signing-key', 'audit'] as const;
export type AuditTargetType = (typeof AUDIT_TARGET_TYPES)[number];

/** Someone who appears in the trail, as `GET /api/audit/actors` lists them for the actor filter. */
export interface AuditActor {
  id: number;
  name: string;
}

/** A page of the trail, newest first. */
export interface AuditPageDto {
  items: AuditEventDto[];
  total: number;
  page: number;
  pageSize: number;
}

/**
 * Every action the trail records, as `noun.verb`. Details carry what the line needs: a run's
 * `verdict`, a sign-off's `comment`, an export's `format`, a re-verification's `state`...
 */
export const AUDIT_ACTIONS = [
  'user.created',
  'user.changed',
  'setup.created',
  'setup.changed',
  'profile.created',
  'profile.version-created',
  'booking.created',
  'upload-token.created',
  'upload-token.revoked',
  'run.uploaded',
  'run.analysis-started',
  'run.finished',
  'run.failed',
  'run.mail-sent',
  'run.mail-skipped',
  'run.signed-off',
  'run.exported',
  'run.reverification-requested',
  'run.reverification-finished',
  'signing-key.registered',
  'signing-key.retired',
  'audit.exported',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

/** Problems `GET /api/audit/trail-check` lists at most; `problemCount` tells how many it found. */
export const TRAIL_CHECK_PROBLEM_LIMIT = 20;

/** The newest link of the trail's hash chain: its place and its SHA-256, hex. */
export interface TrailChainHeadDto {
  seq: number;
  hash: string;
}

/**
 * The check of the whole system trail against its hash chain (`GET /api/audit/trail-check`): every
 * event has its link, every link its event, each link's hash recomputes from its event and the link
 * before, seq runs 1, 2, 3 ... without a gap, and the head names the last link.
 */
export interface TrailCheckDto {
  /** True only when no problem was found. */
  intact: boolean;
  /** Events in the trail now. */
  events: number;
  /** As the chain's head records it; null before the first event (or when the head is gone). */
  head: TrailChainHeadDto | null;
  checkedAt: string;
  /** The first problems in chain order, each a sentence naming its link (seq) or event (id). */
  problems: string[];
  /** Every problem found, listed or not. */
  problemCount: number;
}
