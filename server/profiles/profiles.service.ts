import { QueryTypes, UniqueConstraintError, type Sequelize, type Transaction } from 'sequelize';
import { parseProfile } from '@shared/analysis';
import type { CreateProfileRequest, CreateProfileVersionRequest, ProfileDto, ProfileVersionDto } from '@shared/api';
import type { AuditTrail } from '../audit/audit-trail';
import type { Models } from '../database/models';
import { HttpError } from '../http/http-error';
import type { ProfileVersionRecord } from './profile.model';

export interface ProfilesService {
  list(): Promise<ProfileDto[]>;
  get(id: number): Promise<ProfileDto>;
  create(request: CreateProfileRequest, actorId: number): Promise<ProfileDto>;
  addVersion(profileId: number, request: CreateProfileVersionRequest, actorId: number): Promise<ProfileDto>;
  /** The version to analyse with; 404 naming the id when there is none. */
  findVersion(id: number): Promise<ProfileVersionRecord>;
  latestVersionOf(profileId: number, transaction?: Transaction): Promise<ProfileVersionRecord>;
}

/** Acceptance profiles: every edit writes a new, fixed version; parameters checked by the engine's schema. */
export function createProfilesService(sequelize: Sequelize, models: Models, audit: AuditTrail): ProfilesService {
  const { Profile, ProfileVersion } = models;

  async function list(where = ''): Promise<ProfileDto[]> {
    const rows = await sequelize.query<{
      profile_id: number;
      name: string;
      description: string;
      profile_created_at: Date;
      id: number;
      version: number;
      parameters: Record<string, unknown>;
      note: string;
      created_by_name: string | null;
      created_at: Date;
      used_by_runs: string;
    }>(
      `SELECT p.id AS profile_id, p.name, p.description, p.created_at AS profile_created_at,
              v.id, v.version, v.parameters, v.note, u.name AS created_by_name, v.created_at,
              (SELECT count(*) FROM runs r WHERE r.profile_version_id = v.id) AS used_by_runs
         FROM profiles p JOIN profile_versions v ON v.profile_id = p.id
         LEFT JOIN users u ON u.id = v.created_by
         ${where}
        ORDER BY lower(p.name), v.version DESC`,
      { type: QueryTypes.SELECT },
    );
    const profiles = new Map<number, ProfileDto>();
    for (const row of rows) {
      const version: ProfileVersionDto = {
        id: row.id,
        profileId: row.profile_id,
        version: row.version,
        parameters: row.parameters,
        note: row.note,
        createdBy: row.created_by_name,
        createdAt: row.created_at.toISOString(),
        usedByRuns: Number(row.used_by_runs),
      };
      const profile = profiles.get(row.profile_id);
      if (profile) profile.versions.push(version);
      else {
        profiles.set(row.profile_id, {
          id: row.profile_id,
          name: row.name,
          description: row.description,
          latestVersionId: row.id,
          versions: [version],
          createdAt: row.profile_created_at.toISOString(),
        });
      }
    }
    return [...profiles.values()];
  }

  async function get(id: number): Promise<ProfileDto> {
    const [profile] = await list(`WHERE p.id = ${Number(id)}`);
    if (!profile) throw HttpError.notFound(`There is no acceptance profile with id ${id}.`);
    return profile;
  }

  function checkedParameters(parameters: unknown): Record<string, unknown> {
    const parsed = parseProfile(parameters);
    if (!parsed.ok) throw HttpError.badRequest(parsed.message, `parameters.${parsed.field}`);
    return parsed.profile;
  }

  return {
    list: () => list(),
    get,

    async create(request, actorId) {
      const parameters = checkedParameters(request.parameters);
      try {
        const id = await sequelize.transaction(async (transaction) => {
          const profile = await Profile.create({ name: request.name.trim(), description: request.description?.trim() ?? '' }, { transaction });
          await ProfileVersion.create({ profileId: profile.id, version: 1, parameters, note: request.note ?? '', createdBy: actorId }, { transaction });
          await audit.record({ actorId, action: 'profile.created', targetType: 'profile', targetId: profile.id, details: { name: profile.name, version: 1 } }, transaction);
          return profile.id;
        });
        return get(id);
      } catch (error) {
        if (error instanceof UniqueConstraintError) throw HttpError.conflict(`A profile named ${request.name} already exists.`, 'name');
        throw error;
      }
    },

    async addVersion(profileId, request, actorId) {
      const parameters = checkedParameters(request.parameters);
      await sequelize.transaction(async (transaction) => {
        const profile = await Profile.findByPk(profileId, { transaction, lock: transaction.LOCK.UPDATE });
        if (!profile) throw HttpError.notFound(`There is no acceptance profile with id ${profileId}.`);
        const latest = (await ProfileVersion.max<number, ProfileVersionRecord>('version', { where: { profileId }, transaction })) ?? 0;
        await ProfileVersion.create({ profileId, version: latest + 1, parameters, note: request.note ?? '', createdBy: actorId }, { transaction });
        await audit.record({ actorId, action: 'profile.version-created', targetType: 'profile', targetId: profileId, details: { version: latest + 1 } }, transaction);
      });
      return get(profileId);
    },

    async findVersion(id) {
      const version = await ProfileVersion.findByPk(id);
      if (!version) throw HttpError.notFound(`There is no profile version with id ${id}.`);
      return version;
    },

    async latestVersionOf(profileId, transaction) {
      const version = await ProfileVersion.findOne({ where: { profileId }, order: [['version', 'DESC']], transaction });
      if (!version) throw HttpError.notFound(`There is no acceptance profile with id ${profileId}.`);
      return version;
    },
  };
}
