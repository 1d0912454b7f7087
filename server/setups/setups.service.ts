import { Op, UniqueConstraintError, type Sequelize, type Transaction } from 'sequelize';
import type { ColumnMapping } from '@shared/analysis';
import type { SaveSetupRequest, SetupDto } from '@shared/api';
import type { AuditTrail } from '../audit/audit-trail';
import type { Models } from '../database/models';
import type { SetupRecord } from './setup.model';
import { fieldChanges, type FieldChange } from '../audit/field-changes';
import { HttpError } from '../http/http-error';

export interface SetupsService {
  list(): Promise<SetupDto[]>;
  get(id: number): Promise<SetupDto>;
  create(request: SaveSetupRequest, actorId: number): Promise<SetupDto>;
  update(id: number, request: SaveSetupRequest, actorId: number): Promise<SetupDto>;
  /** Saves (or, with null, forgets) the column mapping the setup's uploads start from; the trail keeps both. */
  saveColumnMapping(id: number, mapping: ColumnMapping | null, actorId: number): Promise<SetupDto>;
  /** Addresses of the verdict mail: the active shift leads of the setup and its extra recipients. */
  verdictRecipients(id: number): Promise<string[]>;
  /** Whether the user is an assigned shift lead of the setup. */
  isShiftLeadOf(setupId: number, userId: number): Promise<boolean>;
}

/** Setups (one two-station experiment each) and the shift leads assigned to them. */
export function createSetupsService(sequelize: Sequelize, models: Models, audit: AuditTrail): SetupsService {
  const { Setup, SetupShiftLead, User, Profile } = models;

  async function list(ids?: number[]): Promise<SetupDto[]> {
    const setups = await Setup.findAll({ where: ids ? { id: ids } : {}, order: [['name', 'ASC']] });
    const leads = await SetupShiftLead.findAll({ where: { setupId: setups.map((setup) => setup.id) } });
    const users = await User.findAll({ where: { id: leads.map((lead) => lead.userId) } });
    const profiles = await Profile.findAll({ where: { id: setups.map((setup) => setup.defaultProfileId) } });
    return setups.map((setup) => ({
      id: setup.id,
      name: setup.name,
      description: setup.description,
      stationALabel: setup.stationALabel,
      stationBLabel: setup.stationBLabel,
      defaultProfileId: setup.defaultProfileId,
      defaultProfileName: profiles.find((profile) => profile.id === setup.defaultProfileId)?.name ?? '',
      shiftLeads: leads
        .filter((lead) => lead.setupId === setup.id)
        .map((lead) => users.find((user) => user.id === lead.userId)!)
        .map((user) => ({ id: user.id, name: user.name, email: user.email }))
        .sort((a, b) => a.name.localeCompare(b.name)),
      extraRecipients: [...setup.extraRecipients],
      fourEyes: setup.fourEyes,
      columnMapping: setup.columnMapping ?? null,
      stationDistanceM: setup.stationDistanceM ?? null,
      clockOffsetNs: setup.clockOffsetNs ?? null,
      clockUncertaintyNs: setup.clockUncertaintyNs ?? null,
      createdAt: setup.createdAt.toISOString(),
    }));
  }

  async function get(id: number): Promise<SetupDto> {
    const [setup] = await list([id]);
    if (!setup) throw HttpError.notFound(`There is no setup with id ${id}.`);
    return setup;
  }

  async function checkReferences(request: SaveSetupRequest): Promise<void> {
    if (!(await Profile.findByPk(request.defaultProfileId))) {
      throw HttpError.badRequest(`There is no acceptance profile with id ${request.defaultProfileId}.`, 'defaultProfileId');
    }
    const ids = [...new Set(request.shiftLeadIds)];
    const leads = await User.findAll({ where: { id: ids, active: true, roles: { [Op.contains]: ['shift-lead'] } } });
    const missing = ids.find((id) => !leads.some((lead) => lead.id === id));
    if (missing !== undefined) {
      throw HttpError.badRequest(`User ${missing} is not an active user with the Shift lead role.`, 'shiftLeadIds');
    }
  }

  /** The changes with the shift leads and the default profile by name, as the trail shows them. */
  async function namedChanges(changes: Record<string, FieldChange>, transaction: Transaction): Promise<Record<string, FieldChange>> {
    const { shiftLeadIds, defaultProfileId, ...named } = changes;
    if (shiftLeadIds) {
      const ids = [...(shiftLeadIds.from as number[]), ...(shiftLeadIds.to as number[])];
      const people = new Map((await User.findAll({ where: { id: ids }, transaction })).map((user) => [user.id, user.name]));
      const namesOf = (list: unknown) => (list as number[]).map((leadId) => people.get(leadId) ?? `user ${leadId}`);
      named.shiftLeads = { from: namesOf(shiftLeadIds.from), to: namesOf(shiftLeadIds.to) };
    }
    if (defaultProfileId) {
      const profiles = new Map(
        (await Profile.findAll({ where: { id: [defaultProfileId.from as number, defaultProfileId.to as number] }, transaction })).map((profile) => [profile.id, profile.name]),
      );
      named.defaultProfile = { from: profiles.get(defaultProfileId.from as number), to: profiles.get(defaultProfileId.to as number) };
    }
    return named;
  }

  async function save(id: number | undefined, request: SaveSetupRequest, actorId: number): Promise<number> {
    await checkReferences(request);
    const fields = {
      name: request.name.trim(),
      description: request.description?.trim() ?? '',
      stationALabel: request.stationALabel.trim(),
      stationBLabel: request.stationBLabel.trim(),
      defaultProfileId: request.defaultProfileId,
      extraRecipients: [...new Set((request.extraRecipients ?? []).map((address) => address.trim().toLowerCase()))],
      // Left out: on for a new setup, unchanged for an existing one.
      ...(request.fourEyes === undefined ? {} : { fourEyes: request.fourEyes }),
      ...(request.stationDistanceM === undefined ? {} : { stationDistanceM: request.stationDistanceM }),
      ...(request.clockOffsetNs === undefined ? {} : { clockOffsetNs: request.clockOffsetNs, clockUncertaintyNs: request.clockUncertaintyNs ?? null }),
    };
    try {
      return await sequelize.transaction(async (transaction) => {
        let setup: SetupRecord;
        let changes = {};
        const shiftLeadIds = [...new Set(request.shiftLeadIds)].sort((a, b) => a - b);
        if (id === undefined) {
          setup = await Setup.create(fields, { transaction });
        } else {
          const existing = await Setup.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
          if (!existing) throw HttpError.notFound(`There is no setup with id ${id}.`);
          const leadsBefore = (await SetupShiftLead.findAll({ where: { setupId: id }, transaction })).map((lead) => lead.userId).sort((a, b) => a - b);
          changes = await namedChanges(fieldChanges({ ...existing.get(), shiftLeadIds: leadsBefore }, { ...fields, shiftLeadIds }), transaction);
          setup = await existing.update(fields, { transaction });
        }
        const setupId = setup.id;
        await SetupShiftLead.destroy({ where: { setupId }, transaction });
        await SetupShiftLead.bulkCreate(
          [...new Set(request.shiftLeadIds)].map((userId) => ({ setupId, userId })),
          { transaction },
        );
        await audit.record(
          {
            actorId,
            action: id === undefined ? 'setup.created' : 'setup.changed',
            targetType: 'setup',
            targetId: setupId,
            details: { ...fields, fourEyes: setup.fourEyes, shiftLeadIds, ...(id === undefined ? {} : { changes }) },
          },
          transaction,
        );
        return setupId;
      });
    } catch (error) {
      if (error instanceof UniqueConstraintError) throw HttpError.conflict(`A setup named ${request.name} already exists.`, 'name');
      throw error;
    }
  }

  return {
    list: () => list(),
    get,
    create: async (request, actorId) => get(await save(undefined, request, actorId)),
    update: async (id, request, actorId) => get(await save(id, request, actorId)),

    async saveColumnMapping(id, columnMapping, actorId) {
      await sequelize.transaction(async (transaction) => {
        const setup = await Setup.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
        if (!setup) throw HttpError.notFound(`There is no setup with id ${id}.`);
        const changes = fieldChanges({ columnMapping: setup.columnMapping ?? null }, { columnMapping });
        await setup.update({ columnMapping }, { transaction });
        await audit.record({ actorId, action: 'setup.changed', targetType: 'setup', targetId: id, details: { name: setup.name, changes } }, transaction);
      });
      return get(id);
    },

    async verdictRecipients(id) {
      const setup = await get(id);
      const leads = await User.findAll({ where: { id: setup.shiftLeads.map((lead) => lead.id), active: true } });
      return [...new Set([...leads.map((lead) => lead.email), ...setup.extraRecipients])];
    },

    async isShiftLeadOf(setupId, userId) {
      return (await SetupShiftLead.count({ where: { setupId, userId } })) > 0;
    },
  };
}
