import { Op } from 'sequelize';
import type { AuditEventDto } from '@shared/api';
import type { Models } from '../database/models';
import type { AuditEventRecord } from './audit-event.model';

/** The ids of the events' targets of one type, as numbers. */
function idsOf(events: AuditEventRecord[], type: string): number[] {
  return [...new Set(events.filter((event) => event.targetType === type).map((event) => Number(event.targetId)))].filter(Number.isSafeInteger);
}

/**
 * The name of each person, setup, profile, booking and upload token the events are about, by
 * `type id` (a run is named by its number, a signing key by its id, as the trail shows them).
 */
async function targetNames(events: AuditEventRecord[], models: Models): Promise<Map<string, string>> {
  const names = new Map<string, string>();
  const [users, setups, profiles, bookings, tokens] = await Promise.all([
    models.User.findAll({ where: { id: { [Op.in]: idsOf(events, 'user') } } }),
    models.Setup.findAll({ where: { id: { [Op.in]: idsOf(events, 'setup') } } }),
    models.Profile.findAll({ where: { id: { [Op.in]: idsOf(events, 'profile') } } }),
    models.Booking.findAll({ where: { id: { [Op.in]: idsOf(events, 'booking') } } }),
    models.UploadToken.findAll({ where: { id: { [Op.in]: idsOf(events, 'upload-token') } } }),
  ]);
  const setupOf = new Map(
    (await models.Setup.findAll({ where: { id: { [Op.in]: [...bookings, ...tokens].map((record) => record.setupId) } } })).map((setup) => [setup.id, setup.name]),
  );
  for (const user of users) names.set(`user ${user.id}`, user.name);
  for (const setup of setups) names.set(`setup ${setup.id}`, setup.name);
  for (const profile of profiles) names.set(`profile ${profile.id}`, profile.name);
  for (const booking of bookings) names.set(`booking ${booking.id}`, `${setupOf.get(booking.setupId) ?? 'a setup'}, night of ${booking.night}`);
  for (const token of tokens) names.set(`upload-token ${token.id}`, `“${token.name}” of ${setupOf.get(token.setupId) ?? 'a setup'}`);
  return names;
}

/** Audit lines with the actor's name (null: the system) and the name of what they are about (null: named by its id). */
export async function toAuditEventDtos(events: AuditEventRecord[], models: Models): Promise<AuditEventDto[]> {
  const actorIds = [...new Set(events.map((event) => event.actorId).filter((id): id is number => id !== null))];
  const [actors, names] = await Promise.all([models.User.findAll({ where: { id: actorIds } }), targetNames(events, models)]);
  return events.map((event) => ({
    id: event.id,
    actor: actors.find((actor) => actor.id === event.actorId)?.name ?? null,
    action: event.action,
    targetType: event.targetType,
    targetId: event.targetId,
    targetName: names.get(`${event.targetType} ${event.targetId}`) ?? null,
    details: event.details,
    createdAt: event.createdAt.toISOString(),
  }));
}
