import { Op, type WhereOptions } from 'sequelize';
import type { AuditActor, AuditEventDto, AuditFilter, AuditPageDto, AuditQuery } from '@shared/api';
import type { Models } from '../database/models';
import type { AuditEventRecord } from './audit-event.model';
import { toAuditEventDtos } from './audit-event-dto';

/** Reads of the whole trail, newest first. */
export function createAuditQueries(models: Models) {
  const where = (filter: AuditFilter): WhereOptions<AuditEventRecord> => {
    const createdAt: Record<symbol, Date> = {};
    if (filter.from) createdAt[Op.gte] = new Date(`${filter.from}T00:00:00Z`);
    if (filter.to) createdAt[Op.lt] = new Date(new Date(`${filter.to}T00:00:00Z`).getTime() + 86_400_000);
    return {
      ...(filter.actorId !== undefined && { actorId: filter.actorId }),
      ...(filter.action !== undefined && { action: filter.action.endsWith('.') ? { [Op.startsWith]: filter.action } : filter.action }),
      ...(filter.targetType !== undefined && { targetType: filter.targetType }),
      ...(filter.targetId !== undefined && { targetId: filter.targetId }),
      ...(Object.getOwnPropertySymbols(createdAt).length > 0 && { createdAt }),
    };
  };
  const order: [string, string][] = [['id', 'DESC']];

  return {
    async page(filter: AuditQuery): Promise<AuditPageDto> {
      const { rows, count } = await models.AuditEvent.findAndCountAll({ where: where(filter), order, limit: filter.pageSize, offset: filter.page * filter.pageSize });
      return { items: await toAuditEventDtos(rows, models), total: count, page: filter.page, pageSize: filter.pageSize };
    },

    async all(filter: AuditFilter): Promise<AuditEventDto[]> {
      return toAuditEventDtos(await models.AuditEvent.findAll({ where: where(filter), order }), models);
    },

    async actors(): Promise<AuditActor[]> {
      const ids = (await models.AuditEvent.findAll({ attributes: ['actorId'], group: ['actorId'], where: { actorId: { [Op.ne]: null } } })).map((event) => event.actorId!);
      const people = await models.User.findAll({ where: { id: ids }, order: [['name', 'ASC']] });
      return people.map((person) => ({ id: person.id, name: person.name }));
    },
  };
}
