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
