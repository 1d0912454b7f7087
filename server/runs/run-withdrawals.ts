import type { Sequelize, Transaction } from 'sequelize';
import { mayWithdrawUpload, type Role, type WithdrawalDto, type WithdrawRequest } from '@shared/api';
import type { AuditTrail } from '../audit/audit-trail';
import type { Models } from '../database/models';
import { HttpError } from '../http/http-error';

/** Who withdraws: a signed-in person with their roles. */
export interface Withdrawer {
  id: number;
  name: string;
  roles: readonly Role[];
}

/** The withdrawal of a run as the API shows it, or null. */
export async function withdrawalOf(models: Models, runId: number, transaction?: Transaction): Promise<WithdrawalDto | null> {
  const withdrawal = await models.Withdrawal.findByPk(runId, { transaction });
  if (!withdrawal) return null;
  const user = await models.User.findByPk(withdrawal.userId, { transaction, rejectOnEmpty: true });
  return { userId: user.id, userName: user.name, reason: withdrawal.reason, createdAt: withdrawal.createdAt.toISOString() };
}

/**
 * Withdraws a mistaken upload before its sign-off: the run, its archived log and its trail stay;
 * it awaits no sign-off any more and is shown as withdrawn. Refused once signed off or withdrawn.
 */
export function withdrawRun(deps: { sequelize: Sequelize; models: Models; audit: AuditTrail }) {
  const { sequelize, models, audit } = deps;
  return (id: number, { reason }: WithdrawRequest, actor: Withdrawer): Promise<WithdrawalDto> =>
    sequelize.transaction(async (transaction) => {
      const run = await models.Run.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!run) throw HttpError.notFound(`There is no run with id ${id}.`);
      if (!mayWithdrawUpload({ uploadedById: run.uploadedBy }, actor)) {
        throw HttpError.forbidden(`Only the person who uploaded run ${id} or an admin can withdraw it.`);
      }
      if (await models.SignOff.findByPk(id, { transaction })) {
        throw HttpError.conflict(`Run ${id} is signed off already; a signed-off run cannot be withdrawn.`);
      }
      if (await models.Withdrawal.findByPk(id, { transaction })) throw HttpError.conflict(`Run ${id} is withdrawn already.`);
      const withdrawal = await models.Withdrawal.create({ runId: id, userId: actor.id, reason: reason.trim() }, { transaction });
      await audit.record(
        { actorId: actor.id, action: 'run.withdrawn', targetType: 'run', targetId: id, details: { reason: withdrawal.reason, state: run.state, verdict: run.verdict } },
        transaction,
      );
      return { userId: actor.id, userName: actor.name, reason: withdrawal.reason, createdAt: withdrawal.createdAt.toISOString() };
    });
}
