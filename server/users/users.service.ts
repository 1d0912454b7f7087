import bcrypt from 'bcryptjs';
import { Op, UniqueConstraintError } from 'sequelize';
import type { CreateUserRequest, UpdateUserRequest, UserDto } from '@shared/api';
import type { AuditTrail } from '../audit/audit-trail';
import { HttpError } from '../http/http-error';
import { fieldChanges } from '../audit/field-changes';
import { toUserDto, type UserModelStatic, type UserRecord } from './user.model';

/** Compared against when the e-mail is unknown, so a miss takes as long as a wrong password. */
const DUMMY_HASH = bcrypt.hashSync('not a real password', 4);

export interface UsersService {
  list(): Promise<UserDto[]>;
  /** `actorId` null: made at start-up, from the configuration. */
  create(request: CreateUserRequest, actorId: number | null): Promise<UserDto>;
  update(id: number, request: UpdateUserRequest, actingUserId: number): Promise<UserDto>;
  findActiveById(id: number): Promise<UserRecord | null>;
  /** The active user with this e-mail and password, or null. */
  authenticate(email: string, password: string): Promise<UserRecord | null>;
  countActiveAdmins(): Promise<number>;
}

export function createUsersService(User: UserModelStatic, bcryptRounds: number, audit: AuditTrail): UsersService {
  const countActiveAdmins = () => User.count({ where: { active: true, roles: { [Op.contains]: ['admin'] } } });

  return {
    async list() {
      const users = await User.findAll({ order: [['name', 'ASC']] });
      return users.map(toUserDto);
    },

    async create(request, actorId) {
      const passwordHash = await bcrypt.hash(request.password, bcryptRounds);
      try {
        const user = await User.sequelize!.transaction(async (transaction) => {
          const created = await User.create(
            { email: request.email.trim().toLowerCase(), name: request.name.trim(), passwordHash, roles: [...new Set(request.roles)] },
            { transaction },
          );
          await audit.record({ actorId, action: 'user.created', targetType: 'user', targetId: created.id, details: { email: created.email, roles: created.roles } }, transaction);
          return created;
        });
        return toUserDto(user);
      } catch (error) {
        if (error instanceof UniqueConstraintError) {
          throw HttpError.conflict(`A user with the e-mail ${request.email} already exists.`, 'email');
        }
        throw error;
      }
    },

    async update(id, request, actingUserId) {
      try {
        return await User.sequelize!.transaction(async (transaction) => {
          const user = await User.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
          if (!user) throw HttpError.notFound(`There is no user with id ${id}.`);
          const losesAdmin = user.roles.includes('admin') && user.active && (request.active === false || (request.roles !== undefined && !request.roles.includes('admin')));
          if (losesAdmin && id === actingUserId) {
            throw HttpError.conflict('You cannot remove your own admin role or deactivate yourself.');
          }
          const before = toUserDto(user);
          if (request.name !== undefined) user.name = request.name.trim();
          if (request.email !== undefined) user.email = request.email.trim().toLowerCase();
          if (request.roles !== undefined) user.roles = [...new Set(request.roles)];
          if (request.active !== undefined) user.active = request.active;
          await user.save({ transaction });
          const changes = fieldChanges(before, toUserDto(user));
          await audit.record({ actorId: actingUserId, action: 'user.changed', targetType: 'user', targetId: id, details: { ...request, changes } }, transaction);
          return toUserDto(user);
        });
      } catch (error) {
        if (error instanceof UniqueConstraintError) {
          throw HttpError.conflict(`A user with the e-mail ${request.email} already exists.`, 'email');
        }
        throw error;
      }
    },

    findActiveById(id) {
      if (!Number.isSafeInteger(id)) return Promise.resolve(null);
      return User.findOne({ where: { id, active: true } });
    },

    async authenticate(email, password) {
      const user = await User.findOne({ where: { email: email.trim().toLowerCase() } });
      const matches = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
      return user && matches && user.active ? user : null;
    },

    countActiveAdmins,
  };
}
