import { ROLE_LABELS, type BookingDto, type RunDto, type UserDto, type WithdrawalDto } from '@shared/api';
import type { Mailer, OutgoingMail } from './mailer';
import { faultLines, oneLine } from '../system/fault-lines';
import { log } from '../system/log';
import { HttpError } from '../http/http-error';
import { stationFilesText } from '../reports/station-words';

/** The mails the API sends itself (the verdict mail is the worker's). */
export interface AppMail {
  /** The account mail of a new user. */
  welcome(user: UserDto, createdBy: string): void;
  /** The booking mail to the setup's shift leads: the night, its profile and the seed commitment. */
  booked(booking: BookingDto, recipients: string[]): void;
  /** The short mail to a run's verdict recipients that its upload was withdrawn and awaits no sign-off. */
  withdrawn(run: RunDto, withdrawal: WithdrawalDto, recipients: string[]): void;
  /** The single-use reset link to its user, sent now: rejects with a 502 when the mail server does not take it. */
  passwordResetLink(user: { name: string; email: string }, secret: string, expiresAt: Date, admin: string): Promise<void>;
  /** Resolves when every mail started so far has been handed over (or has failed and been logged). */
  settled(): Promise<void>;
}

/**
 * Mails sent in the background: a mail server that is down never undoes the account or the
 * booking (the booking's commitment is in the trail and on its page either way).
 */
export function createAppMail(mailer: Mailer, publicUrl: string): AppMail {
  const pending = new Set<Promise<unknown>>();
  const mailFaults = faultLines('Mail');
  const send = (mail: OutgoingMail) => {
    const delivery = mailer
      .send(mail)
      .catch((error: unknown) => {
        mailFaults(error);
        log.warn({ subject: mail.subject, error: oneLine(error) }, 'mail failed');
      })
      .finally(() => pending.delete(delivery));
    pending.add(delivery);
  };
  return {
    welcome(user, createdBy) {
      const roles = user.roles.map((role) => ROLE_LABELS[role]).join(', ');
      send({
        to: user.email,
        subject: 'Your Bellkeep account is ready',
        text: [
          `Hello ${user.name},`,
          '',
          `${createdBy} has made you a Bellkeep account with the roles: ${roles}.`,
          `Sign in at ${publicUrl}/sign-in with this e-mail address; your admin gives you the password.`,
          '',
          'Bellkeep keeps the verdicts of the lab’s Bell-test runs.',
        ].join('\n'),
      });
    },
    booked(booking, recipients) {
      if (recipients.length === 0) return;
      send({
        to: recipients.join(', '),
        subject: `The night of ${booking.night} on ${booking.setupName} is booked`,
        text: [
          `${booking.bookedBy} booked the night of ${booking.night} on ${booking.setupName}.`,
          '',
          `Acquisition window: ${booking.windowStart} to ${booking.windowEnd} (UTC)`,
          `Planned rounds: ${booking.plannedRounds}`,
          `Profile: ${booking.profileName} v${booking.profileVersion}${booking.profileReason ? ` (chosen instead of the setup’s: ${booking.profileReason})` : ''}`,
          '',
          `Seed commitment: ${booking.seedCommitment}`,
          'The seed that will pick the test rounds was drawn now and stays hidden until the log is in;',
          'the run then shows it, and `printf %s <seed> | sha256sum` must print this commitment.',
          '',
          `The booking: ${publicUrl}/setups/${booking.setupId}`,
        ].join('\n'),
      });
    },
    withdrawn(run, withdrawal, recipients) {
      if (recipients.length === 0) return;
      const outcome = run.verdict === null ? `before its analysis ended (${run.state})` : `after its verdict (${run.verdict})`;
      const files = run.stations ? stationFilesText(run.file.originalName, run.stations.stationB.originalName) : run.file.originalName;
      send({
        to: recipients.join(', '),
        subject: `Run ${run.id} of ${run.setupName} was withdrawn as a mistaken upload; it needs no sign-off`,
        text: [
          `${withdrawal.userName} withdrew run ${run.id} of ${run.setupName} (${files}, acquired ${run.acquiredOn ?? 'on an unrecorded date'}) ${outcome}.`,
          '',
          `Why: ${withdrawal.reason}`,
          '',
          'Its log stays in the archive and the run in the trail, marked withdrawn; it no longer awaits a sign-off.',
          run.bookingId === null ? 'The run was unbooked.' : 'Its night stays booked: a new upload of the night becomes its next attempt.',
          '',
          `The run: ${publicUrl}/runs/${run.id}`,
        ].join('\n'),
      });
    },
    async passwordResetLink(user, secret, expiresAt, admin) {
      try {
        await mailer.send({
          to: user.email,
          subject: 'A link to set your Bellkeep password',
          text: [
            `Hello ${user.name},`,
            '',
            `${admin} has asked Bellkeep to let you set a new password. Open this link and choose one:`,
            '',
            `${publicUrl}/reset-password#${secret}`,
            '',
            `The link works once, until ${expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC. Setting the password signs you out everywhere else.`,
            'If you did not expect this mail, tell your admin; your current password stays until the link is used.',
          ].join('\n'),
        });
      } catch (error) {
        mailFaults(error);
        log.warn({ subject: 'password reset link', error: oneLine(error) }, 'mail failed');
        throw new HttpError(502, 'mail-failed', `The mail server did not take the reset link for ${user.email}: ${oneLine(error)}. No link was made; try again.`);
      }
    },
    async settled() {
      await Promise.all([...pending]);
    },
  };
}
