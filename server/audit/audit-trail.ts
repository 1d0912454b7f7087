import type { ModelStatic, Transaction } from 'sequelize';
import type { AuditAction, AuditTargetType } from '@shared/api';
import type { AuditEventRecord } from './audit-event.model';

export interface AuditEntry {
  /** Who did it; null for the system (the analysis worker, the mailer). */
  actorId: number | null;
  /** What happened, as `noun.verb`. */
  action: AuditAction;
  targetType: AuditTargetType;
  targetId: number | string;
  details?: Record<string, unknown>;
}

export interface AuditTrail {
  /** Appends one line; pass the transaction of the change it records, so both land or neither. */
  record(entry: AuditEntry, transaction?: Transaction): Promise<void>;
}

export function createAuditTrail(AuditEvent: ModelStatic<AuditEventRecord>): AuditTrail {
  return {
    async record(entry, transaction) {
      await AuditEvent.create(
        { actorId: entry.actorId, action: entry.action, targetType: entry.targetType, targetId: String(entry.targetId), details: entry.details ?? {} },
        { transaction },
      );
    },
  };
}
