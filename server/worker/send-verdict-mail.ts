import type { Sequelize } from 'sequelize';
import type { AuditTrail } from '../audit/audit-trail';
import type { Models } from '../database/models';
import type { Mailer } from '../mail/mailer';
import { composeVerdictMail } from '../mail/verdict-mail';
import { log } from '../system/log';
import type { RunsService } from '../runs/runs.service';
import type { SetupsService } from '../setups/setups.service';

export interface VerdictMailDeps {
  sequelize: Sequelize;
  models: Models;
  runs: RunsService;
  setups: SetupsService;
  mailer: Mailer;
  audit: AuditTrail;
  publicUrl: string;
}

/**
 * One verdict-mail job: mails the shift leads of the run's setup and records the delivery (none for
 * an upload withdrawn while it was analysed: its withdrawal mail said so). A
 * failure is recorded and rethrown, so the queue retries later; a run whose mail went out is never
 * mailed again (the run row is locked while sending, and at most one `sent` delivery may exist).
 */
export async function sendVerdictMail(runId: number, deps: VerdictMailDeps): Promise<void> {
  const { sequelize, models, runs, setups, mailer, audit, publicUrl } = deps;
  // Read before the transaction takes its pooled connection: a lookup inside it on another
  // connection would wait for the pool, and ten mail jobs at once would hold all ten and wait forever.
  const setupId = (await models.Run.findByPk(runId, { attributes: ['setupId'], rejectOnEmpty: true })).setupId;
  const recipients = await setups.verdictRecipients(setupId);
  const failure = await sequelize.transaction(async (transaction) => {
    await models.Run.findByPk(runId, { transaction, lock: transaction.LOCK.UPDATE });
    if (await models.MailDelivery.findOne({ where: { runId, status: 'sent' }, transaction })) return null;
    const run = await runs.get(runId, transaction);
    const skipped = run.withdrawal ? 'the upload was withdrawn before its verdict' : recipients.length === 0 ? 'the setup has no shift leads or recipients' : null;
    if (skipped !== null) {
      await audit.record({ actorId: null, action: 'run.mail-skipped', targetType: 'run', targetId: runId, details: { reason: skipped } }, transaction);
      return null;
    }
    try {
      const messageId = await mailer.send({ ...composeVerdictMail(run, publicUrl, recipients), messageId: `<run-${runId}-verdict@bellkeep>` });
      await models.MailDelivery.create({ runId, recipients, status: 'sent', messageId, error: null }, { transaction });
      await audit.record({ actorId: null, action: 'run.mail-sent', targetType: 'run', targetId: runId, details: { recipients, messageId } }, transaction);
      log.info({ runId, recipients: recipients.length, messageId }, 'verdict mail sent');
      return null;
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      await models.MailDelivery.create({ runId, recipients, status: 'failed', messageId: null, error: message }, { transaction });
      log.warn({ runId, recipients: recipients.length, error: message }, 'verdict mail failed; the queue tries again');
      return error;
    }
  });
  if (failure) throw failure instanceof Error ? failure : new Error('the verdict mail failed');
}
