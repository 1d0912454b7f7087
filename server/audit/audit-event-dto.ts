import type { AuditEventDto } from '@shared/api';
import type { Models } from '../database/models';
import type { AuditEventRecord } from './audit-event.model';

/** Audit lines with the actor's name (null: the system). */
export async function toAuditEventDtos(events: AuditEventRecord[], models: Models): Promise<AuditEventDto[]> {
  const actorIds = [...new Set(events.map((event) => event.actorId).filter((id): id is number => id !== null))];
  const actors = await models.User.findAll({ where: { id: actorIds } });
  return events.map((event) => ({
    id: event.id,
    actor: actors.find((actor) => actor.id === event.actorId)?.name ?? null,
    action: event.action,
    targetType: event.targetType,
    targetId: event.targetId,
    details: event.details,
    createdAt: event.createdAt.toISOString(),
  }));
}
