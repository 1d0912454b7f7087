import type { Sequelize } from 'sequelize';
import type { RunDto } from '@shared/api';
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
 * One verdict-mail job: mails the shift leads of the run's setup (the uploader among them under the
 * four-eyes rule gets a mail of their own, without the sign-off link) and records the delivery (none for
 * an upload withdrawn while it was analysed: its withdrawal mail said so). A
 * failure is recorded and rethrown, so the queue retries later; a run whose mail went out is never
 * mailed again (the run row is locked while sending, and at most one `sent` delivery may exist).
 */
export async function sendVerdictMail(runId: number, deps: VerdictMailDeps): Promise<void> {
  const { sequelize, models, runs, setups, audit } = deps;
  // Read before the transaction takes its pooled connection: a lookup inside it on another
  // connection would wait for the pool, and ten mail jobs at once would hold all ten and wait forever.
  const { setupId, uploadedBy } = await models.Run.findByPk(runId, { attributes: ['setupId', 'uploadedBy'], rejectOnEmpty: true });
  const recipients = await setups.verdictRecipients(setupId);
  const uploaderEmail = uploadedBy === null ? null : ((await models.User.findByPk(uploadedBy, { attributes: ['email'] }))?.email ?? null);
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
      const messageId = await sendToEach(run, recipients, uploaderAmong(run, recipients, uploaderEmail), deps);
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

/**
 * The uploader's address when they are among the recipients and the setup's four-eyes rule forbids
 * them to sign the run off; else null.
 */
function uploaderAmong(run: RunDto, recipients: readonly string[], uploaderEmail: string | null): string | null {
  return run.fourEyes && uploaderEmail !== null && recipients.includes(uploaderEmail) ? uploaderEmail : null;
}

/**
 * Sends the signers' mail, and the uploader's own when `uploader` is set; returns the Message-ID of
 * the first sent. Each mail has a Message-ID of its own that a retry repeats, so a mail client
 * shows a mail sent again by a retry once.
 */
async function sendToEach(run: RunDto, recipients: readonly string[], uploader: string | null, { mailer, publicUrl }: VerdictMailDeps): Promise<string> {
  const signers = recipients.filter((address) => address !== uploader);
  const ids: string[] = [];
  if (signers.length > 0) ids.push(await mailer.send({ ...composeVerdictMail(run, publicUrl, signers), messageId: `<run-${run.id}-verdict@bellkeep>` }));
  if (uploader !== null) ids.push(await mailer.send({ ...composeVerdictMail(run, publicUrl, [uploader], 'uploader'), messageId: `<run-${run.id}-verdict-uploader@bellkeep>` }));
  return ids[0];
}
