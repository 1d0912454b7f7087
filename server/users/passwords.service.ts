import crypto from 'node:crypto';
import bcrypt from 'bcryptjs';
import { Op, type Sequelize } from 'sequelize';
import { RESET_LINK_HOURS, type PasswordResetLinkDto } from '@shared/api';
import type { AuditTrail } from '../audit/audit-trail';
import type { Models } from '../database/models';
import { HttpError } from '../http/http-error';
import type { UserRecord } from './user.model';

export interface PasswordsService {
  /** The signed-in user's own change: the current password must match; every other session ends. */
  change(user: UserRecord, currentPassword: string, newPassword: string): Promise<UserRecord>;
  /**
   * An admin's reset: a single-use link to the user's address, valid RESET_LINK_HOURS; an earlier
   * unused link stops working. `send` mails it; if the mail server refuses, no link exists.
   */
  mailResetLink(userId: number, admin: { id: number; name: string }, send: (user: UserRecord, secret: string, expiresAt: Date) => Promise<void>): Promise<PasswordResetLinkDto>;
  /** Sets the password of the link's user, once, before the link expires; every session of that user ends. */
  reset(secret: string, newPassword: string): Promise<void>;
}

const sha256 = (text: string) => crypto.createHash('sha256').update(text).digest('hex');

/** Own password changes, and reset links an admin mails. Only a secret's SHA-256 is stored. */
export function createPasswordsService(sequelize: Sequelize, models: Models, bcryptRounds: number, audit: AuditTrail): PasswordsService {
  const { User, PasswordReset } = models;

  return {
    async change(user, currentPassword, newPassword) {
      if (!(await bcrypt.compare(currentPassword, user.passwordHash))) throw HttpError.badRequest('The current password is not right.', 'currentPassword');
      if (currentPassword === newPassword) throw HttpError.badRequest('The new password is the current one: choose another.', 'newPassword');
      const passwordHash = await bcrypt.hash(newPassword, bcryptRounds);
      return sequelize.transaction(async (transaction) => {
        const changed = await user.update({ passwordHash, passwordVersion: user.passwordVersion + 1 }, { transaction });
        await audit.record({ actorId: user.id, action: 'user.password-changed', targetType: 'user', targetId: user.id, details: {} }, transaction);
        return changed;
      });
    },

    async mailResetLink(userId, admin, send) {
      const user = await User.findByPk(userId);
      if (!user) throw HttpError.notFound(`There is no user with id ${userId}.`);
      if (!user.active) throw HttpError.conflict(`${user.name} is deactivated: reactivate the account before sending a reset link.`);
      const secret = crypto.randomBytes(32).toString('hex');
      const expiresAt = new Date(Date.now() + RESET_LINK_HOURS * 3600_000);
      await sequelize.transaction(async (transaction) => {
        await PasswordReset.update({ usedAt: new Date() }, { where: { userId, usedAt: null }, transaction });
        await PasswordReset.create({ userId, secretSha256: sha256(secret), requestedBy: admin.id, expiresAt, usedAt: null }, { transaction });
        await audit.record(
          { actorId: admin.id, action: 'user.password-reset-link-sent', targetType: 'user', targetId: userId, details: { email: user.email, expiresAt: expiresAt.toISOString() } },
          transaction,
        );
        // Inside the transaction: a mail the server refuses leaves no link behind.
        await send(user, secret, expiresAt);
      });
      return { sentTo: user.email, expiresAt: expiresAt.toISOString() };
    },

    async reset(secret, newPassword) {
      const passwordHash = await bcrypt.hash(newPassword, bcryptRounds);
      await sequelize.transaction(async (transaction) => {
        const link = await PasswordReset.findOne({ where: { secretSha256: sha256(secret) }, transaction, lock: transaction.LOCK.UPDATE });
        if (!link || link.usedAt !== null || link.expiresAt.getTime() <= Date.now()) {
          throw HttpError.badRequest('This reset link is used, replaced by a newer one, or expired: ask an admin for a new one.', 'secret');
        }
        const user = await User.findOne({ where: { id: link.userId, active: true }, transaction, lock: transaction.LOCK.UPDATE });
        if (!user) throw HttpError.badRequest('This reset link belongs to a deactivated account.', 'secret');
        await link.update({ usedAt: new Date() }, { transaction });
        await user.update({ passwordHash, passwordVersion: user.passwordVersion + 1 }, { transaction });
        await PasswordReset.update({ usedAt: new Date() }, { where: { userId: user.id, usedAt: null, id: { [Op.ne]: link.id } }, transaction });
        await audit.record({ actorId: user.id, action: 'user.password-reset', targetType: 'user', targetId: user.id, details: {} }, transaction);
      });
    },
  };
}
